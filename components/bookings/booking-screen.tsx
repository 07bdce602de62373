import { StyleSheet, View } from 'react-native';

import { AssessmentPanel } from '@/components/assessment/assessment-panel';
import { BenchLogSection } from '@/components/bench-log/bench-log-section';
import { formatDateTime } from '@/components/common/format';
import { spacing } from '@/components/theme/tokens';
import { ErrorState } from '@/components/ui/error-state';
import { LoadingState } from '@/components/ui/loading-state';
import { Screen } from '@/components/ui/screen';
import { useBookingQuery, type Booking } from '@/hooks/use-bookings';
import { useBreakpoints } from '@/hooks/use-breakpoints';

import { BackLink } from './back-link';
import { BookingApproval } from './booking-approval';
import { BookingFacts, BookingItems } from './booking-facts';
import { BookingNextStep } from './booking-next-step';
import { BookingStatusBadge } from './booking-status';
import { ChecklistRecord } from './checklist-record';
import { RelatedIncidentsCard } from '@/components/incidents/related-incidents-card';

/** One booking: its state and next step first, then plan, approval, gear and the stored assessment. */
export function BookingScreen({ id }: { id: number }) {
  const booking = useBookingQuery(id);
  const { isWide } = useBreakpoints();
  return (
    <Screen testID="booking-screen" title={`Booking ${id}`} width={isWide ? 'wide' : 'regular'}>
      <BackLink href="/bookings" label="Bookings" />
      {booking.isPending ? (
        <LoadingState label="Loading the booking" />
      ) : booking.isError ? (
        <ErrorState title="The booking did not load" error={booking.error} onRetry={() => void booking.refetch()} retrying={booking.isFetching} />
      ) : (
        <BookingBody booking={booking.data} wide={isWide} />
      )}
    </Screen>
  );
}

function BookingBody({ booking, wide }: { booking: Booking; wide: boolean }) {
  const summary = (
    <View style={styles.column}>
      <BookingStatusBadge status={booking.status} overdue={booking.overdue} testID="booking-status" />
      <BookingNextStep booking={booking} />
      <BenchLogSection booking={booking} />
      <BookingApproval booking={booking} />
      <BookingFacts booking={booking} />
      <BookingItems booking={booking} />
      <ChecklistRecord bookingId={booking.id} />
      <RelatedIncidentsCard bookingId={booking.id} />
    </View>
  );
  const assessment = (
    <AssessmentPanel
      assessment={booking.assessment}
      testID="stored-assessment"
      provenance={`Stored with the booking by the server (plan version ${booking.planVersion})${booking.releasedAt ? `, recomputed at release ${formatDateTime(booking.releasedAt)}` : ''}. This is the record; the release checks the gear again.`}
    />
  );
  return wide ? (
    <View style={styles.wide}>
      <View style={styles.wideColumn}>{summary}</View>
      <View style={styles.wideColumn}>{assessment}</View>
    </View>
  ) : (
    <View style={styles.column}>
      {summary}
      {assessment}
    </View>
  );
}

const styles = StyleSheet.create({
  column: { gap: spacing.lg },
  wide: { flexDirection: 'row', gap: spacing.lg, alignItems: 'flex-start' },
  wideColumn: { flex: 1, gap: spacing.lg },
});
