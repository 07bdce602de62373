import { StyleSheet, View } from 'react-native';

import { spacing } from '@/components/theme/tokens';
import { AppText } from '@/components/ui/app-text';
import type { Assessment } from '@/shared/schemas/assessment';

import { ApprovalReasons } from './approval-reasons';
import { barrierDistance } from './boundaries-facts';
import { HazardSummary } from './hazard-summary';
import { formatKv, formatMetres, formatSeconds, formatSi } from './quantities';
import { SourceLine } from './source-line';

/** The few numbers an officer weighs first, for a queue where the full panel would be too long. */
export function AssessmentSummary({ assessment, testID }: { assessment: Assessment; testID: string }) {
  const barrier = assessment.boundaries ? barrierDistance(assessment.boundaries) : null;
  const problems = assessment.items.filter((i) => !i.ratingOk || !i.inService || !i.inspectionCurrent).length + assessment.missingCompanions.length;
  return (
    <View style={styles.root} testID={testID}>
      <HazardSummary assessment={assessment} testID={`${testID}-hazard`} />
      <AppText>{`Planned ${formatKv(assessment.plannedKv)} (sources up to ${formatKv(assessment.sourcePeakKv)}) · stored energy ${formatSi(assessment.storedEnergyJ, 'J')}`}</AppText>
      <AppText>{assessment.bleedDown ? `Bleed-down ${formatSeconds(assessment.bleedDown.timeS)}` : assessment.bleedDownNote}</AppText>
      {barrier ? <AppText>{`Barrier at ${formatMetres(barrier.metres, barrier.printed)}`}</AppText> : null}
      <AppText variant="bodyStrong">
        {problems === 0 ? 'Gear rated and complete for the plan.' : `${problems} gear problem${problems === 1 ? '' : 's'} the release will refuse.`}
      </AppText>
      <SourceLine>the assessment stored with the booking; the booking page shows each formula and standard</SourceLine>
      <ApprovalReasons assessment={assessment} testID={`${testID}-approval`} />
    </View>
  );
}

const styles = StyleSheet.create({
  root: { gap: spacing.xs },
});
