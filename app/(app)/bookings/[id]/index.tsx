import { useLocalSearchParams } from 'expo-router';

import { LazyBookingScreen as BookingScreen } from '@/components/bookings/lazy-screens';

export default function BookingRoute() {
  const { id } = useLocalSearchParams<{ id: string }>();
  return <BookingScreen id={Number(id)} />;
}
