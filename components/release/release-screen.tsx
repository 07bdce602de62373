import { StyleSheet, View } from 'react-native';

import { SafetyCaution } from '@/components/assessment/safety-caution';
import { BackLink } from '@/components/bookings/back-link';
import { BookingStatusBadge } from '@/components/bookings/booking-status';
import { formatWindow } from '@/components/bookings/booking-time';
import { formatKv } from '@/components/assessment/quantities';
import { spacing } from '@/components/theme/tokens';
import { AppText } from '@/components/ui/app-text';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { LoadingState } from '@/components/ui/loading-state';
import { Screen } from '@/components/ui/screen';
import { useBookingQuery, useReleaseCheckQuery, type Booking } from '@/hooks/use-bookings';
import { PRE_RELEASE_STATUSES } from '@/shared/schemas/bookings';

import { ChecklistStep } from './checklist-step';
import { ReleaseLocked } from './release-locked';
import { ReleasedState } from './released-state';
import { ReleaseStep } from './release-step';
import { ScanStep } from './scan-step';
import { StepCard, type StepState } from './step-card';

/** Release at the counter, phone first: scan, checklist, release; the next step stays on top. */
export function ReleaseScreen({ id }: { id: number }) {
  const booking = useBookingQuery(id);
  return (
    <Screen testID="release-screen" title="Release">
      <BackLink href={{ pathname: '/bookings/[id]', params: { id: String(id) } }} label={`Booking ${id}`} />
      {booking.isPending ? (
        <LoadingState label="Loading the booking" />
      ) : booking.isError ? (
        <ErrorState title="The booking did not load" error={booking.error} onRetry={() => void booking.refetch()} retrying={booking.isFetching} />
      ) : (
        <ReleaseBody booking={booking.data} />
      )}
    </Screen>
  );
}

function ReleaseBody({ booking }: { booking: Booking }) {
  const check = useReleaseCheckQuery(booking.id, PRE_RELEASE_STATUSES.includes(booking.status));
  const header = (
    <View style={styles.header}>
      <BookingStatusBadge status={booking.status} overdue={booking.overdue} testID="release-status" />
      <AppText variant="bodyStrong">{`Booking ${booking.id} · up to ${formatKv(booking.plan.plannedKv)}`}</AppText>
      <AppText tone="muted">{`${formatWindow(booking.startsAt, booking.endsAt)} · ${booking.location}`}</AppText>
    </View>
  );

  if (booking.status === 'released') {
    return (
      <>
        {header}
        <ReleasedState booking={booking} />
      </>
    );
  }
  if (!PRE_RELEASE_STATUSES.includes(booking.status)) {
    return (
      <>
        {header}
        <EmptyState
          testID="release-not-open"
          icon="cancel"
          title="Nothing to release"
          message={
            booking.status === 'refused'
              ? 'The officer refused this plan. Change it from the booking page and ask again.'
              : `This booking is ${booking.status}.`
          }
        />
      </>
    );
  }

  // Until the window opens (the server's opensAt, checked again every half minute) every step waits.
  const opensAt = check.data?.opensAt;
  if (opensAt && new Date(opensAt).getTime() > Date.now()) {
    const earlyMinutes = Math.round((new Date(booking.startsAt).getTime() - new Date(opensAt).getTime()) / 60_000);
    return (
      <>
        {header}
        <StepCard number={1} title="Scan, check and release" state="later" testID="release-step-locked">
          <ReleaseLocked opensAt={opensAt} earlyMinutes={earlyMinutes} />
        </StepCard>
        <SafetyCaution cautions={booking.assessment.cautions} testID="release-caution" />
      </>
    );
  }

  const allScanned = booking.items.every((item) => booking.scannedItemIds.includes(item.id));
  const run = booking.checklistRuns.pre;
  // A run with a reading outside its limits is recorded but not done: step 2 stays the current one.
  const checklistDone = run !== null && run.withinLimits && run.complete;
  const scanState: StepState = allScanned ? 'done' : 'current';
  const checklistState: StepState = checklistDone ? 'done' : allScanned ? 'current' : 'later';
  const releaseState: StepState = allScanned && checklistDone ? 'current' : 'later';

  return (
    <>
      {header}
      <ScanStep booking={booking} state={scanState} />
      <ChecklistStep booking={booking} state={checklistState} />
      <ReleaseStep booking={booking} state={releaseState} />
      <SafetyCaution cautions={booking.assessment.cautions} testID="release-caution" />
    </>
  );
}

const styles = StyleSheet.create({
  header: { gap: spacing.xxs },
});
