import { StyleSheet, View } from 'react-native';

import { borders, spacing } from '@/components/theme/tokens';
import { useTheme } from '@/components/theme/use-theme';
import { AppText } from '@/components/ui/app-text';
import { Icon } from '@/components/ui/icon';
import { useOnlineStatus } from '@/hooks/use-online-status';

/**
 * Shown above every screen while the connection is down. The app shell still opens from the
 * service worker's cache, but no gear can be released, booked or returned without the server,
 * and anything on screen was loaded earlier: the notice says both, so nothing fails silently
 * and nothing stale passes for current.
 */
export function OfflineNotice() {
  const online = useOnlineStatus();
  const { colors } = useTheme();
  if (online) return null;
  const tone = colors.hazard.warning;
  return (
    <View
      testID="offline-notice"
      accessibilityRole="alert"
      accessibilityLiveRegion="assertive"
      style={[styles.bar, { backgroundColor: tone.fill, borderColor: tone.edge }]}
    >
      <Icon name="alert" color={tone.onFill} />
      <View style={styles.words}>
        <AppText variant="bodyStrong" color={tone.onFill}>
          Offline: no connection to the Voltcrib server.
        </AppText>
        <AppText color={tone.onFill}>
          Nothing can be released, booked or returned until the connection is back. Anything shown was loaded earlier and may be out of date.
        </AppText>
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  bar: {
    flexDirection: 'row',
    alignItems: 'flex-start',
    gap: spacing.sm,
    paddingHorizontal: spacing.md,
    paddingVertical: spacing.sm,
    borderBottomWidth: borders.control,
  },
  words: { flex: 1, gap: spacing.xs },
});
