import { useState } from 'react';

import { AppText } from '@/components/ui/app-text';
import { Card } from '@/components/ui/card';
import { Screen } from '@/components/ui/screen';
import { useAcceptInvitationMutation } from '@/hooks/use-accounts';
import { tokenParamSchema } from '@/shared/schemas/accounts';

import { isLinkProblem } from './link-errors';
import { LinkDone, LinkProblem } from './link-outcome';
import { SetPasswordForm } from './set-password-form';

const USED_OR_EXPIRED =
  'This invitation link has been used or has expired. If you already set your password, sign in with it; otherwise ask the lab manager to invite you again.';

type Outcome = { kind: 'form' } | { kind: 'done' } | { kind: 'link-problem'; message: string };

/** Opened from the invitation e-mail: set the first password, then sign in. */
export function InvitationScreen({ token }: { token: string | undefined }) {
  const accept = useAcceptInvitationMutation();
  const wellFormed = tokenParamSchema.safeParse({ token }).success;
  const [outcome, setOutcome] = useState<Outcome>(wellFormed ? { kind: 'form' } : { kind: 'link-problem', message: USED_OR_EXPIRED });

  return (
    <Screen testID="invitation-screen" title="Welcome to Voltcrib" width="form" centered>
      {outcome.kind === 'done' ? (
        <LinkDone
          testID="invitation-done"
          title="Your password is set"
          message="Sign in with the e-mail the invitation came to and the password you just chose."
        />
      ) : outcome.kind === 'link-problem' ? (
        <LinkProblem testID="invitation-expired" title="Invitation used or expired" message={outcome.message} />
      ) : (
        <Card>
          <AppText>
            The lab manager has added you to the lab&apos;s Voltcrib, where the shared high-voltage gear is booked, checked out and returned. Choose a password
            to finish.
          </AppText>
          <SetPasswordForm
            testIdPrefix="invitation"
            submitLabel="Set password"
            submittingLabel="Setting your password"
            onSubmit={async (password) => {
              try {
                await accept.mutateAsync({ token: token ?? '', password });
                setOutcome({ kind: 'done' });
              } catch (error) {
                if (!isLinkProblem(error)) throw error;
                setOutcome({ kind: 'link-problem', message: USED_OR_EXPIRED });
              }
            }}
          />
        </Card>
      )}
    </Screen>
  );
}
