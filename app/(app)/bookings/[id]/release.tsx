import { useLocalSearchParams } from 'expo-router';

import { LazyReleaseScreen as ReleaseScreen } from '@/components/bookings/lazy-screens';

export default function ReleaseRoute() {
  const { id } = useLocalSearchParams<{ id: string }>();
  return <ReleaseScreen id={Number(id)} />;
}
