import { Pressable, StyleSheet, View } from 'react-native';

import { formatDateTime } from '@/components/common/format';
import { roleLabels } from '@/components/common/roles';
import { borders, layout, spacing } from '@/components/theme/tokens';
import { useTheme } from '@/components/theme/use-theme';
import { AppText } from '@/components/ui/app-text';
import { Badge } from '@/components/ui/badge';
import { Card } from '@/components/ui/card';
import { Icon } from '@/components/ui/icon';
import { ListRow } from '@/components/ui/list-row';
import type { Person } from '@/hooks/use-people';

import { describeQualification, qualificationState } from './qualification';
import { QualificationBadge } from './qualification-badge';

interface PeopleListProps {
  people: Person[];
  today: string;
  onOpen: (person: Person) => void;
}

function lastSignIn(person: Person): string {
  return person.lastSignInAt ? formatDateTime(person.lastSignInAt) : 'Never';
}

/** Phone: one row per person; tapping opens what can be changed. */
export function PeopleList({ people, today, onOpen }: PeopleListProps) {
  return (
    <Card flush testID="people-list">
      {people.map((person, index) => (
        <ListRow
          key={person.id}
          testID={`person-${person.id}`}
          icon={person.active ? 'account' : 'account-off'}
          title={person.name}
          subtitle={[person.email, person.groupName, describeQualification(qualificationState(person.qualification, today)), `Last sign-in: ${lastSignIn(person)}`]
            .filter(Boolean)
            .join('\n')}
          trailing={<PersonBadges person={person} />}
          onPress={() => onOpen(person)}
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
  { key: 'qualification', label: 'HV qualification', flex: 4 },
  { key: 'status', label: 'Status', flex: 3 },
  { key: 'lastSignIn', label: 'Last sign-in', flex: 3 },
] as const;

/** Wide screens: the same people as a table; the name opens the person. */
export function PeopleTable({ people, today, onOpen }: PeopleListProps) {
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
        {people.map((person) => {
          const qualification = qualificationState(person.qualification, today);
          return (
            <View key={person.id} role="row" style={[styles.row, { borderTopColor: colors.border, borderTopWidth: borders.hairline }]}>
              <Cell flex={columns[0].flex}>
                <Pressable
                  testID={`person-${person.id}`}
                  accessibilityRole="button"
                  accessibilityLabel={`Manage ${person.name}`}
                  onPress={() => onOpen(person)}
                  style={styles.nameButton}
                >
                  <View style={styles.nameText}>
                    <AppText variant="bodyStrong" tone="primary" style={styles.underline}>
                      {person.name}
                    </AppText>
                    <AppText variant="small" tone="muted">
                      {person.email}
                    </AppText>
                  </View>
                  <Icon name="chevron-right" color={colors.textMuted} />
                </Pressable>
              </Cell>
              <Cell flex={columns[1].flex}>
                <Badge label={roleLabels[person.role]} tone={person.role === 'member' ? 'neutral' : 'primary'} />
              </Cell>
              <Cell flex={columns[2].flex}>
                <AppText tone={person.groupName ? 'default' : 'muted'}>{person.groupName ?? 'No group'}</AppText>
              </Cell>
              <Cell flex={columns[3].flex}>
                <QualificationBadge state={qualification} />
              </Cell>
              <Cell flex={columns[4].flex}>
                {person.active ? <Badge label="Active" icon="account-check" /> : <Badge label="Inactive" tone="muted" icon="account-off" />}
              </Cell>
              <Cell flex={columns[5].flex}>
                <AppText tone={person.lastSignInAt ? 'default' : 'muted'}>{lastSignIn(person)}</AppText>
              </Cell>
            </View>
          );
        })}
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
  nameButton: { minHeight: layout.minTouchTarget, flexDirection: 'row', alignItems: 'center', gap: spacing.xs },
  nameText: { flex: 1, minWidth: 0 },
  underline: { textDecorationLine: 'underline' },
});
