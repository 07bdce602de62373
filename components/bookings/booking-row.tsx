import { formatKv } from '@/components/assessment/quantities';
import { AppText } from '@/components/ui/app-text';
import { LinkRow } from '@/components/ui/link-row';
import type { BookingSummary } from '@/hooks/use-bookings';

import { BookingStatusBadge } from './booking-status';
import { formatWindow } from './booking-time';

interface BookingRowProps {
  booking: BookingSummary;
  /** Name the person when the list holds more than the viewer's own bookings. */
  showPerson?: boolean;
  divided?: boolean;
}

/** A booking in a list: state first (overdue stands out), then when, what and how high. */
export function BookingRow({ booking, showPerson = false, divided = false }: BookingRowProps) {
  const tags = booking.itemTags.length > 4 ? `${booking.itemTags.slice(0, 4).join(', ')} +${booking.itemTags.length - 4}` : booking.itemTags.join(', ');
  const who = showPerson ? `${booking.personName} · ` : '';
  return (
    <LinkRow href={{ pathname: '/bookings/[id]', params: { id: String(booking.id) } }} testID={`booking-row-${booking.id}`} divided={divided}>
      <BookingStatusBadge status={booking.status} overdue={booking.overdue} testID={`booking-row-${booking.id}-status`} />
      <AppText variant="bodyStrong">{`${formatWindow(booking.startsAt, booking.endsAt)} · ${formatKv(booking.plannedKv)}`}</AppText>
      <AppText variant="small" tone="muted">{`${who}#${booking.id} · ${booking.location} · ${tags}`}</AppText>
    </LinkRow>
  );
}
