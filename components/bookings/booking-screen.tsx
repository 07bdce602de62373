import { StyleSheet, View } from 'react-native';

import { AssessmentPanel } from '@/components/assessment/assessment-panel';
import { formatDateTime } from '@/components/common/format';
import { spacing } from '@/components/theme/tokens';
import { AppText } from '@/components/ui/app-text';
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
      <BookingApproval booking={booking} />
      <BookingFacts booking={booking} />
      <BookingItems booking={booking} />
      <ChecklistRuns booking={booking} />
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

function ChecklistRuns({ booking }: { booking: Booking }) {
  const { pre, return: ret } = booking.checklistRuns;
  if (!pre && !ret) return null;
  return (
    <View style={styles.runs} testID="booking-checklist-runs">
      {pre ? (
        <AppText variant="small">{`Pre-energize checklist: ${formatDateTime(pre.completedAt)}, ${pre.withinLimits ? 'readings within limits' : 'a reading outside its limits'}`}</AppText>
      ) : null}
      {ret ? (
        <AppText variant="small">{`Make-safe checklist: ${formatDateTime(ret.completedAt)}, ${ret.withinLimits ? 'readings within limits' : 'a reading outside its limits'}`}</AppText>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  column: { gap: spacing.lg },
  wide: { flexDirection: 'row', gap: spacing.lg, alignItems: 'flex-start' },
  wideColumn: { flex: 1, gap: spacing.lg },
  runs: { gap: spacing.xxs },
});
