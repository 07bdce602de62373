import { StyleSheet, View } from 'react-native';

import { spacing } from '@/components/theme/tokens';
import { AppText } from '@/components/ui/app-text';

import { SourceLine } from './source-line';

interface FactProps {
  label: string;
  /** Always with its unit. */
  value: string;
  /** A plain-words reading of the value, when the number alone says little. */
  note?: string;
  source?: string;
  testID?: string;
}

/** One computed number: what it is, the number with its unit, and where it comes from. */
export function Fact({ label, value, note, source, testID }: FactProps) {
  return (
    <View style={styles.fact} testID={testID}>
      <AppText variant="small" tone="muted">
        {label}
      </AppText>
      <AppText variant="heading" testID={testID ? `${testID}-value` : undefined}>
        {value}
      </AppText>
      {note ? <AppText variant="small">{note}</AppText> : null}
      {source ? <SourceLine>{source}</SourceLine> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  fact: { gap: spacing.xxs },
});
