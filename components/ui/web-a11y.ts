// ARIA attributes that react-native-web renders but React Native's prop types do not list yet.
// Spread the result onto a View, Text or TextInput; native platforms ignore unknown props.
interface WebA11y {
  invalid?: boolean;
  describedBy?: string;
  headingLevel?: 1 | 2 | 3;
  current?: 'page';
}

export function webA11y({ invalid, describedBy, headingLevel, current }: WebA11y): object {
  const props: Record<string, unknown> = {};
  if (invalid !== undefined) props['aria-invalid'] = invalid;
  if (describedBy !== undefined) props['aria-describedby'] = describedBy;
  if (headingLevel !== undefined) {
    props.role = 'heading';
    props['aria-level'] = headingLevel;
  }
  if (current !== undefined) props['aria-current'] = current;
  return props;
}
