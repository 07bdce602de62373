import type { ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';

import { AssessmentPanel } from '@/components/assessment/assessment-panel';
import { SafetyCaution } from '@/components/assessment/safety-caution';
import { spacing } from '@/components/theme/tokens';
import { AppText } from '@/components/ui/app-text';
import { Card } from '@/components/ui/card';
import { describeError } from '@/components/ui/error-state';
import { LoadingState } from '@/components/ui/loading-state';
import { isApiError } from '@/hooks/api-client';
import type { LiveAssessment } from '@/hooks/use-assessment';

/** The live preview as the member types; the server's stored assessment follows on the booking. */
export function LiveAssessmentView({ live, afterSummary }: { live: LiveAssessment; afterSummary?: ReactNode }) {
  // The form shows the gear's pass/fail lines (clashes included) right above its button.
  if (live.state === 'ready') {
    return (
      <View style={styles.root} testID="live-assessment">
        <AssessmentPanel
          assessment={live.assessment}
          testID="live-assessment-panel"
          afterSummary={afterSummary}
          gateSummary={false}
          provenance={
            live.stale
              ? 'Updating as you type…'
              : 'Live preview, worked out on this device from the gear ratings, the lab rules and your qualification. The server checks it again when you book; its answer is the record.'
          }
        />
      </View>
    );
  }
  return (
    <View style={styles.root} testID="live-assessment">
      <Card title="Setup assessment">
        {live.state === 'loading' ? (
          <LoadingState label="Working out the assessment" />
        ) : live.state === 'error' ? (
          <AppText
            tone="error"
            testID="live-assessment-error"
          >{`The assessment could not be worked out: ${live.error instanceof Error && !isApiError(live.error) ? live.error.message : describeError(live.error)}`}</AppText>
        ) : (
          <AppText tone="muted" testID="live-assessment-waiting">
            {live.reason}
          </AppText>
        )}
      </Card>
      <SafetyCaution />
      {afterSummary}
    </View>
  );
}

const styles = StyleSheet.create({
  root: { gap: spacing.md },
});
