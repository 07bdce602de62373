import { View } from 'react-native';

import { formatDateTime } from '@/components/common/format';
import { AppText } from '@/components/ui/app-text';
import { Badge } from '@/components/ui/badge';
import { Card } from '@/components/ui/card';
import { ErrorState } from '@/components/ui/error-state';
import { ListRow } from '@/components/ui/list-row';
import { LoadingState } from '@/components/ui/loading-state';
import { useItemBookingsQuery } from '@/hooks/use-items';
import type { BookingStatus } from '@/shared/schemas/bookings';

import { formatNumber } from './rating-fields';

const STATUS_WORDS: Record<BookingStatus, string> = {
  requested: 'Requested',
  'awaiting-approval': 'Awaiting approval',
  approved: 'Approved',
  refused: 'Refused',
  released: 'Checked out',
  returned: 'Returned',
  cancelled: 'Cancelled',
};

interface ItemBookingsCardProps {
  itemId: number;
  /**
   * Officers and managers may open any booking. The history does not say whose booking is whose
   * (no person id), so members, who may open only their own, get plain rows.
   */
  canOpen: boolean;
}

export function ItemBookingsCard({ itemId, canOpen }: ItemBookingsCardProps) {
  const bookings = useItemBookingsQuery(itemId);
  return (
    <Card title="Bookings" testID="item-bookings">
      {bookings.isPending ? (
        <LoadingState label="Loading bookings" />
      ) : bookings.isError ? (
        <ErrorState title="The bookings did not load" error={bookings.error} onRetry={() => void bookings.refetch()} retrying={bookings.isRefetching} />
      ) : bookings.data.length === 0 ? (
        <AppText tone="muted" testID="item-bookings-empty">
          Not booked yet.
        </AppText>
      ) : (
        <View>
          {bookings.data.map((booking, index) => (
            <ListRow
              key={booking.bookingId}
              testID={`item-booking-${booking.bookingId}`}
              icon="calendar-check"
              href={canOpen ? { pathname: '/bookings/[id]', params: { id: String(booking.bookingId) } } : undefined}
              title={`${booking.personName} · planned ${formatNumber(booking.plannedKv)} kV`}
              subtitle={`${formatDateTime(booking.startsAt)} – ${formatDateTime(booking.endsAt)}`}
              trailing={
                booking.overdue ? (
                  <Badge label="Overdue" icon="clock-alert" tone="primary" />
                ) : (
                  <Badge label={STATUS_WORDS[booking.status]} tone={booking.status === 'released' ? 'primary' : 'neutral'} />
                )
              }
              divided={index > 0}
            />
          ))}
        </View>
      )}
    </Card>
  );
}
