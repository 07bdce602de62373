import { useLocalSearchParams } from 'expo-router';

import { SignInScreen } from '@/components/auth/sign-in-screen';

export default function SignInRoute() {
  const { next } = useLocalSearchParams<{ next?: string }>();
  return <SignInScreen next={next} />;
}
