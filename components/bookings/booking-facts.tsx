import type { Href } from 'expo-router';
import { StyleSheet, View } from 'react-native';

import { formatKv, trimNumber } from '@/components/assessment/quantities';
import { spacing } from '@/components/theme/tokens';
import { AppText } from '@/components/ui/app-text';
import { Card } from '@/components/ui/card';
import { ListRow } from '@/components/ui/list-row';
import type { Booking } from '@/hooks/use-bookings';
import { KIND_LABELS } from '@/shared/schemas/items';

import { formatWindow } from './booking-time';

const polarityWords = { positive: 'positive', negative: 'negative', reversible: 'reversible' } as const;

/** Who, when, where, why, and the test plan, as the booking holds them. */
export function BookingFacts({ booking }: { booking: Booking }) {
  const { plan } = booking;
  return (
    <Card title="Plan" testID="booking-plan">
      <View style={styles.lines}>
        <AppText variant="bodyStrong">{formatWindow(booking.startsAt, booking.endsAt)}</AppText>
        <AppText>{`${booking.personName} · ${booking.location}`}</AppText>
        <AppText>{booking.purpose}</AppText>
        <AppText testID="booking-plan-line">
          {`Up to ${formatKv(plan.plannedKv)} ${polarityWords[plan.polarity]}, at most ${trimNumber(plan.maxCurrentMa, 3)} mA, ${plan.peoplePresent} ${plan.peoplePresent === 1 ? 'person' : 'people'} present`}
        </AppText>
        <AppText variant="small" tone="muted">{`Plan version ${booking.planVersion}`}</AppText>
      </View>
    </Card>
  );
}

/** The booked items, each linking to its page in the registry. */
export function BookingItems({ booking }: { booking: Booking }) {
  return (
    <Card title={`Gear (${booking.items.length})`} flush testID="booking-items">
      {booking.items.map((item, index) => (
        <ListRow
          key={item.id}
          testID={`booking-item-${item.id}`}
          divided={index > 0}
          title={`${item.tag} · ${item.name}`}
          subtitle={`${KIND_LABELS[item.kind]} · ${item.ratedKv === null ? 'no voltage rating' : `rated ${formatKv(item.ratedKv)}`}${booking.scannedItemIds.includes(item.id) ? ' · scanned at the counter' : ''}`}
          href={`/gear/${item.id}` as Href}
        />
      ))}
    </Card>
  );
}

const styles = StyleSheet.create({
  lines: { gap: spacing.xxs },
});
