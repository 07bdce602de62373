import { StyleSheet, View } from 'react-native';

import { formatDay } from '@/components/items/format-dates';
import { spacing } from '@/components/theme/tokens';
import { AppText } from '@/components/ui/app-text';
import { Card } from '@/components/ui/card';
import { HazardBadge } from '@/components/ui/hazard-badge';
import { ListRow } from '@/components/ui/list-row';
import { useIncidentsQuery, usePastDueActionsQuery } from '@/hooks/use-incidents';
import type { Role } from '@/shared/schemas/session';

import { IncidentRow } from './incident-row';

/**
 * Today's incident work: for an officer the reports waiting for review; for everyone the
 * corrective actions past their due date (their own; every one for an officer). Nothing shows
 * when there is nothing to do.
 */
export function TodayIncidents({ role }: { role: Role }) {
  return (
    <>
      {role === 'officer' ? <IncidentsToReview /> : null}
      <ActionsPastDue role={role} />
    </>
  );
}

function IncidentsToReview() {
  const open = useIncidentsQuery({ status: 'open' });
  const rows = open.data ?? [];
  if (rows.length === 0) return null;
  return (
    <Card title={`Incidents to review (${rows.length})`} flush testID="today-incidents">
      {rows.slice(0, 5).map((incident, index) => (
        <IncidentRow key={incident.id} incident={incident} divided={index > 0} />
      ))}
      {rows.length > 5 ? <ListRow title={`All ${rows.length} open incidents`} icon="chevron-right" href="/incidents" divided /> : null}
    </Card>
  );
}

function ActionsPastDue({ role }: { role: Role }) {
  const actions = usePastDueActionsQuery();
  const rows = actions.data ?? [];
  if (rows.length === 0) return null;
  return (
    <Card title="Corrective actions past due" testID="today-actions-past-due">
      <HazardBadge level="warning" detail={`${rows.length} past due`} />
      <View style={styles.list}>
        {rows.slice(0, 8).map((a, index) => (
          <ListRow
            key={a.id}
            title={a.action}
            subtitle={`${role === 'officer' ? `${a.ownerName} · ` : ''}due ${formatDay(a.dueOn)} · incident #${a.incidentId}`}
            icon="clock-alert"
            href={{ pathname: '/incidents/[id]', params: { id: String(a.incidentId) } }}
            divided={index > 0}
          />
        ))}
      </View>
      {rows.length > 8 ? <AppText tone="muted">{`And ${rows.length - 8} more.`}</AppText> : null}
    </Card>
  );
}

const styles = StyleSheet.create({
  list: { marginHorizontal: -spacing.md },
});
