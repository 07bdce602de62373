import { useLocalSearchParams } from 'expo-router';

import { LazyBookScreen as BookScreen } from '@/components/bookings/lazy-screens';

/** `?itemId=` starts the form with that item ("Book this"); `?from=` copies a booking ("Book again"). */
export default function NewBookingRoute() {
  const { itemId, from } = useLocalSearchParams<{ itemId?: string; from?: string }>();
  return <BookScreen itemId={itemId ? Number(itemId) : undefined} fromBookingId={from ? Number(from) : undefined} />;
}
