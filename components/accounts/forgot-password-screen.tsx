import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import type { z } from 'zod';

import { iconSizes, spacing } from '@/components/theme/tokens';
import { useTheme } from '@/components/theme/use-theme';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { FormAlert } from '@/components/ui/form-alert';
import { Icon } from '@/components/ui/icon';
import { Screen } from '@/components/ui/screen';
import { EMAIL_INPUT, FormTextField } from '@/components/ui/form-fields';
import { TextLink } from '@/components/ui/text-link';
import { useRequestPasswordResetMutation } from '@/hooks/use-accounts';
import { passwordResetRequestSchema } from '@/shared/schemas/accounts';

import { showServerErrors } from './server-field-errors';

// The server takes any string (it never says whether an account exists); an empty one is still
// a slip worth catching before the request.
const formSchema = passwordResetRequestSchema.refine((values) => values.email.length > 0, { message: 'Enter your e-mail address', path: ['email'] });
type FormValues = z.input<typeof formSchema>;

/** Asks for a reset link. The answer is the same whether or not the e-mail has an account. */
export function ForgotPasswordScreen() {
  const { colors } = useTheme();
  const request = useRequestPasswordResetMutation();
  const {
    control,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<FormValues>({ resolver: zodResolver(formSchema), defaultValues: { email: '' } });

  const submit = handleSubmit(async (values) => {
    try {
      await request.mutateAsync({ email: values.email });
    } catch (error) {
      showServerErrors<FormValues>(error, ['email'], setError);
    }
  });

  return (
    <Screen testID="forgot-password-screen" title="Forgot your password?" width="form" centered>
      {request.isSuccess ? (
        <Card>
          <View testID="forgot-password-sent" accessibilityRole="alert" style={styles.fields}>
            <Icon name="email-fast" size={iconSizes.lg} color={colors.primary} />
            <AppText variant="heading" headingLevel={2}>
              Check your e-mail
            </AppText>
            <AppText>{request.data.message}</AppText>
            <AppText tone="muted">The link works once and expires soon. Nothing arrived? Check the spam folder, or ask the lab manager.</AppText>
            <TextLink label="Back to sign in" href="/sign-in" icon="login" testID="forgot-password-sign-in" />
          </View>
        </Card>
      ) : (
        <Card>
          <AppText tone="muted">Enter the e-mail you sign in with. We send a link to choose a new password.</AppText>
          <View style={styles.fields}>
            <FormTextField
              control={control}
              name="email"
              label="E-mail"
              testID="forgot-password-email"
              {...EMAIL_INPUT}
              autoComplete="email"
              textContentType="username"
              returnKeyType="send"
              onSubmitEditing={() => void submit()}
            />
            {errors.root?.server?.message ? <FormAlert testID="forgot-password-error" message={errors.root.server.message} /> : null}
            <Button
              label="Send reset link"
              loadingLabel="Sending the reset link"
              testID="forgot-password-submit"
              icon="email-fast"
              block
              loading={isSubmitting}
              onPress={() => void submit()}
            />
            <TextLink label="Back to sign in" href="/sign-in" testID="forgot-password-sign-in" />
          </View>
        </Card>
      )}
    </Screen>
  );
}

const styles = StyleSheet.create({
  fields: { gap: spacing.md },
});
