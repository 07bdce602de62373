import { useLocalSearchParams } from 'expo-router';

import { LazyEditBookingScreen as EditBookingScreen } from '@/components/bookings/lazy-screens';

export default function EditBookingRoute() {
  const { id } = useLocalSearchParams<{ id: string }>();
  return <EditBookingScreen id={Number(id)} />;
}
