import type { ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';

import { borders, iconSizes, radii, spacing } from '@/components/theme/tokens';
import { useTheme } from '@/components/theme/use-theme';
import { AppText } from '@/components/ui/app-text';
import { Icon } from '@/components/ui/icon';
import type { RuleFailure } from '@/shared/errors';

/** The gear rules in the order a member fixes them, each summed up in a few words when it holds. */
const LINES: { rule: string; rules: readonly string[]; name: string; holds: string }[] = [
  { rule: 'rating', rules: ['rating'], name: 'Ratings', holds: 'every item rated for the plan with the lab margin' },
  {
    rule: 'companions',
    rules: ['grounding-stick', 'isolation-stand', 'interlock'],
    name: 'Companions',
    holds: 'grounding stick, stand and any interlock needed are in the set',
  },
  { rule: 'polarity', rules: ['polarity'], name: 'Polarity', holds: 'a source in the set produces the planned polarity' },
  { rule: 'inspection', rules: ['inspection'], name: 'Inspections', holds: 'every item has a current inspection' },
  { rule: 'in-service', rules: ['in-service'], name: 'In service', holds: 'no item is tagged out or retired' },
  { rule: 'clash', rules: ['clash'], name: 'Free', holds: 'no other booking holds this gear in the window' },
];

interface GateSummaryProps {
  /** gearFailures (shared/rules/release.ts) for the set, or the release check's failures. */
  failures: readonly RuleFailure[];
  /** Whether clashes were checked (a window is set): otherwise the "Free" line is left out. */
  clashesChecked: boolean;
  testID: string;
  /** Something to do about one failure, shown under it (the booking form's "Add a suitable one"). */
  actionFor?: (failure: RuleFailure) => ReactNode;
}

/**
 * One line per gear rule, pass or fail, as word + icon + colour, above the long assessment: what
 * the gate will refuse on, before anyone asks for the gear. A failing line says what is wrong.
 */
export function GateSummary({ failures, clashesChecked, testID, actionFor }: GateSummaryProps) {
  const { colors } = useTheme();
  const failing = LINES.filter((line) => failures.some((f) => line.rules.includes(f.rule))).length;
  return (
    <View testID={testID} style={styles.root}>
      <AppText variant="bodyStrong" testID={`${testID}-verdict`}>
        {failing === 0
          ? 'The gear passes every rule it can be checked on now.'
          : `The release will refuse this set: ${failing} gear rule${failing === 1 ? '' : 's'} failing. Fix ${failing === 1 ? 'it' : 'them'} first.`}
      </AppText>
      {LINES.filter((line) => line.rule !== 'clash' || clashesChecked).map((line) => {
        const own = failures.filter((f) => line.rules.includes(f.rule));
        const ok = own.length === 0;
        return (
          <View
            key={line.rule}
            testID={`${testID}-${line.rule}-${ok ? 'pass' : 'fail'}`}
            style={[
              styles.line,
              { borderLeftColor: ok ? colors.state.ok.edge : colors.state.late.edge, backgroundColor: ok ? colors.surface : colors.state.late.fill },
            ]}
          >
            <Icon name={ok ? 'check-circle' : 'close-circle'} size={iconSizes.md} color={ok ? colors.state.ok.edge : colors.state.late.text} />
            <View style={styles.text}>
              <AppText variant="smallStrong">{`${line.name}: ${ok ? 'pass' : 'fail'}`}</AppText>
              {ok ? (
                <AppText variant="small" tone="muted">
                  {line.holds}
                </AppText>
              ) : (
                own.map((f, index) => (
                  <View key={index} style={styles.text}>
                    <AppText variant="small">{f.message}</AppText>
                    {actionFor?.(f)}
                  </View>
                ))
              )}
            </View>
          </View>
        );
      })}
    </View>
  );
}

const styles = StyleSheet.create({
  root: { gap: spacing.xs },
  line: {
    flexDirection: 'row',
    alignItems: 'flex-start',
    gap: spacing.sm,
    paddingVertical: spacing.xxs,
    paddingHorizontal: spacing.sm,
    borderLeftWidth: borders.focusRing,
    borderRadius: radii.sm,
  },
  text: { flex: 1, gap: spacing.xxs },
});
