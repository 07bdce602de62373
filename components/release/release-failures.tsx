import { StyleSheet, View } from 'react-native';

import { borders, radii, spacing } from '@/components/theme/tokens';
import { useTheme } from '@/components/theme/use-theme';
import { AppText } from '@/components/ui/app-text';
import { Icon } from '@/components/ui/icon';
import type { RuleFailure } from '@/shared/errors';

interface ReleaseFailuresProps {
  title: string;
  failures: RuleFailure[];
  testID: string;
}

/** Every rule the gate refused on, each with its own message, so the member knows what to fix. A refusal is an error to fix, not a hazard, so it takes the error style. */
export function ReleaseFailures({ title, failures, testID }: ReleaseFailuresProps) {
  const { colors } = useTheme();
  return (
    <View testID={testID} accessibilityRole="alert" style={[styles.box, { borderColor: colors.errorText, backgroundColor: colors.surface }]}>
      <View style={styles.head}>
        <Icon name="alert-circle" color={colors.errorText} />
        <AppText variant="bodyStrong" style={styles.title}>
          {title}
        </AppText>
      </View>
      {failures.map((failure, index) => (
        <View key={`${failure.rule}-${index}`} style={styles.failure} testID={`${testID}-${failure.rule}`}>
          <AppText variant="smallStrong" tone="muted">
            {ruleNames[failure.rule] ?? failure.rule}
          </AppText>
          <AppText>{failure.message}</AppText>
        </View>
      ))}
    </View>
  );
}

const ruleNames: Record<string, string> = {
  status: 'Booking state',
  booker: 'Booker’s account',
  approval: 'Officer approval',
  clash: 'Gear held elsewhere',
  window: 'Booking window',
  scanned: 'Scanning',
  'in-service': 'Gear in service',
  inspection: 'Inspections',
  rating: 'Ratings',
  'grounding-stick': 'Grounding stick',
  'isolation-stand': 'Isolation stand',
  interlock: 'Interlock',
  polarity: 'Polarity',
  checklist: 'Pre-energize checklist',
  qualification: 'Qualification',
  'make-safe-checklist': 'Make-safe checklist',
};

const styles = StyleSheet.create({
  box: { gap: spacing.sm, padding: spacing.md, borderWidth: borders.control, borderLeftWidth: spacing.xs, borderRadius: radii.md },
  head: { flexDirection: 'row', alignItems: 'flex-start', gap: spacing.sm },
  title: { flex: 1 },
  failure: { gap: spacing.xxs },
});
