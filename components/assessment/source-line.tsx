import { AppText } from '@/components/ui/app-text';

interface SourceLineProps {
  /** Where a computed number comes from: the formula, the standard and its edition, or a lab rule. */
  children: string;
  testID?: string;
}

/** The small "source" line under every computed number. */
export function SourceLine({ children, testID }: SourceLineProps) {
  return (
    <AppText variant="small" tone="muted" testID={testID}>
      {`Source: ${children}`}
    </AppText>
  );
}
