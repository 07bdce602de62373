import { PlaceholderScreen } from '@/components/common/placeholder-screen';

export function BookingsScreen() {
  return (
    <PlaceholderScreen
      testID="bookings-screen"
      title="Bookings"
      icon="calendar-check"
      comingWith="Booking, release and return arrive with the booking work."
    />
  );
}
