import { useState } from 'react';

import { AppText } from '@/components/ui/app-text';
import { Card } from '@/components/ui/card';
import { Screen } from '@/components/ui/screen';
import { useCompletePasswordResetMutation } from '@/hooks/use-accounts';
import { tokenParamSchema } from '@/shared/schemas/accounts';

import { isLinkProblem, linkProblemMessage } from './link-errors';
import { LinkDone, LinkProblem } from './link-outcome';
import { SetPasswordForm } from './set-password-form';

const USED_OR_EXPIRED = 'This reset link has been used or has expired. Reset links work once, for a short time.';

type Outcome = { kind: 'form' } | { kind: 'done' } | { kind: 'link-problem'; message: string };

/** Opened from the reset e-mail: choose a new password with the one-time token in the URL. */
export function ResetPasswordScreen({ token }: { token: string | undefined }) {
  const reset = useCompletePasswordResetMutation();
  const wellFormed = tokenParamSchema.safeParse({ token }).success;
  const [outcome, setOutcome] = useState<Outcome>(wellFormed ? { kind: 'form' } : { kind: 'link-problem', message: USED_OR_EXPIRED });

  return (
    <Screen testID="reset-password-screen" title="Choose a new password" width="form" centered>
      {outcome.kind === 'done' ? (
        <LinkDone
          testID="reset-password-done"
          title="Password changed"
          message="Sign in with your e-mail and the new password. Anyone still signed in as you elsewhere has been signed out."
        />
      ) : outcome.kind === 'link-problem' ? (
        <LinkProblem
          testID="reset-password-expired"
          title="Link used or expired"
          message={outcome.message}
          retry={{ label: 'Ask for a new link', href: '/forgot-password' }}
        />
      ) : (
        <Card>
          <AppText tone="muted">Choose the password you will sign in with from now on. This link works once.</AppText>
          <SetPasswordForm
            testIdPrefix="reset-password"
            submitLabel="Set new password"
            submittingLabel="Setting the new password"
            onSubmit={async (password) => {
              try {
                await reset.mutateAsync({ token: token ?? '', password });
                setOutcome({ kind: 'done' });
              } catch (error) {
                if (!isLinkProblem(error)) throw error;
                setOutcome({ kind: 'link-problem', message: linkProblemMessage(error, USED_OR_EXPIRED) });
              }
            }}
          />
        </Card>
      )}
    </Screen>
  );
}
