import { useLocalSearchParams } from 'expo-router';

import { LazyInvitationScreen } from '@/components/accounts/lazy-account-screens';

export default function InvitationRoute() {
  const { token } = useLocalSearchParams<{ token: string }>();
  return <LazyInvitationScreen token={token} />;
}
