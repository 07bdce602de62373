import { LazyBookScreen as BookScreen } from '@/components/bookings/lazy-screens';

export default function NewBookingRoute() {
  return <BookScreen />;
}
