import { StyleSheet, View } from 'react-native';

import { borders, hazardLevels, iconSizes, layout, radii, spacing, type HazardLevel } from '@/components/theme/tokens';
import { useTheme } from '@/components/theme/use-theme';

import { AppText } from './app-text';
import { Icon } from './icon';

interface HazardBadgeProps {
  level: HazardLevel;
  /** What the level is about, e.g. "Hazardous live above 50 V". The level's word always shows. */
  detail?: string;
  testID?: string;
}

/** A hazard level as safety colour + signal word + icon, so it never depends on colour alone. */
export function HazardBadge({ level, detail, testID }: HazardBadgeProps) {
  const { colors } = useTheme();
  const { fill, onFill, edge } = colors.hazard[level];
  const { word, icon } = hazardLevels[level];
  return (
    <View
      testID={testID}
      accessible
      accessibilityLabel={detail ? `${word}: ${detail}` : word}
      style={[styles.badge, { backgroundColor: fill, borderColor: edge }]}
    >
      <Icon name={icon} size={iconSizes.md} color={onFill} />
      <AppText variant="smallStrong" color={onFill}>
        {word.toUpperCase()}
      </AppText>
      {detail ? (
        <AppText variant="small" color={onFill}>
          {detail}
        </AppText>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  badge: {
    flexDirection: 'row',
    flexWrap: 'wrap',
    alignItems: 'center',
    alignSelf: 'flex-start',
    gap: spacing.xs,
    minHeight: layout.badgeMinHeight,
    paddingHorizontal: spacing.sm,
    paddingVertical: spacing.xxs,
    borderRadius: radii.sm,
    borderWidth: borders.control,
  },
});
