import { router } from 'expo-router';
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { formatKv } from '@/components/assessment/quantities';
import { SafetyCaution } from '@/components/assessment/safety-caution';
import { BackLink } from '@/components/bookings/back-link';
import { BookingStatusBadge } from '@/components/bookings/booking-status';
import { formatWindow } from '@/components/bookings/booking-time';
import { formatDateTime } from '@/components/common/format';
import { spacing } from '@/components/theme/tokens';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { HazardBadge } from '@/components/ui/hazard-badge';
import { LoadingState } from '@/components/ui/loading-state';
import { Screen } from '@/components/ui/screen';
import { useBookingQuery, type Booking } from '@/hooks/use-bookings';
import { useLabRulesQuery } from '@/hooks/use-lab-rules';

import { BleedDownCountdown } from './bleed-down-countdown';
import { ReturnForm } from './return-form';

/** The make-safe return: switch off, wait, ground, measure, report damage, return. */
export function ReturnScreen({ id }: { id: number }) {
  const booking = useBookingQuery(id);
  return (
    <Screen testID="return-screen" title="Return and make safe">
      <BackLink href={{ pathname: '/bookings/[id]', params: { id: String(id) } }} label={`Booking ${id}`} />
      {booking.isPending ? (
        <LoadingState label="Loading the booking" />
      ) : booking.isError ? (
        <ErrorState title="The booking did not load" error={booking.error} onRetry={() => void booking.refetch()} retrying={booking.isFetching} />
      ) : (
        <ReturnBody booking={booking.data} />
      )}
    </Screen>
  );
}

function ReturnBody({ booking }: { booking: Booking }) {
  const rules = useLabRulesQuery();
  const [bleeding, setBleeding] = useState(false);
  const header = (
    <View style={styles.header}>
      <BookingStatusBadge status={booking.status} overdue={booking.overdue} testID="return-status" />
      <AppText variant="bodyStrong">{`Booking ${booking.id} · up to ${formatKv(booking.plan.plannedKv)}`}</AppText>
      <AppText tone="muted">{`${formatWindow(booking.startsAt, booking.endsAt)} · ${booking.location}`}</AppText>
    </View>
  );

  if (booking.status === 'returned') {
    return (
      <>
        {header}
        <Card testID="return-done">
          <HazardBadge level="safe" detail="Returned, made safe" testID="return-done-badge" />
          <AppText variant="heading" headingLevel={2}>
            Thank you. The gear is back.
          </AppText>
          <AppText>{`Returned ${booking.returnedAt ? formatDateTime(booking.returnedAt) : ''}.`}</AppText>
          <ReturnedDamage booking={booking} />
          <Button label="Go to Today" icon="home-lightning-bolt" block testID="return-go-today" onPress={() => router.replace('/')} />
        </Card>
      </>
    );
  }
  if (booking.status !== 'released') {
    return (
      <>
        {header}
        <EmptyState
          testID="return-not-open"
          icon="cancel"
          title="Nothing to return"
          message={`Only released gear is returned; this booking is ${booking.status}.`}
        />
      </>
    );
  }
  return (
    <>
      {header}
      <Card title="Switch off and bleed down">
        <BleedDownCountdown assessment={booking.assessment} safeResidualV={rules.data?.safeResidualV} onRunning={setBleeding} />
      </Card>
      <SafetyCaution testID="return-caution" />
      <ReturnForm booking={booking} safeResidualV={rules.data?.safeResidualV} bleeding={bleeding} />
    </>
  );
}

/** Gear marked damaged was tagged out by the return itself: say which, and what that means. */
function ReturnedDamage({ booking }: { booking: Booking }) {
  const tagged = booking.items.filter((item) => item.status === 'out-of-service');
  if (tagged.length === 0) return null;
  return (
    <View style={styles.header} testID="return-done-tagged-out">
      <HazardBadge level="warning" detail={`Tagged out of service: ${tagged.map((i) => i.tag).join(', ')}`} />
      <AppText>
        {`${tagged.length === 1 ? 'It stays' : 'They stay'} out of service, so nobody can book or release ${tagged.length === 1 ? 'it' : 'them'}, until a safety officer or manager has looked at the damage you described and put ${tagged.length === 1 ? 'it' : 'them'} back.`}
      </AppText>
    </View>
  );
}

const styles = StyleSheet.create({
  header: { gap: spacing.xxs },
});
