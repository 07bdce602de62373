import { Link } from 'expo-router';
import { Pressable, StyleSheet } from 'react-native';

import { layout, spacing } from '@/components/theme/tokens';
import { useTheme } from '@/components/theme/use-theme';
import { AppText } from '@/components/ui/app-text';
import { Icon } from '@/components/ui/icon';

/** The way back to the list: the gear stack has no header bar, and a phone app has no back button. */
export function BackToGear() {
  const { colors } = useTheme();
  return (
    <Link href="/gear" asChild>
      <Pressable accessibilityRole="link" accessibilityLabel="Back to gear" style={styles.link} testID="back-to-gear">
        <Icon name="arrow-left" color={colors.primary} />
        <AppText variant="label" tone="primary">
          Gear
        </AppText>
      </Pressable>
    </Link>
  );
}

const styles = StyleSheet.create({
  link: { flexDirection: 'row', alignItems: 'center', alignSelf: 'flex-start', gap: spacing.xs, minHeight: layout.minTouchTarget, paddingRight: spacing.md },
});
