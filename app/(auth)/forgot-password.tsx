import { LazyForgotPasswordScreen } from '@/components/accounts/lazy-account-screens';

export default function ForgotPasswordRoute() {
  return <LazyForgotPasswordScreen />;
}
