import { StyleSheet, View } from 'react-native';

import { spacing } from '@/components/theme/tokens';
import { AppText } from '@/components/ui/app-text';
import { Badge } from '@/components/ui/badge';
import { HazardBadge } from '@/components/ui/hazard-badge';
import type { Assessment } from '@/shared/schemas/assessment';

/** The grounding stick, stand and (above the interlock voltage) interlock the set must carry. */
export function CompanionsList({ assessment, testID = 'assessment-companions' }: { assessment: Assessment; testID?: string }) {
  if (assessment.missingCompanions.length === 0) {
    return (
      <View style={styles.root} testID={testID}>
        <Badge label="Grounding stick, stand and any interlock needed are in the set" icon="check-circle" />
      </View>
    );
  }
  return (
    <View style={styles.root} testID={testID}>
      {assessment.missingCompanions.map((missing) => (
        <View key={missing.code} style={styles.item} testID={`${testID}-${missing.code}`}>
          <HazardBadge level="warning" detail="Missing from the set" />
          <AppText variant="bodyStrong">{missing.message}</AppText>
        </View>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  root: { gap: spacing.sm },
  item: { gap: spacing.xxs },
});
