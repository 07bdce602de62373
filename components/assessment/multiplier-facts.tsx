import { StyleSheet, View } from 'react-native';

import { spacing } from '@/components/theme/tokens';
import { AppText } from '@/components/ui/app-text';
import { HazardBadge } from '@/components/ui/hazard-badge';
import type { Assessment } from '@/shared/schemas/assessment';

import { formatSi } from './quantities';
import { SourceLine } from './source-line';

/** Each multiplier stack's output at the planned current: what the member will really get. */
export function MultiplierFacts({ assessment, testID = 'assessment-multipliers' }: { assessment: Assessment; testID?: string }) {
  if (assessment.multipliers.length === 0) return null;
  return (
    <View style={styles.root} testID={testID}>
      {assessment.multipliers.map((m) => (
        <View key={m.itemId} style={styles.stack} testID={`${testID}-${m.itemId}`}>
          <AppText variant="bodyStrong">{`${m.tag}: ${m.stages} stages`}</AppText>
          <AppText>{`Drive needed: ${formatSi(m.drivePeakInputV, 'V')} peak`}</AppText>
          <AppText>{`No load: ${formatSi(m.noLoadV, 'V')} · under load: ${formatSi(m.loadedV, 'V')}`}</AppText>
          <AppText>{`Drop: ${formatSi(m.dropV, 'V')} · ripple: ${formatSi(m.rippleV, 'V')} peak to peak`}</AppText>
          {m.optimumStages !== null ? (
            <AppText variant="small">{`Most voltage at this current with about ${Math.round(m.optimumStages)} stages.`}</AppText>
          ) : null}
          {m.overRating ? <HazardBadge level="warning" detail="Drive above the stack's input rating" /> : null}
        </View>
      ))}
      <SourceLine>
        {"cascade multiplier formulas (Kuffel, Zaengl & Kuffel, High Voltage Engineering: Fundamentals, 2nd ed.) at the plan's maximum current"}
      </SourceLine>
    </View>
  );
}

const styles = StyleSheet.create({
  root: { gap: spacing.sm },
  stack: { gap: spacing.xxs },
});
