import { Link, type Href } from 'expo-router';
import { Pressable, StyleSheet } from 'react-native';

import { layout, spacing } from '@/components/theme/tokens';
import { useTheme } from '@/components/theme/use-theme';
import { AppText } from '@/components/ui/app-text';
import { Icon } from '@/components/ui/icon';

/** Up one level, as a real link: a phone that opened a deep link has no history to go back through. */
export function BackLink({ href, label }: { href: Href; label: string }) {
  const { colors } = useTheme();
  return (
    <Link href={href} asChild>
      <Pressable accessibilityRole="link" accessibilityLabel={`Back to ${label}`} testID="back-link" style={styles.link}>
        <Icon name="arrow-left" color={colors.primary} />
        <AppText variant="label" tone="primary">
          {label}
        </AppText>
      </Pressable>
    </Link>
  );
}

const styles = StyleSheet.create({
  link: { flexDirection: 'row', alignItems: 'center', alignSelf: 'flex-start', gap: spacing.xs, minHeight: layout.minTouchTarget, paddingRight: spacing.md },
});
