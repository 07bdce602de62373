import { useLocalSearchParams } from 'expo-router';

import { ReleaseScreen } from '@/components/release/release-screen';

export default function ReleaseRoute() {
  const { id } = useLocalSearchParams<{ id: string }>();
  return <ReleaseScreen id={Number(id)} />;
}
