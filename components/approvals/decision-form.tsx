import { zodResolver } from '@hookform/resolvers/zod';
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
      <Button label="Approve this plan" icon="check-circle" block loading={isSubmitting && decide.variables?.decision !== 'refuse'} loadingLabel="Approving" testID={`${prefix}-approve`} onPress={() => submit('approve')} />
      <AppText variant="small" tone="muted">
        Or refuse it, saying what would make it acceptable:
      </AppText>
      <FormTextField
        control={control}
        name="reason"
        label="Reason (if refusing)"
        multiline
        testID={`${prefix}-reason`}
      />
      <Button label="Refuse" icon="close-circle" variant="danger" loading={isSubmitting && decide.variables?.decision === 'refuse'} loadingLabel="Refusing" testID={`${prefix}-refuse`} onPress={() => submit('refuse')} />
      {errors.root?.server?.message ? <FormAlert message={errors.root.server.message} testID={`${prefix}-error`} /> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  root: { gap: spacing.md },
});
