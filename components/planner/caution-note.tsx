import { StyleSheet, View } from 'react-native';

import { borders, radii, spacing } from '@/components/theme/tokens';
import { useTheme } from '@/components/theme/use-theme';
import { AppText } from '@/components/ui/app-text';
import { HazardBadge } from '@/components/ui/hazard-badge';
import { SAFETY_CAUTION } from '@/shared/rules/assessment';

/** The standing caution every screen that plans a high-voltage test shows. */
export function CautionNote() {
  const { colors } = useTheme();
  return (
    <View testID="planner-caution" role="note" style={[styles.box, { borderColor: colors.hazard.caution.edge, backgroundColor: colors.surface }]}>
      <HazardBadge level="caution" detail="Before you rely on these numbers" />
      <AppText>{SAFETY_CAUTION}</AppText>
    </View>
  );
}

const styles = StyleSheet.create({
  box: { gap: spacing.xs, padding: spacing.md, borderWidth: borders.control, borderLeftWidth: spacing.xs, borderRadius: radii.md },
});
