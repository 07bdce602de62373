// The signed-out account pages are opened rarely (from an e-mail, or after a forgotten password),
// so they load on demand rather than with the sign-in screen everyone downloads.
import { lazy, Suspense, type ReactNode } from 'react';

import { LoadingState } from '@/components/ui/loading-state';
import { Screen } from '@/components/ui/screen';

const ForgotPasswordScreen = lazy(() => import('./forgot-password-screen').then((m) => ({ default: m.ForgotPasswordScreen })));
const ResetPasswordScreen = lazy(() => import('./reset-password-screen').then((m) => ({ default: m.ResetPasswordScreen })));
const InvitationScreen = lazy(() => import('./invitation-screen').then((m) => ({ default: m.InvitationScreen })));

function Loading({ testID, title, children }: { testID: string; title: string; children: ReactNode }) {
  return (
    <Suspense
      fallback={
        <Screen testID={testID} title={title} width="form" centered>
          <LoadingState label="Loading" />
        </Screen>
      }
    >
      {children}
    </Suspense>
  );
}

export function LazyForgotPasswordScreen() {
  return (
    <Loading testID="forgot-password-screen" title="Forgot your password?">
      <ForgotPasswordScreen />
    </Loading>
  );
}

export function LazyResetPasswordScreen({ token }: { token: string | undefined }) {
  return (
    <Loading testID="reset-password-screen" title="Choose a new password">
      <ResetPasswordScreen token={token} />
    </Loading>
  );
}

export function LazyInvitationScreen({ token }: { token: string | undefined }) {
  return (
    <Loading testID="invitation-screen" title="Welcome to Voltcrib">
      <InvitationScreen token={token} />
    </Loading>
  );
}
