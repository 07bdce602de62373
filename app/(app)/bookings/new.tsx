import { BookScreen } from '@/components/bookings/book-screen';

export default function NewBookingRoute() {
  return <BookScreen />;
}
