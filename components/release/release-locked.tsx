import { StyleSheet, View } from 'react-native';

import { spacing } from '@/components/theme/tokens';
import { AppText } from '@/components/ui/app-text';
import { Badge } from '@/components/ui/badge';
import { useLabTimeZone } from '@/hooks/use-session';
import { zonedTimeWords } from '@/shared/zoned-time';

/**
 * Before the window opens the counter has nothing to do: scanning and the checklist wait too, so
 * nobody answers a checklist for tomorrow that the gate would then hold against today's bench.
 * The time is on the lab's clock and names it (never a raw UTC timestamp).
 */
export function ReleaseLocked({ opensAt, earlyMinutes }: { opensAt: string; earlyMinutes: number }) {
  const zone = useLabTimeZone();
  return (
    <View style={styles.box} testID="release-locked">
      <Badge label="Locked until the window opens" icon="timer-sand" tone="muted" />
      <AppText variant="bodyStrong" testID="release-opens-at">{`Opens at ${zonedTimeWords(opensAt, zone)}`}</AppText>
      <AppText tone="muted">
        {`That is ${earlyMinutes > 0 ? `${earlyMinutes} minutes before the booking starts (the lab's early pick-up)` : 'when the booking starts'}. Scanning, the pre-energize checklist and release start then.`}
      </AppText>
    </View>
  );
}

const styles = StyleSheet.create({
  box: { gap: spacing.sm },
});
