import { StyleSheet, View } from 'react-native';

import { borders, radii, spacing } from '@/components/theme/tokens';
import { useTheme } from '@/components/theme/use-theme';
import { AppText } from '@/components/ui/app-text';
import { HazardBadge } from '@/components/ui/hazard-badge';
import { SAFETY_CAUTION } from '@/shared/rules/assessment';

interface SafetyCautionProps {
  /** Cautions particular to this setup (from the assessment), shown above the general words. */
  cautions?: string[];
  testID?: string;
}

/** The standing caution every screen that plans or releases a test carries. */
export function SafetyCaution({ cautions = [], testID = 'safety-caution' }: SafetyCautionProps) {
  const { colors } = useTheme();
  return (
    <View
      testID={testID}
      role="note"
      aria-label="Safety caution"
      style={[styles.box, { borderColor: colors.hazard.warning.edge, backgroundColor: colors.surface }]}
    >
      <HazardBadge level="warning" detail="High voltage" />
      {cautions.map((caution) => (
        <AppText key={caution} variant="bodyStrong">
          {caution}
        </AppText>
      ))}
      <AppText>{SAFETY_CAUTION}</AppText>
    </View>
  );
}

const styles = StyleSheet.create({
  box: { gap: spacing.sm, padding: spacing.md, borderWidth: borders.control, borderLeftWidth: spacing.xs, borderRadius: radii.md },
});
