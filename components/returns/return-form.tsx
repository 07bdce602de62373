import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { Controller, useForm } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import { z } from 'zod';

import { ReleaseFailures } from '@/components/release/release-failures';
import { blankAnswers, ChecklistFields, serverLineErrors, withoutLine } from '@/components/release/checklist-fields';
import { spacing } from '@/components/theme/tokens';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Checkbox } from '@/components/ui/checkbox';
import { describeError } from '@/components/ui/error-state';
import { FormAlert } from '@/components/ui/form-alert';
import { FormTextField } from '@/components/ui/form-fields';
import { isGateRefusedError, useReturnMutation, type Booking } from '@/hooks/use-bookings';
import { checklistSubmitSchema, returnSchema } from '@/shared/schemas/bookings';

// Both shared schemas, side by side: the make-safe answers and the return itself go in one submit.
const returnFormSchema = z.object({ checklist: checklistSubmitSchema, ret: returnSchema });
type ReturnFormInput = z.input<typeof returnFormSchema>;
type ReturnFormOutput = z.output<typeof returnFormSchema>;

interface ReturnFormProps {
  booking: Booking;
  safeResidualV: number | undefined;
  /** The bleed-down countdown is running: the output may still be charged, so the return waits. */
  bleeding?: boolean;
}

/** The make-safe checklist, damage, and the return: refused by the server until the readings are safe. */
export function ReturnForm({ booking, safeResidualV, bleeding = false }: ReturnFormProps) {
  const entries = booking.checklist.return;
  const submit = useReturnMutation(booking.id);
  const [lineErrors, setLineErrors] = useState<Record<number, string>>({});
  const {
    control,
    handleSubmit,
    setError,
    watch,
    formState: { errors, isSubmitting },
  } = useForm<ReturnFormInput, unknown, ReturnFormOutput>({
    resolver: zodResolver(returnFormSchema),
    defaultValues: { checklist: { phase: 'return', answers: blankAnswers(entries) }, ret: { damagedItemIds: [], notes: '' } },
  });
  const damaged = watch('ret.damagedItemIds') ?? [];

  // The residual-voltage line's limit is the lab rule, not a number written in the template.
  const limitSources = Object.fromEntries(
    entries
      .filter((e) => e.kind === 'reading' && e.unit === 'V' && e.max !== undefined && e.max === safeResidualV)
      .map((e) => [e.id, "the lab's safe residual voltage"]),
  );

  const onSubmit = handleSubmit(async ({ checklist, ret }) => {
    setLineErrors({});
    try {
      await submit.mutateAsync({ answers: checklist.answers, damagedItemIds: ret.damagedItemIds, notes: ret.notes });
    } catch (error) {
      const lines = serverLineErrors(error);
      setLineErrors(lines);
      const notes = (error as { fieldErrors?: Record<string, string[]> }).fieldErrors?.notes;
      if (notes) setError('ret.notes', { type: 'server', message: notes.join(' ') }, { shouldFocus: true });
      if (isGateRefusedError(error)) return;
      setError('root.server', {
        type: 'server',
        message: Object.keys(lines).length > 0 ? 'Some make-safe lines are not done yet: see each line marked above.' : describeError(error),
      });
    }
  });

  const formLineErrors: Record<number, string | undefined> = { ...lineErrors };
  entries.forEach((entry, index) => {
    const message = errors.checklist?.answers?.[index]?.value?.message;
    if (message) formLineErrors[entry.id] = /expected number/i.test(message) ? 'Enter the reading as a number' : message;
  });
  const refusal = isGateRefusedError(submit.error) ? submit.error : null;

  return (
    <View style={styles.root}>
      <Card title="Make-safe checklist">
        <Controller
          control={control}
          name="checklist.answers"
          render={({ field }) => (
            <ChecklistFields
              bookingId={booking.id}
              entries={entries}
              value={field.value}
              onChange={field.onChange}
              lineErrors={formLineErrors}
              limitSources={limitSources}
              onLineAnswered={(lineId) => setLineErrors((lines) => withoutLine(lines, lineId))}
              testID="checklist-return"
            />
          )}
        />
      </Card>
      <Card title="Damage">
        <AppText tone="muted">
          Mark anything that came back damaged. The return tags it out of service, so nobody can book or release it until a safety officer or manager has looked
          at it.
        </AppText>
        <Controller
          control={control}
          name="ret.damagedItemIds"
          render={({ field }) => (
            <View style={styles.damage}>
              {booking.items.map((item) => {
                const ids = field.value ?? [];
                return (
                  <Checkbox
                    key={item.id}
                    testID={`return-damaged-${item.id}`}
                    label={`${item.tag} · ${item.name}`}
                    checked={ids.includes(item.id)}
                    onChange={(on) => field.onChange(on ? [...ids, item.id] : ids.filter((d) => d !== item.id))}
                  />
                );
              })}
            </View>
          )}
        />
        <FormTextField
          control={control}
          name="ret.notes"
          label={damaged.length > 0 ? 'What is damaged, and how' : 'Notes (optional)'}
          hint={damaged.length > 0 ? 'Required when an item is marked damaged.' : undefined}
          multiline
          testID="return-notes"
        />
      </Card>
      {refusal ? <ReleaseFailures testID="return-failures" title={refusal.message} failures={refusal.failures} /> : null}
      {errors.root?.server?.message ? <FormAlert message={errors.root.server.message} testID="return-error" /> : null}
      {bleeding ? (
        <AppText variant="bodyStrong" testID="return-wait-bleed">
          Wait for the bleed-down countdown to finish, then ground the output and measure before returning.
        </AppText>
      ) : null}
      <Button
        label="Return the gear"
        icon="keyboard-return"
        block
        disabled={bleeding}
        loading={isSubmitting}
        loadingLabel="Recording the return"
        testID="return-submit"
        onPress={() => void onSubmit()}
      />
    </View>
  );
}

const styles = StyleSheet.create({
  root: { gap: spacing.lg },
  damage: { gap: spacing.sm },
});
