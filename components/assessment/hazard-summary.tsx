import { StyleSheet, View } from 'react-native';

import { spacing } from '@/components/theme/tokens';
import { AppText } from '@/components/ui/app-text';
import { HazardBadge } from '@/components/ui/hazard-badge';
import type { Assessment } from '@/shared/schemas/assessment';

import { SourceLine } from './source-line';

/** Hazardous live or not, by the IEC 61010-1 limits the shared physics applies. */
export function HazardSummary({ assessment, testID = 'assessment-hazard' }: { assessment: Assessment; testID?: string }) {
  const { hazard } = assessment;
  return (
    <View style={styles.root} testID={testID}>
      {hazard.hazardous ? (
        <HazardBadge level="danger" detail="Hazardous live" testID={`${testID}-badge`} />
      ) : (
        <HazardBadge level="caution" detail="Below the hazardous-live limits" testID={`${testID}-badge`} />
      )}
      <AppText>{hazard.explanation}</AppText>
      <SourceLine>{hazard.source}</SourceLine>
    </View>
  );
}

const styles = StyleSheet.create({
  root: { gap: spacing.xs },
});
