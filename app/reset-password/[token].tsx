import { useLocalSearchParams } from 'expo-router';

import { LazyResetPasswordScreen } from '@/components/accounts/lazy-account-screens';

export default function ResetPasswordRoute() {
  const { token } = useLocalSearchParams<{ token: string }>();
  return <LazyResetPasswordScreen token={token} />;
}
