import { router } from 'expo-router';
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { spacing } from '@/components/theme/tokens';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { ChoiceChips } from '@/components/ui/choice-chips';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { LoadingState } from '@/components/ui/loading-state';
import { Screen } from '@/components/ui/screen';
import { LoadMore } from '@/components/ui/load-more';
import { useBookingsInfiniteQuery, type BookingListStatus } from '@/hooks/use-bookings';
import { useBreakpoints } from '@/hooks/use-breakpoints';
import { useCurrentUser } from '@/hooks/use-session';

import { BookingRow } from './booking-row';

type Filter = 'all' | Extract<BookingListStatus, 'live' | 'awaiting-approval' | 'released' | 'overdue' | 'returned'>;

const FILTERS: { value: Filter; label: string }[] = [
  { value: 'all', label: 'All' },
  { value: 'live', label: 'Open' },
  { value: 'awaiting-approval', label: 'Awaiting approval' },
  { value: 'released', label: 'Out' },
  { value: 'overdue', label: 'Overdue' },
  { value: 'returned', label: 'Returned' },
];

/** The viewer's bookings, newest first; officers and managers can look at everyone's. */
export function BookingsScreen() {
  const user = useCurrentUser();
  const { isWide } = useBreakpoints();
  const staff = user?.role === 'officer' || user?.role === 'manager';
  const [scope, setScope] = useState<'mine' | 'all'>('mine');
  const [filter, setFilter] = useState<Filter>('all');
  const mine = !staff || scope === 'mine';
  const bookings = useBookingsInfiniteQuery({ mine, status: filter === 'all' ? undefined : filter });
  const rows = bookings.data?.pages.flatMap((page) => page.bookings) ?? [];

  return (
    <Screen testID="bookings-screen" title="Bookings">
      <Button label="Book gear" icon="calendar-plus" block={!isWide} testID="bookings-new" onPress={() => router.push('/bookings/new')} />
      <View style={styles.filters}>
        {staff ? (
          <ChoiceChips
            label="Whose"
            testID="bookings-scope"
            choices={[
              { value: 'mine', label: 'Mine' },
              { value: 'all', label: 'Everyone' },
            ]}
            value={scope}
            onChange={setScope}
          />
        ) : null}
        <ChoiceChips label="Show" testID="bookings-filter" choices={FILTERS} value={filter} onChange={setFilter} />
      </View>
      {bookings.isPending ? (
        <LoadingState label="Loading bookings" />
      ) : bookings.isError ? (
        <ErrorState title="The bookings did not load" error={bookings.error} onRetry={() => void bookings.refetch()} retrying={bookings.isFetching} />
      ) : rows.length === 0 ? (
        <EmptyState
          testID="bookings-empty"
          icon="calendar-check"
          title={filter === 'all' ? 'No bookings yet' : 'Nothing here'}
          message={filter === 'all' ? 'Book gear for a test: the form works out its safety assessment as you type.' : 'No booking matches this filter.'}
        />
      ) : (
        <Card flush testID="bookings-list">
          {rows.map((booking, index) => (
            <BookingRow key={booking.id} booking={booking} showPerson={!mine} divided={index > 0} />
          ))}
        </Card>
      )}
      <LoadMore query={bookings} failedText="More bookings did not load. Try again." testID="bookings-more" />
    </Screen>
  );
}

const styles = StyleSheet.create({
  filters: { gap: spacing.md },
});
