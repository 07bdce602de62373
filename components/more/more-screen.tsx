import { StyleSheet, View } from 'react-native';

import { LazyCalendarFeedCard } from '@/components/calendar/lazy-calendar-feed-card';
import { roleLabels } from '@/components/common/roles';
import { roleEntries, toolEntries, type NavEntry } from '@/components/navigation/nav-model';
import { setThemePreference, useThemePreference } from '@/components/theme/theme-preference';
import { spacing } from '@/components/theme/tokens';
import { AppText } from '@/components/ui/app-text';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { ChoiceChips } from '@/components/ui/choice-chips';
import { ListRow } from '@/components/ui/list-row';
import { Screen } from '@/components/ui/screen';
import { useBreakpoints } from '@/hooks/use-breakpoints';
import { useCurrentUser, useSignOutMutation } from '@/hooks/use-session';

const THEME_CHOICES = [
  { value: 'system', label: 'Same as this device' },
  { value: 'light', label: 'Light' },
  { value: 'dark', label: 'Dark' },
] as const;

/**
 * On a phone: everything past the bottom bar (tools, the role's screens) and sign-out.
 * On a wide screen those live in the side navigation, so this is only the account.
 */
export function MoreScreen() {
  const user = useCurrentUser();
  const signOut = useSignOutMutation();
  const { isWide } = useBreakpoints();
  const forRole = roleEntries(user?.role);
  const preference = useThemePreference();

  return (
    <Screen testID="more-screen" title={isWide ? 'Account' : 'More'}>
      {user ? (
        <Card title="Signed in as">
          <View style={styles.account}>
            <AppText variant="bodyStrong">{user.name}</AppText>
            <AppText tone="muted">{user.email}</AppText>
            <Badge label={roleLabels[user.role]} tone="primary" icon="badge-account" />
          </View>
        </Card>
      ) : null}

      {user ? <LazyCalendarFeedCard role={user.role} /> : null}

      <Card title="Appearance">
        <ChoiceChips label="Colours" testID="theme-choice" choices={THEME_CHOICES} value={preference} onChange={setThemePreference} />
        <AppText variant="small" tone="muted">
          Same as this device follows the system setting, light or dark as it changes.
        </AppText>
      </Card>

      {isWide ? (
        <AppText tone="muted">Everything else is in the navigation on the left.</AppText>
      ) : (
        <>
          <EntryList title="Tools" entries={toolEntries()} />
          {user && forRole.length > 0 ? <EntryList title={roleLabels[user.role]} entries={forRole} /> : null}
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
        </>
      )}
    </Screen>
  );
}

function EntryList({ title, entries }: { title: string; entries: NavEntry[] }) {
  return (
    <Card title={title} flush>
      {entries.map((entry, index) => (
        <ListRow key={entry.name} testID={`nav-${entry.name}`} title={entry.label} icon={entry.icon} href={entry.href} divided={index > 0} />
      ))}
    </Card>
  );
}

const styles = StyleSheet.create({
  account: { gap: spacing.xs },
});
