import { useState } from 'react';
import { Image, Pressable, StyleSheet, View } from 'react-native';

import { formatDateTime } from '@/components/common/format';
import { borders, iconSizes, radii, spacing } from '@/components/theme/tokens';
import { useTheme } from '@/components/theme/use-theme';
import { AppText } from '@/components/ui/app-text';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { ErrorState } from '@/components/ui/error-state';
import { Icon } from '@/components/ui/icon';
import { webLinkProps } from '@/components/ui/web-link';
import { bookingPhotoUrl } from '@/hooks/use-booking-photos';
import { useChecklistRunsQuery, type ChecklistRunRecord } from '@/hooks/use-bookings';
import type { ChecklistAnswerRecord } from '@/shared/schemas/bookings';

import { describeAnswer } from './answer-words';

const PHASE_TITLES = { pre: 'Pre-energize checklist', return: 'Make-safe checklist' } as const;

/**
 * The checklists completed for a booking, as they were answered at the counter: the latest run of
 * each phase open, earlier ones (answered again, or for an earlier plan) behind a button. This is
 * what an officer reviews after a test, photos included.
 */
export function ChecklistRecord({ bookingId }: { bookingId: number }) {
  const runs = useChecklistRunsQuery(bookingId);
  const [showEarlier, setShowEarlier] = useState(false);
  if (runs.isError)
    return <ErrorState title="The completed checklists did not load" error={runs.error} onRetry={() => void runs.refetch()} retrying={runs.isFetching} />;
  // Most bookings have none until the counter: no section, and no spinner for one.
  if (runs.isPending || runs.data.length === 0) return null;

  const latest = (['pre', 'return'] as const).flatMap((phase) => runs.data.find((r) => r.phase === phase) ?? []);
  const earlier = runs.data.filter((r) => !latest.includes(r));
  return (
    <Card title="Checklists as answered" testID="booking-checklist-runs">
      {latest.map((run) => (
        <RunRecord key={run.id} run={run} />
      ))}
      {earlier.length > 0 ? (
        <Button
          label={showEarlier ? 'Hide earlier answers' : `Show ${earlier.length} earlier ${earlier.length === 1 ? 'answer' : 'answers'}`}
          icon={showEarlier ? 'chevron-up' : 'chevron-down'}
          variant="secondary"
          onPress={() => setShowEarlier((shown) => !shown)}
          testID="booking-checklist-runs-earlier"
        />
      ) : null}
      {showEarlier ? earlier.map((run) => <RunRecord key={run.id} run={run} />) : null}
    </Card>
  );
}

function RunRecord({ run }: { run: ChecklistRunRecord }) {
  const { colors } = useTheme();
  return (
    <View style={[styles.run, { borderColor: colors.border }]} testID={`checklist-run-${run.id}`}>
      <View style={styles.runHeading}>
        <AppText variant="bodyStrong">{PHASE_TITLES[run.phase]}</AppText>
        <AppText variant="small" tone="muted">{`${formatDateTime(run.completedAt)} · ${run.completedByName} · plan version ${run.planVersion}`}</AppText>
        <View style={styles.badges}>
          {run.withinLimits ? <Badge label="Readings within limits" icon="check-circle" /> : null}
          {run.current ? null : <Badge label="For an earlier plan" tone="muted" testID={`checklist-run-${run.id}-earlier-plan`} />}
        </View>
        {run.withinLimits ? null : (
          <AppText variant="smallStrong" tone="error" testID={`checklist-run-${run.id}-outside`}>
            A reading was outside its limits.
          </AppText>
        )}
      </View>
      {run.answers.map((answer) => (
        <AnswerLine key={answer.id} answer={answer} testID={`checklist-run-${run.id}-line-${answer.id}`} />
      ))}
    </View>
  );
}

function AnswerLine({ answer, testID }: { answer: ChecklistAnswerRecord; testID: string }) {
  const { colors } = useTheme();
  const answered = answer.confirmed === true || answer.value !== undefined || answer.fileId !== undefined;
  return (
    <View style={styles.line} testID={testID}>
      <Icon
        name={!answered ? 'checkbox-blank-outline' : answer.withinLimits ? 'check-circle' : 'alert-circle'}
        size={iconSizes.sm}
        color={answer.withinLimits ? colors.textMuted : colors.errorText}
      />
      <View style={styles.lineText}>
        <AppText variant="small">{answer.text}</AppText>
        <AppText variant="smallStrong" tone={answer.withinLimits ? 'default' : 'error'} testID={`${testID}-answer`}>
          {describeAnswer(answer)}
        </AppText>
        {answer.fileId !== undefined ? (
          <Pressable
            accessibilityRole="link"
            accessibilityLabel={`Open the photo: ${answer.text}`}
            {...webLinkProps(bookingPhotoUrl(answer.fileId), { newTab: true })}
            testID={`${testID}-photo`}
          >
            <Image
              source={{ uri: bookingPhotoUrl(answer.fileId) }}
              style={[styles.photo, { backgroundColor: colors.surfaceMuted, borderColor: colors.border }]}
              resizeMode="cover"
            />
          </Pressable>
        ) : null}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  run: { gap: spacing.sm, borderTopWidth: borders.hairline, paddingTop: spacing.sm },
  runHeading: { gap: spacing.xxs },
  badges: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.xs },
  line: { flexDirection: 'row', gap: spacing.sm, alignItems: 'flex-start' },
  lineText: { flex: 1, gap: spacing.xxs },
  photo: { width: 120, height: 90, borderRadius: radii.md, borderWidth: borders.hairline },
});
