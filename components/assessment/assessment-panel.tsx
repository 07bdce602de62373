import type { ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';

import { spacing } from '@/components/theme/tokens';
import { AppText } from '@/components/ui/app-text';
import { Card } from '@/components/ui/card';
import type { Assessment } from '@/shared/schemas/assessment';
import { gearFailures } from '@/shared/rules/release';

import { ApprovalReasons } from './approval-reasons';
import { BoundariesFacts } from './boundaries-facts';
import { CompanionsList } from './companions-list';
import { EnergyFacts } from './energy-facts';
import { GateSummary } from './gate-summary';
import { HazardSummary } from './hazard-summary';
import { MultiplierFacts } from './multiplier-facts';
import { formatKv } from './quantities';
import { RatingRows } from './rating-rows';
import { SafetyCaution } from './safety-caution';

interface AssessmentPanelProps {
  assessment: Assessment;
  /** Says whose numbers these are: the live preview or the record stored with the booking. */
  provenance: string;
  testID: string;
  /** Placed after the decisive part (hazard, approval, cautions), before the detail: a form's submit. */
  afterSummary?: ReactNode;
  /** The pass/fail lines at the top; the booking form shows its own (with clashes) by its button instead. */
  gateSummary?: ReactNode | false;
}

/** The whole setup assessment, most decisive first: hazard and approval, cautions, then the detail. */
export function AssessmentPanel({ assessment, provenance, testID, afterSummary, gateSummary }: AssessmentPanelProps) {
  return (
    <View style={styles.root} testID={testID}>
      <Card title="Setup assessment">
        <AppText variant="small" tone="muted" testID={`${testID}-provenance`}>
          {provenance}
        </AppText>
        <AppText variant="bodyStrong">{`Planned ${formatKv(assessment.plannedKv)}; the sources can reach ${formatKv(assessment.sourcePeakKv)}.`}</AppText>
        {gateSummary === undefined ? (
          <GateSummary failures={gearFailures(assessment, [])} clashesChecked={false} testID={`${testID}-gate`} />
        ) : (
          gateSummary || null
        )}
        <HazardSummary assessment={assessment} testID={`${testID}-hazard`} />
        <ApprovalReasons assessment={assessment} testID={`${testID}-approval`} />
      </Card>
      <SafetyCaution cautions={assessment.cautions} testID={`${testID}-caution`} />
      {afterSummary}
      <Card title="Gear ratings">
        <RatingRows assessment={assessment} testID={`${testID}-ratings`} />
        <CompanionsList assessment={assessment} testID={`${testID}-companions`} />
      </Card>
      <Card title="Energy and bleed-down">
        <EnergyFacts assessment={assessment} testID={`${testID}-energy`} />
      </Card>
      <Card title="Approach boundaries">
        <BoundariesFacts assessment={assessment} testID={`${testID}-boundaries`} />
      </Card>
      {assessment.multipliers.length > 0 ? (
        <Card title="Multiplier output under load">
          <MultiplierFacts assessment={assessment} testID={`${testID}-multipliers`} />
        </Card>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  root: { gap: spacing.md },
});
