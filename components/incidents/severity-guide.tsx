import { StyleSheet, View } from 'react-native';

import { spacing } from '@/components/theme/tokens';
import { AppText } from '@/components/ui/app-text';
import { HazardBadge } from '@/components/ui/hazard-badge';
import { INCIDENT_SEVERITIES, incidentSeverityWords } from '@/shared/schemas/incidents';

import { severityHazard } from './incident-words';

/** The lab's four severities, each defined in words (the same text as the README). */
export function SeverityGuide({ testID = 'severity-guide' }: { testID?: string }) {
  return (
    <View style={styles.list} testID={testID}>
      {INCIDENT_SEVERITIES.map((severity) => (
        <View key={severity} style={styles.row}>
          <HazardBadge level={severityHazard[severity]} detail={incidentSeverityWords[severity].label} />
          <AppText variant="small">{incidentSeverityWords[severity].definition}</AppText>
        </View>
      ))}
      <AppText variant="small" tone="muted">
        For a near miss, rate what could reasonably have happened.
      </AppText>
    </View>
  );
}

const styles = StyleSheet.create({
  list: { gap: spacing.sm },
  row: { gap: spacing.xxs },
});
