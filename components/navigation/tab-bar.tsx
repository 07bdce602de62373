import { Link, usePathname } from 'expo-router';
import { Pressable, StyleSheet, View } from 'react-native';
import { useSafeAreaInsets } from 'react-native-safe-area-context';

import { borders, layout, shapes, spacing } from '@/components/theme/tokens';
import { useTheme } from '@/components/theme/use-theme';
import { AppText } from '@/components/ui/app-text';
import { Icon } from '@/components/ui/icon';
import { webA11y } from '@/components/ui/web-a11y';

import { isActive, tabEntries } from './nav-model';

/** The phone's bottom bar: five large targets within a thumb's reach. */
export function TabBar() {
  const { colors } = useTheme();
  const pathname = usePathname();
  const insets = useSafeAreaInsets();
  return (
    <View
      testID="tab-bar"
      role="navigation"
      accessibilityLabel="Main navigation"
      style={[styles.bar, { backgroundColor: colors.surface, borderTopColor: colors.border, paddingBottom: insets.bottom }]}
    >
      {tabEntries.map((entry) => {
        const active = isActive(entry, pathname);
        return (
          <Link key={entry.name} href={entry.href} asChild>
            <Pressable
              testID={`nav-${entry.name}`}
              accessibilityRole="link"
              accessibilityLabel={entry.label}
              {...webA11y({ current: active ? 'page' : undefined })}
              style={styles.item}
            >
              {/* Voltcrib's indicator: a rail along the top edge of the current tab (tokens.ts `shapes`). */}
              <View style={[styles.rail, active && { backgroundColor: colors.rail }]} />
              <Icon name={entry.icon} color={active ? colors.text : colors.textMuted} />
              <AppText variant={active ? 'smallStrong' : 'small'} color={active ? colors.text : colors.textMuted}>
                {entry.label}
              </AppText>
            </Pressable>
          </Link>
        );
      })}
    </View>
  );
}

const styles = StyleSheet.create({
  bar: { flexDirection: 'row', borderTopWidth: borders.hairline },
  item: {
    flex: 1,
    minHeight: layout.tabBarItemHeight,
    alignItems: 'center',
    justifyContent: 'center',
    gap: spacing.xxs,
    paddingVertical: spacing.xs,
  },
  rail: {
    position: 'absolute',
    top: 0,
    left: spacing.xs,
    right: spacing.xs,
    height: shapes.railThickness,
    borderBottomLeftRadius: shapes.chipRadius,
    borderBottomRightRadius: shapes.chipRadius,
  },
});
