import { StyleSheet, View } from 'react-native';

import { spacing } from '@/components/theme/tokens';
import { Badge } from '@/components/ui/badge';
import { HazardBadge } from '@/components/ui/hazard-badge';
import type { IconName } from '@/components/ui/icon';
import type { BookingStatus } from '@/shared/schemas/bookings';

// Colour carries the states that decide what happens next (approved against awaiting or refused),
// always beside the word and the icon.
export const statusWords: Record<BookingStatus, { label: string; icon: IconName; tone: 'neutral' | 'primary' | 'muted' | 'ok' | 'held' | 'late' }> = {
  requested: { label: 'Booked', icon: 'clock-outline', tone: 'neutral' },
  'awaiting-approval': { label: 'Awaiting approval', icon: 'timer-sand', tone: 'held' },
  approved: { label: 'Approved', icon: 'check-circle', tone: 'ok' },
  refused: { label: 'Refused', icon: 'close-circle', tone: 'late' },
  released: { label: 'Released', icon: 'lock-open-variant', tone: 'primary' },
  returned: { label: 'Returned', icon: 'package-variant-closed', tone: 'muted' },
  cancelled: { label: 'Cancelled', icon: 'cancel', tone: 'muted' },
};

interface BookingStatusBadgeProps {
  status: BookingStatus;
  overdue: boolean;
  testID?: string;
}

/**
 * A booking's state as a word and an icon. Overdue gear is out past its end, possibly still
 * connected: it takes the warning hazard badge so it cannot be missed in a list.
 */
export function BookingStatusBadge({ status, overdue, testID }: BookingStatusBadgeProps) {
  const words = statusWords[status];
  return (
    <View style={styles.row} testID={testID}>
      <Badge label={words.label} icon={words.icon} tone={words.tone} testID={testID ? `${testID}-${status}` : undefined} />
      {overdue ? <HazardBadge level="warning" detail="Overdue" testID={testID ? `${testID}-overdue` : undefined} /> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.xs, alignItems: 'center' },
});
