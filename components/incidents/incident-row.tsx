import { StyleSheet, View } from 'react-native';

import { formatDateTime } from '@/components/common/format';
import { spacing } from '@/components/theme/tokens';
import { AppText } from '@/components/ui/app-text';
import { Badge } from '@/components/ui/badge';
import { HazardBadge } from '@/components/ui/hazard-badge';
import { ListRow } from '@/components/ui/list-row';
import type { IncidentSummary } from '@/hooks/use-incidents';

import { kindLabel, severityHazard, severityLabel, statusLabel } from './incident-words';

/** One report in a list: kind, severity (colour, word and icon), status, when, where, gear. */
export function IncidentRow({ incident, divided }: { incident: IncidentSummary; divided: boolean }) {
  const tags = incident.items.map((i) => i.tag);
  return (
    <View>
      <ListRow
        testID={`incident-row-${incident.id}`}
        title={`#${incident.id} ${kindLabel(incident.kind)}`}
        subtitle={[formatDateTime(incident.occurredAt), incident.location, tags.length > 0 ? tags.join(', ') : null].filter(Boolean).join(' · ')}
        icon="alert-octagon"
        href={{ pathname: '/incidents/[id]', params: { id: String(incident.id) } }}
        divided={divided}
      />
      <View style={styles.badges}>
        <HazardBadge level={severityHazard[incident.severity]} detail={severityLabel(incident.severity)} />
        <Badge
          label={statusLabel(incident.status)}
          tone={incident.status === 'closed' ? 'muted' : 'primary'}
          icon={incident.status === 'closed' ? 'check-circle' : 'clock-outline'}
        />
        {incident.openActions > 0 ? (
          <AppText variant="small" tone="muted">{`${incident.openActions} action${incident.openActions === 1 ? '' : 's'} open`}</AppText>
        ) : null}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  badges: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: spacing.xs, paddingHorizontal: spacing.md, paddingBottom: spacing.sm },
});
