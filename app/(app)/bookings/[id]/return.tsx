import { useLocalSearchParams } from 'expo-router';

import { LazyReturnScreen as ReturnScreen } from '@/components/bookings/lazy-screens';

export default function ReturnRoute() {
  const { id } = useLocalSearchParams<{ id: string }>();
  return <ReturnScreen id={Number(id)} />;
}
