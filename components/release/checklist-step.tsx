import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { Controller, useForm } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';

import { formatDateTime } from '@/components/common/format';
import { spacing } from '@/components/theme/tokens';
import { AppText } from '@/components/ui/app-text';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { describeError } from '@/components/ui/error-state';
import { FormAlert } from '@/components/ui/form-alert';
import { HazardBadge } from '@/components/ui/hazard-badge';
import { useChecklistMutation, type Booking } from '@/hooks/use-bookings';
import { checklistSubmitSchema, type ChecklistSubmitInput } from '@/shared/schemas/bookings';

import { blankAnswers, ChecklistFields, serverLineErrors, withoutLine } from './checklist-fields';
import { StepCard, type StepState } from './step-card';

/** Step 2: the pre-energize checklist for this plan, recorded with every answer. */
export function ChecklistStep({ booking, state }: { booking: Booking; state: StepState }) {
  const run = booking.checklistRuns.pre;
  const [answering, setAnswering] = useState(run === null);
  return (
    <StepCard number={2} title="Pre-energize checklist" state={state} testID="release-step-checklist">
      {run && !answering ? (
        <View style={styles.done} testID="release-checklist-done">
          {run.withinLimits && run.complete ? (
            <Badge label="Recorded, readings within limits" icon="check-circle" tone="primary" />
          ) : (
            <View style={styles.done} testID="release-checklist-outside">
              <HazardBadge
                level="warning"
                detail={
                  run.withinLimits ? 'The recorded checklist does not count: answer it again' : 'A reading is outside its limits: answer the checklist again'
                }
              />
              {/* Each line that stops the run, with its reading and limits (shared/rules/checklist-coverage.ts). */}
              {run.gaps.map((gap, index) => (
                <AppText key={index} variant="bodyStrong" testID={`release-checklist-gap-${index}`}>
                  {gap}
                </AppText>
              ))}
            </View>
          )}
          <AppText variant="small" tone="muted">{`Recorded ${formatDateTime(run.completedAt)}`}</AppText>
          <Button
            label="Answer again"
            icon="refresh"
            variant={run.withinLimits && run.complete ? 'secondary' : 'primary'}
            testID="release-checklist-again"
            onPress={() => setAnswering(true)}
          />
        </View>
      ) : (
        <ChecklistForm booking={booking} primary={state === 'current'} onDone={() => setAnswering(false)} />
      )}
    </StepCard>
  );
}

function ChecklistForm({ booking, primary, onDone }: { booking: Booking; primary: boolean; onDone: () => void }) {
  const entries = booking.checklist.pre;
  const submit = useChecklistMutation(booking.id);
  const [lineErrors, setLineErrors] = useState<Record<number, string>>({});
  const {
    control,
    handleSubmit,
    setError,
    clearErrors,
    formState: { errors, isSubmitting },
  } = useForm<ChecklistSubmitInput>({
    resolver: zodResolver(checklistSubmitSchema),
    defaultValues: { phase: 'pre', answers: blankAnswers(entries) },
  });

  const onSubmit = handleSubmit(async (input) => {
    setLineErrors({});
    try {
      // Lines left blank are sent without a value: the server names each one still missing.
      await submit.mutateAsync({ phase: 'pre', answers: input.answers.map(({ itemId, confirmed, value, fileId }) => ({ itemId, confirmed, value, fileId })) });
      onDone();
    } catch (error) {
      const lines = serverLineErrors(error);
      setLineErrors(lines);
      if (Object.keys(lines).length === 0) setError('root.server', { type: 'server', message: describeError(error) });
      else setError('root.server', { type: 'server', message: 'Some lines are not done yet: see each line marked above.' });
    }
  });

  // Once every line the server named is answered again, its "not done yet" summary goes too.
  const onLineAnswered = (lineId: number) => {
    const remaining = withoutLine(lineErrors, lineId);
    if (remaining === lineErrors) return;
    setLineErrors(remaining);
    if (Object.keys(remaining).length === 0) clearErrors('root.server');
  };

  // The form's own errors (a reading that is not a number) land on the line they belong to.
  const formLineErrors: Record<number, string | undefined> = { ...lineErrors };
  entries.forEach((entry, index) => {
    const message = errors.answers?.[index]?.value?.message;
    if (message) formLineErrors[entry.id] = /expected number/i.test(message) ? 'Enter the reading as a number' : message;
  });

  return (
    <View style={styles.form}>
      {entries.length === 0 ? <AppText>No pre-energize checklist line applies to this plan. Record it empty to go on.</AppText> : null}
      <Controller
        control={control}
        name="answers"
        render={({ field }) => (
          <ChecklistFields
            bookingId={booking.id}
            entries={entries}
            value={field.value}
            onChange={field.onChange}
            lineErrors={formLineErrors}
            onLineAnswered={onLineAnswered}
            testID="checklist-pre"
          />
        )}
      />
      {errors.root?.server?.message ? <FormAlert message={errors.root.server.message} testID="release-checklist-error" /> : null}
      <Button
        label="Record the checklist"
        icon="clipboard-check"
        variant={primary ? 'primary' : 'secondary'}
        block
        loading={isSubmitting}
        loadingLabel="Recording"
        testID="release-checklist-submit"
        onPress={() => void onSubmit()}
      />
    </View>
  );
}

const styles = StyleSheet.create({
  done: { gap: spacing.sm },
  form: { gap: spacing.md },
});
