import { AppText } from '@/components/ui/app-text';
import { ErrorState } from '@/components/ui/error-state';
import { LoadingState } from '@/components/ui/loading-state';
import { Screen } from '@/components/ui/screen';
import { useBookingQuery } from '@/hooks/use-bookings';
import { useBreakpoints } from '@/hooks/use-breakpoints';

import { BackLink } from './back-link';
import { BookForm } from './book-form';

const validId = (id: number | undefined): id is number => id !== undefined && Number.isInteger(id) && id > 0;

/** A new booking: empty, with one item ("Book this"), or copied from an earlier booking ("Book again"). */
export function BookScreen({ itemId, fromBookingId }: { itemId?: number; fromBookingId?: number }) {
  const { isWide } = useBreakpoints();
  const from = useBookingQuery(validId(fromBookingId) ? fromBookingId : 0);
  return (
    <Screen testID="book-screen" title="Book gear" width={isWide ? 'wide' : 'regular'}>
      <BackLink href="/bookings" label="Bookings" />
      <AppText tone="muted">Pick the gear and describe the test: its safety assessment updates as you type.</AppText>
      {validId(fromBookingId) ? (
        from.isPending ? (
          <LoadingState label="Loading the booking to copy" />
        ) : from.isError ? (
          <ErrorState title="The booking to copy did not load" error={from.error} onRetry={() => void from.refetch()} retrying={from.isFetching} />
        ) : (
          <>
            <AppText
              variant="bodyStrong"
              testID="book-again-note"
            >{`Copied from booking ${from.data.id}: the same gear, place, purpose and plan. Choose the new window.`}</AppText>
            <BookForm copyOf={from.data} />
          </>
        )
      ) : (
        <BookForm itemIds={validId(itemId) ? [itemId] : undefined} />
      )}
    </Screen>
  );
}

/** Changing a booking's gear, window or plan (before release). */
export function EditBookingScreen({ id }: { id: number }) {
  const { isWide } = useBreakpoints();
  const booking = useBookingQuery(id);
  return (
    <Screen testID="edit-booking-screen" title={`Change booking ${id}`} width={isWide ? 'wide' : 'regular'}>
      <BackLink href={{ pathname: '/bookings/[id]', params: { id: String(id) } }} label={`Booking ${id}`} />
      {booking.isPending ? (
        <LoadingState label="Loading the booking" />
      ) : booking.isError ? (
        <ErrorState title="The booking did not load" error={booking.error} onRetry={() => void booking.refetch()} retrying={booking.isFetching} />
      ) : (
        <BookForm booking={booking.data} />
      )}
    </Screen>
  );
}
