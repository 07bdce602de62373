import { useLocalSearchParams } from 'expo-router';

import { EditBookingScreen } from '@/components/bookings/book-screen';

export default function EditBookingRoute() {
  const { id } = useLocalSearchParams<{ id: string }>();
  return <EditBookingScreen id={Number(id)} />;
}
