import { Link, usePathname } from 'expo-router';
import { Pressable, ScrollView, StyleSheet, View } from 'react-native';
import { SafeAreaView } from 'react-native-safe-area-context';

import { roleLabels } from '@/components/common/roles';
import { borders, layout, shapes, spacing } from '@/components/theme/tokens';
import { useTheme } from '@/components/theme/use-theme';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Icon } from '@/components/ui/icon';
import { VoltcribLockup } from '@/components/ui/voltcrib-mark';
import { webA11y } from '@/components/ui/web-a11y';
import { useCurrentUser, useSignOutMutation } from '@/hooks/use-session';

import { isActive, roleEntries, tabEntries, toolEntries, type NavEntry } from './nav-model';

/** Wide screens: every entry the person's role allows, always in view, with who is signed in. */
export function SideNav() {
  const { colors } = useTheme();
  const user = useCurrentUser();
  const signOut = useSignOutMutation();
  const everyday = [...tabEntries.filter((entry) => entry.name !== 'more'), ...toolEntries()];
  const forRole = roleEntries(user?.role);
  const account = tabEntries.find((entry) => entry.name === 'more');

  return (
    <SafeAreaView
      edges={['top', 'bottom', 'left']}
      testID="side-nav"
      role="navigation"
      accessibilityLabel="Main navigation"
      style={[styles.root, { backgroundColor: colors.surface, borderRightColor: colors.border }]}
    >
      <ScrollView contentContainerStyle={styles.scroll}>
        <View style={styles.brand}>
          <VoltcribLockup />
        </View>
        <View style={styles.group}>
          {everyday.map((entry) => (
            <SideNavItem key={entry.name} entry={entry} />
          ))}
        </View>
        {forRole.length > 0 && user ? (
          <View style={styles.group}>
            <AppText variant="smallStrong" tone="muted" style={styles.groupTitle}>
              {roleLabels[user.role]}
            </AppText>
            {forRole.map((entry) => (
              <SideNavItem key={entry.name} entry={entry} />
            ))}
          </View>
        ) : null}
      </ScrollView>
      <View style={[styles.footer, { borderTopColor: colors.border }]}>
        {account && user ? (
          <SideNavItem entry={{ ...account, label: user.name, icon: 'account-circle' }} detail={`Account · ${roleLabels[user.role]}`} />
        ) : null}
        <Button
          label="Sign out"
          icon="logout"
          variant="secondary"
          block
          testID="sign-out"
          loading={signOut.isPending}
          loadingLabel="Signing out"
          onPress={() => signOut.mutate()}
        />
      </View>
    </SafeAreaView>
  );
}

function SideNavItem({ entry, detail }: { entry: NavEntry; detail?: string }) {
  const { colors } = useTheme();
  const pathname = usePathname();
  const active = isActive(entry, pathname);
  return (
    <Link href={entry.href} asChild>
      <Pressable
        testID={`nav-${entry.name}`}
        accessibilityRole="link"
        {...webA11y({ current: active ? 'page' : undefined })}
        // Link's asChild Slot takes one flat style object: no arrays (it throws in development)
        // and no style callbacks (dropped).
        // The current place: a rail down the item's left edge (tokens.ts `shapes`), on a neutral fill.
        style={StyleSheet.flatten([styles.item, active && { backgroundColor: colors.surfaceMuted, borderLeftColor: colors.rail }])}
      >
        <Icon name={entry.icon} color={active ? colors.text : colors.textMuted} />
        <View style={styles.itemText}>
          <AppText variant={active ? 'bodyStrong' : 'body'} color={colors.text} numberOfLines={1}>
            {entry.label}
          </AppText>
          {detail ? (
            <AppText variant="small" color={colors.textMuted} numberOfLines={1}>
              {detail}
            </AppText>
          ) : null}
        </View>
      </Pressable>
    </Link>
  );
}

const styles = StyleSheet.create({
  root: { width: layout.sideNavWidth, borderRightWidth: borders.hairline },
  scroll: { padding: spacing.md, gap: spacing.md },
  brand: { paddingHorizontal: spacing.xs, paddingVertical: spacing.xs },
  group: { gap: spacing.xxs },
  groupTitle: { paddingHorizontal: spacing.sm, paddingBottom: spacing.xxs, textTransform: 'uppercase' },
  item: {
    flexDirection: 'row',
    alignItems: 'center',
    gap: spacing.sm,
    minHeight: layout.minTouchTarget,
    paddingHorizontal: spacing.sm,
    paddingVertical: spacing.xxs,
    borderRadius: shapes.chipRadius,
    borderLeftWidth: shapes.railThickness,
    borderLeftColor: 'transparent',
  },
  itemText: { flex: 1 },
  footer: { padding: spacing.md, gap: spacing.xs, borderTopWidth: borders.hairline },
});
