import { Link } from 'expo-router';
import { Pressable, StyleSheet, View } from 'react-native';

import { formatKv } from '@/components/assessment/quantities';
import { borders, layout, spacing } from '@/components/theme/tokens';
import { useTheme } from '@/components/theme/use-theme';
import { AppText } from '@/components/ui/app-text';
import { Icon } from '@/components/ui/icon';
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
  const { colors } = useTheme();
  const tags = booking.itemTags.length > 4 ? `${booking.itemTags.slice(0, 4).join(', ')} +${booking.itemTags.length - 4}` : booking.itemTags.join(', ');
  const who = showPerson ? `${booking.personName} · ` : '';
  return (
    <Link href={{ pathname: '/bookings/[id]', params: { id: String(booking.id) } }} asChild>
      <Pressable
        testID={`booking-row-${booking.id}`}
        accessibilityRole="link"
        accessibilityLabel={`Booking ${booking.id}, ${booking.status}${booking.overdue ? ', overdue' : ''}, ${formatWindow(booking.startsAt, booking.endsAt)}`}
        style={StyleSheet.flatten([styles.row, divided && { borderTopWidth: borders.hairline, borderTopColor: colors.border }])}
      >
        <View style={styles.text}>
          <BookingStatusBadge status={booking.status} overdue={booking.overdue} testID={`booking-row-${booking.id}-status`} />
          <AppText variant="bodyStrong">{`${formatWindow(booking.startsAt, booking.endsAt)} · ${formatKv(booking.plannedKv)}`}</AppText>
          <AppText variant="small" tone="muted">{`${who}#${booking.id} · ${booking.location} · ${tags}`}</AppText>
        </View>
        <Icon name="chevron-right" color={colors.textMuted} />
      </Pressable>
    </Link>
  );
}

const styles = StyleSheet.create({
  row: {
    flexDirection: 'row',
    alignItems: 'center',
    gap: spacing.sm,
    minHeight: layout.listRowMinHeight,
    paddingHorizontal: spacing.md,
    paddingVertical: spacing.sm,
  },
  text: { flex: 1, gap: spacing.xxs },
});
