import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import { z } from 'zod';

import { spacing } from '@/components/theme/tokens';
import { Button } from '@/components/ui/button';
import { FormAlert } from '@/components/ui/form-alert';
import { FormTextField, NEW_PASSWORD_INPUT } from '@/components/ui/form-fields';
import { setPasswordSchema } from '@/shared/schemas/accounts';

import { showServerErrors } from './server-field-errors';

// The server's schema for the password itself, plus a second entry that must match: a typo in a
// password nobody can see would lock the person out of a link that works only once.
const formSchema = setPasswordSchema.extend({ confirm: z.string() }).refine((values) => values.password === values.confirm, {
  message: 'The two passwords differ',
  path: ['confirm'],
});

type FormValues = z.infer<typeof formSchema>;

interface SetPasswordFormProps {
  /** testID prefix: `<prefix>-password`, `<prefix>-confirm`, `<prefix>-submit`, `<prefix>-error`. */
  testIdPrefix: string;
  submitLabel: string;
  submittingLabel: string;
  /** Sends the password; throws the ApiError on failure. Link problems (410) are the caller's. */
  onSubmit: (password: string) => Promise<void>;
}

export function SetPasswordForm({ testIdPrefix, submitLabel, submittingLabel, onSubmit }: SetPasswordFormProps) {
  const {
    control,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<FormValues>({ resolver: zodResolver(formSchema), defaultValues: { password: '', confirm: '' } });

  const submit = handleSubmit(async ({ password }) => {
    try {
      await onSubmit(password);
    } catch (error) {
      showServerErrors<FormValues>(error, ['password'], setError);
    }
  });

  return (
    <View style={styles.form}>
      <FormTextField
        control={control}
        name="password"
        label="New password"
        hint="At least 10 characters. A few unrelated words are easy to remember and hard to guess."
        testID={`${testIdPrefix}-password`}
        {...NEW_PASSWORD_INPUT}
        returnKeyType="next"
      />
      <FormTextField
        control={control}
        name="confirm"
        label="Same password again"
        testID={`${testIdPrefix}-confirm`}
        {...NEW_PASSWORD_INPUT}
        returnKeyType="go"
        onSubmitEditing={() => void submit()}
      />
      {errors.root?.server?.message ? <FormAlert testID={`${testIdPrefix}-error`} message={errors.root.server.message} /> : null}
      <Button
        label={submitLabel}
        loadingLabel={submittingLabel}
        testID={`${testIdPrefix}-submit`}
        icon="login"
        block
        loading={isSubmitting}
        onPress={() => void submit()}
      />
    </View>
  );
}

const styles = StyleSheet.create({
  form: { gap: spacing.md },
});
