import { useLocalSearchParams } from 'expo-router';

import { BookingScreen } from '@/components/bookings/booking-screen';

export default function BookingRoute() {
  const { id } = useLocalSearchParams<{ id: string }>();
  return <BookingScreen id={Number(id)} />;
}
