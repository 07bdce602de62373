import { router } from 'expo-router';
import { StyleSheet, View } from 'react-native';

import { BookingRow } from '@/components/bookings/booking-row';
import { spacing } from '@/components/theme/tokens';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { ErrorState } from '@/components/ui/error-state';
import { HazardBadge } from '@/components/ui/hazard-badge';
import { ListRow } from '@/components/ui/list-row';
import { LoadingState } from '@/components/ui/loading-state';
import { useBookingsQuery } from '@/hooks/use-bookings';

const NEXT_SHOWN = 3;

/** Gear I have out now; overdue first, since it is the next safety step. */
export function MyGearOut() {
  const out = useBookingsQuery({ mine: true, status: 'released', limit: 50 });
  const rows = [...(out.data?.bookings ?? [])].sort((a, b) => Number(b.overdue) - Number(a.overdue) || a.endsAt.localeCompare(b.endsAt));
  const overdue = rows.filter((b) => b.overdue).length;
  return (
    <Card title="My gear out" flush testID="today-released">
      {out.isPending ? (
        <LoadingState label="Loading your gear" />
      ) : out.isError ? (
        <ErrorState title="Your gear did not load" error={out.error} onRetry={() => void out.refetch()} retrying={out.isFetching} />
      ) : rows.length === 0 ? (
        <AppText tone="muted" style={styles.pad} testID="today-released-empty">
          No gear out in your name.
        </AppText>
      ) : (
        <>
          {overdue > 0 ? (
            <View style={styles.pad}>
              <HazardBadge level="warning" detail={`${overdue} overdue: make safe and return`} testID="today-overdue" />
            </View>
          ) : null}
          {rows.map((booking, index) => (
            <BookingRow key={booking.id} booking={booking} divided={index > 0 || overdue > 0} />
          ))}
        </>
      )}
    </Card>
  );
}

/** My coming bookings, soonest first. */
export function MyNextBookings() {
  const live = useBookingsQuery({ mine: true, status: 'live', limit: 50 });
  const now = Date.now();
  const rows = (live.data?.bookings ?? [])
    .filter((b) => b.status !== 'released' && new Date(b.endsAt).getTime() > now)
    .sort((a, b) => a.startsAt.localeCompare(b.startsAt))
    .slice(0, NEXT_SHOWN);
  return (
    <Card title="My next bookings" flush testID="today-next">
      {live.isPending ? (
        <LoadingState label="Loading your bookings" />
      ) : live.isError ? (
        <ErrorState title="Your bookings did not load" error={live.error} onRetry={() => void live.refetch()} retrying={live.isFetching} />
      ) : rows.length === 0 ? (
        <View style={[styles.pad, styles.empty]} testID="today-next-empty">
          <AppText tone="muted">Nothing booked.</AppText>
          <Button label="Book gear" icon="calendar-plus" variant="secondary" testID="today-book" onPress={() => router.push('/bookings/new')} />
        </View>
      ) : (
        rows.map((booking, index) => <BookingRow key={booking.id} booking={booking} divided={index > 0} />)
      )}
    </Card>
  );
}

/** For officers: how many tests wait for a decision, and the way to the queue. */
export function ApprovalsWaiting({ officerId }: { officerId: number }) {
  const queue = useBookingsQuery({ mine: false, status: 'awaiting-approval', limit: 100 });
  const rows = queue.data?.bookings ?? [];
  const own = rows.filter((b) => b.personId === officerId).length;
  const count = rows.length - own;
  const more = queue.data?.nextCursor ? '+' : '';
  return (
    <Card title="Approvals" flush testID="today-approvals">
      {queue.isPending ? (
        <LoadingState label="Loading the approvals queue" />
      ) : queue.isError ? (
        <ErrorState title="The queue did not load" error={queue.error} onRetry={() => void queue.refetch()} retrying={queue.isFetching} />
      ) : (
        <ListRow
          testID="today-approvals-link"
          icon="clipboard-check"
          href="/approvals"
          // The count is said once, in the title (a second bare number beside it read as a second queue).
          title={count === 0 ? 'No test waiting for you' : `${count}${more} test${count === 1 && !more ? '' : 's'} waiting for your decision`}
          subtitle={own > 0 ? `${own} of your own wait for another officer` : 'Tests above the lab rules'}
        />
      )}
    </Card>
  );
}

const styles = StyleSheet.create({
  pad: { paddingHorizontal: spacing.md, paddingVertical: spacing.sm },
  empty: { gap: spacing.sm },
});
