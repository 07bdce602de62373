import { StyleSheet, View } from 'react-native';

import { formatDateTime } from '@/components/common/format';
import { roleLabels } from '@/components/common/roles';
import { borders, spacing } from '@/components/theme/tokens';
import { useTheme } from '@/components/theme/use-theme';
import { AppText } from '@/components/ui/app-text';
import { Badge } from '@/components/ui/badge';
import { Card } from '@/components/ui/card';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { ListRow } from '@/components/ui/list-row';
import { LoadingState } from '@/components/ui/loading-state';
import { Screen } from '@/components/ui/screen';
import { useBreakpoints } from '@/hooks/use-breakpoints';
import { usePeopleQuery, type Person } from '@/hooks/use-people';

export function PeopleScreen() {
  const people = usePeopleQuery();
  const { isWide } = useBreakpoints();

  return (
    <Screen testID="people-screen" title="People" width={isWide ? 'wide' : 'regular'}>
      <AppText tone="muted">Everyone who can sign in to this lab&apos;s Voltcrib, and what they may do.</AppText>
      {people.isPending ? (
        <LoadingState label="Loading people" testID="people-loading" />
      ) : people.isError ? (
        <ErrorState
          testID="people-error"
          title="The people list did not load"
          error={people.error}
          onRetry={() => void people.refetch()}
          retrying={people.isRefetching}
        />
      ) : people.data.length === 0 ? (
        <EmptyState
          testID="people-empty"
          icon="account-group"
          title="No one here yet"
          message="People appear here once they are added to this lab."
        />
      ) : isWide ? (
        <PeopleTable people={people.data} />
      ) : (
        <PeopleList people={people.data} />
      )}
    </Screen>
  );
}

function lastSignIn(person: Person): string {
  return person.lastSignInAt ? formatDateTime(person.lastSignInAt) : 'Never';
}

function PeopleList({ people }: { people: Person[] }) {
  return (
    <Card flush testID="people-list">
      {people.map((person, index) => (
        <ListRow
          key={person.id}
          testID={`person-${person.id}`}
          icon="account"
          title={person.name}
          subtitle={[person.email, person.groupName, `Last sign-in: ${lastSignIn(person)}`].filter(Boolean).join('\n')}
          trailing={<PersonBadges person={person} />}
          divided={index > 0}
        />
      ))}
    </Card>
  );
}

function PersonBadges({ person }: { person: Person }) {
  return (
    <View style={styles.badges}>
      <Badge label={roleLabels[person.role]} tone={person.role === 'member' ? 'neutral' : 'primary'} />
      {person.active ? null : <Badge label="Inactive" tone="muted" icon="account-off" />}
    </View>
  );
}

const columns = [
  { key: 'person', label: 'Name and e-mail', flex: 6 },
  { key: 'role', label: 'Role', flex: 3 },
  { key: 'group', label: 'Group', flex: 3 },
  { key: 'status', label: 'Status', flex: 3 },
  { key: 'lastSignIn', label: 'Last sign-in', flex: 3 },
] as const;

function PeopleTable({ people }: { people: Person[] }) {
  const { colors } = useTheme();
  return (
    <Card flush testID="people-table">
      <View role="table" accessibilityLabel="People">
        <View role="row" style={[styles.row, { backgroundColor: colors.surfaceMuted }]}>
          {columns.map((column) => (
            <View key={column.key} role="columnheader" style={[styles.cell, { flex: column.flex }]}>
              <AppText variant="smallStrong" tone="muted">
                {column.label}
              </AppText>
            </View>
          ))}
        </View>
        {people.map((person) => (
          <View
            key={person.id}
            role="row"
            testID={`person-${person.id}`}
            style={[styles.row, { borderTopColor: colors.border, borderTopWidth: borders.hairline }]}
          >
            <Cell flex={columns[0].flex}>
              <AppText variant="bodyStrong">{person.name}</AppText>
              <AppText variant="small" tone="muted">
                {person.email}
              </AppText>
            </Cell>
            <Cell flex={columns[1].flex}>
              <Badge label={roleLabels[person.role]} tone={person.role === 'member' ? 'neutral' : 'primary'} />
            </Cell>
            <Cell flex={columns[2].flex}>
              <AppText tone={person.groupName ? 'default' : 'muted'}>{person.groupName ?? 'No group'}</AppText>
            </Cell>
            <Cell flex={columns[3].flex}>
              {person.active ? (
                <Badge label="Active" icon="account-check" />
              ) : (
                <Badge label="Inactive" tone="muted" icon="account-off" />
              )}
            </Cell>
            <Cell flex={columns[4].flex}>
              <AppText tone={person.lastSignInAt ? 'default' : 'muted'}>{lastSignIn(person)}</AppText>
            </Cell>
          </View>
        ))}
      </View>
    </Card>
  );
}

function Cell({ flex, children }: { flex: number; children: React.ReactNode }) {
  return (
    <View role="cell" style={[styles.cell, { flex }]}>
      {children}
    </View>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', alignItems: 'center', paddingHorizontal: spacing.xs },
  cell: { paddingHorizontal: spacing.xs, paddingVertical: spacing.sm, minWidth: 0 },
  badges: { alignItems: 'flex-end', gap: spacing.xxs },
});
