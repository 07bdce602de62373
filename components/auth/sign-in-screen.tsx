import { zodResolver } from '@hookform/resolvers/zod';
import { router, type Href } from 'expo-router';
import { useForm } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';

import { layout, spacing } from '@/components/theme/tokens';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { FormAlert } from '@/components/ui/form-alert';
import { Screen } from '@/components/ui/screen';
import { EMAIL_INPUT, FormTextField, PASSWORD_INPUT } from '@/components/ui/form-fields';
import { TextLink } from '@/components/ui/text-link';
import { VoltcribLockup } from '@/components/ui/voltcrib-mark';
import { describeError } from '@/components/ui/error-state';
import { isApiError } from '@/hooks/api-client';
import { useSignInMutation } from '@/hooks/use-session';
import { signInSchema, type SignInInput } from '@/shared/schemas/session';

interface SignInScreenProps {
  /** Where to go once signed in (a scanned label's page); only paths inside the app are honoured. */
  next?: string;
}

const FIELDS = ['email', 'password'] as const satisfies readonly (keyof SignInInput)[];

export function SignInScreen({ next }: SignInScreenProps) {
  const signIn = useSignInMutation();
  const {
    control,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm({
    resolver: zodResolver(signInSchema),
    defaultValues: { email: '', password: '' },
  });

  const onSubmit = handleSubmit(async (values) => {
    try {
      await signIn.mutateAsync(values);
    } catch (error) {
      showServerError(error);
      return;
    }
    // The session refetch has already swapped the guarded routes; only a deep link needs more.
    const destination = internalPath(next);
    if (destination) router.replace(destination as Href);
  });

  function showServerError(error: unknown) {
    const fieldErrors = isApiError(error) ? error.fieldErrors : undefined;
    let mappedToField = false;
    for (const field of FIELDS) {
      const messages = fieldErrors?.[field];
      if (messages && messages.length > 0) {
        setError(field, { type: 'server', message: messages.join(' ') }, { shouldFocus: !mappedToField });
        mappedToField = true;
      }
    }
    if (!mappedToField) setError('root.server', { type: 'server', message: describeError(error) });
  }

  return (
    <Screen testID="sign-in-screen" title="Sign in" hideTitle width="form" centered>
      <View style={styles.intro}>
        <VoltcribLockup size={layout.markSizeLarge} />
        <AppText tone="muted">The shared high-voltage lab's gear: what it is rated for, who has it, and whether it is safe to energise.</AppText>
      </View>
      <Card>
        <AppText variant="heading" headingLevel={1}>
          Sign in
        </AppText>
        <View style={styles.fields}>
          <FormTextField
            control={control}
            name="email"
            label="E-mail"
            testID="sign-in-email"
            {...EMAIL_INPUT}
            autoComplete="email"
            textContentType="username"
            returnKeyType="next"
          />
          <FormTextField
            control={control}
            name="password"
            label="Password"
            testID="sign-in-password"
            {...PASSWORD_INPUT}
            autoComplete="current-password"
            textContentType="password"
            returnKeyType="go"
            onSubmitEditing={() => void onSubmit()}
          />
        </View>
        {errors.root?.server?.message ? <FormAlert testID="sign-in-error" message={errors.root.server.message} /> : null}
        <Button label="Sign in" loadingLabel="Signing in" testID="sign-in-submit" icon="login" block loading={isSubmitting} onPress={() => void onSubmit()} />
        <TextLink label="Forgot your password?" href="/forgot-password" testID="sign-in-forgot" />
      </Card>
    </Screen>
  );
}

/** `next` comes from the URL: accept only a path inside this app, never another origin. */
function internalPath(next: string | undefined): string | null {
  if (!next || !next.startsWith('/') || next.startsWith('//') || next.includes('\\')) return null;
  return next;
}

const styles = StyleSheet.create({
  intro: { gap: spacing.md, alignItems: 'flex-start' },
  fields: { gap: spacing.md },
});
