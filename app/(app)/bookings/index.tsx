import { BookingsScreen } from '@/components/bookings/bookings-screen';

export default function BookingsRoute() {
  return <BookingsScreen />;
}
