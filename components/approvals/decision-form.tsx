import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import type { z } from 'zod';

import { applyServerErrors } from '@/components/bookings/server-errors';
import { spacing } from '@/components/theme/tokens';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { FormAlert } from '@/components/ui/form-alert';
import { FormTextField } from '@/components/ui/form-fields';
import { useApprovalDecisionMutation } from '@/hooks/use-bookings';
import { approvalDecisionSchema } from '@/shared/schemas/bookings';

type DecisionInput = z.input<typeof approvalDecisionSchema>;

interface DecisionFormProps {
  bookingId: number;
  /** The version of the plan the officer is reading; the decision binds to it. */
  planVersion: number;
  onDecided: (decision: 'approve' | 'refuse') => void;
}

/** Approve, with conditions if any, or refuse with a reason; the decision binds to this plan only. */
export function DecisionForm({ bookingId, planVersion, onDecided }: DecisionFormProps) {
  const decide = useApprovalDecisionMutation(bookingId);
  const prefix = `approval-${bookingId}`;
  // A decision binds the plan for the member at once: one more press says which it is, so a tap
  // meant for the next card in the queue never approves or refuses this one.
  const [confirming, setConfirming] = useState<'approve' | 'refuse' | null>(null);
  const {
    control,
    handleSubmit,
    setValue,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<DecisionInput>({
    resolver: zodResolver(approvalDecisionSchema),
    defaultValues: { decision: 'approve', planVersion, conditions: '', reason: '' },
  });

  const submit = (decision: 'approve' | 'refuse') => {
    setValue('decision', decision);
    setValue('planVersion', planVersion);
    void handleSubmit(async (input) => {
      try {
        await decide.mutateAsync({
          decision: input.decision,
          planVersion,
          conditions: input.decision === 'approve' && input.conditions ? input.conditions : undefined,
          reason: input.decision === 'refuse' ? input.reason : undefined,
        });
        onDecided(input.decision);
      } catch (error) {
        applyServerErrors(error, ['conditions', 'reason'] as const, setError);
      }
    })();
  };

  return (
    <View style={styles.root} testID={`${prefix}-form`}>
      <FormTextField
        control={control}
        name="conditions"
        label="Conditions (if approving)"
        hint="E.g. second person from the group present; barrier at 3 m; stay at or below 25 kV."
        multiline
        testID={`${prefix}-conditions`}
      />
      <Button
        label="Approve this plan"
        icon="check-circle"
        block
        testID={`${prefix}-approve`}
        onPress={() => setConfirming('approve')}
        disabled={isSubmitting}
      />
      <AppText variant="small" tone="muted">
        Or refuse it, saying what would make it acceptable:
      </AppText>
      <FormTextField control={control} name="reason" label="Reason (if refusing)" multiline testID={`${prefix}-reason`} />
      <Button label="Refuse" icon="close-circle" variant="danger" testID={`${prefix}-refuse`} onPress={() => setConfirming('refuse')} disabled={isSubmitting} />
      {confirming ? (
        <View style={styles.confirm} testID={`${prefix}-confirm`}>
          <AppText variant="bodyStrong">
            {confirming === 'approve'
              ? `Approve booking ${bookingId} as planned (plan version ${planVersion})? The member can then release it at the counter.`
              : `Refuse booking ${bookingId}? The member is told your reason and can change the plan.`}
          </AppText>
          <View style={styles.row}>
            <Button
              label={confirming === 'approve' ? 'Yes, approve' : 'Yes, refuse'}
              icon={confirming === 'approve' ? 'check-circle' : 'close-circle'}
              variant={confirming === 'approve' ? 'primary' : 'danger'}
              loading={isSubmitting}
              loadingLabel={confirming === 'approve' ? 'Approving' : 'Refusing'}
              testID={`${prefix}-confirm-yes`}
              onPress={() => submit(confirming)}
            />
            <Button label="Go back" variant="secondary" testID={`${prefix}-confirm-no`} onPress={() => setConfirming(null)} disabled={isSubmitting} />
          </View>
        </View>
      ) : null}
      {errors.root?.server?.message ? <FormAlert message={errors.root.server.message} testID={`${prefix}-error`} /> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  root: { gap: spacing.md },
  confirm: { gap: spacing.sm },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.sm },
});
