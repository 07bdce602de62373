import { Pressable, StyleSheet, View } from 'react-native';

import { formatDateTime } from '@/components/common/format';
import { roleLabels } from '@/components/common/roles';
import { layout, spacing } from '@/components/theme/tokens';
import { useTheme } from '@/components/theme/use-theme';
import { AppText } from '@/components/ui/app-text';
import { Badge } from '@/components/ui/badge';
import { Card } from '@/components/ui/card';
import { Icon } from '@/components/ui/icon';
import { ListRow } from '@/components/ui/list-row';
import { Table, TableCell, TableRow } from '@/components/ui/table';
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
          subtitle={[
            person.email,
            person.groupName,
            describeQualification(qualificationState(person.qualification, today)),
            `Last sign-in: ${lastSignIn(person)}`,
          ]
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
  const [nameColumn, roleColumn, groupColumn, qualificationColumn, statusColumn, lastSignInColumn] = columns;
  return (
    <Card flush testID="people-table">
      <Table label="People" columns={columns}>
        {people.map((person) => (
          <TableRow key={person.id}>
            <TableCell column={nameColumn}>
              <Pressable testID={`person-${person.id}`} accessibilityRole="button" onPress={() => onOpen(person)} style={styles.nameButton}>
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
            </TableCell>
            <TableCell column={roleColumn}>
              <Badge label={roleLabels[person.role]} tone={person.role === 'member' ? 'neutral' : 'primary'} />
            </TableCell>
            <TableCell column={groupColumn}>
              <AppText tone={person.groupName ? 'default' : 'muted'}>{person.groupName ?? 'No group'}</AppText>
            </TableCell>
            <TableCell column={qualificationColumn}>
              <QualificationBadge state={qualificationState(person.qualification, today)} />
            </TableCell>
            <TableCell column={statusColumn}>
              {person.active ? <Badge label="Active" icon="account-check" /> : <Badge label="Inactive" tone="muted" icon="account-off" />}
            </TableCell>
            <TableCell column={lastSignInColumn}>
              <AppText tone={person.lastSignInAt ? 'default' : 'muted'}>{lastSignIn(person)}</AppText>
            </TableCell>
          </TableRow>
        ))}
      </Table>
    </Card>
  );
}

const styles = StyleSheet.create({
  badges: { alignItems: 'flex-end', gap: spacing.xxs },
  nameButton: { minHeight: layout.minTouchTarget, flexDirection: 'row', alignItems: 'center', gap: spacing.xs },
  nameText: { flex: 1, minWidth: 0 },
  underline: { textDecorationLine: 'underline' },
});
