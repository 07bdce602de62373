import { StyleSheet, View } from 'react-native';

import { borders, iconSizes, radii, spacing } from '@/components/theme/tokens';
import { useTheme } from '@/components/theme/use-theme';

import { AppText } from './app-text';
import { Icon, type IconName } from './icon';

type Tone = 'neutral' | 'primary' | 'muted';

interface BadgeProps {
  label: string;
  tone?: Tone;
  icon?: IconName;
  testID?: string;
}

/** A short status word (a role, "Active"). Hazards use HazardBadge, never this. */
export function Badge({ label, tone = 'neutral', icon, testID }: BadgeProps) {
  const { colors } = useTheme();
  const palette = {
    neutral: { fill: colors.surface, text: colors.text, edge: colors.borderStrong },
    primary: { fill: colors.primarySoft, text: colors.onPrimarySoft, edge: colors.primary },
    muted: { fill: colors.surfaceMuted, text: colors.textMuted, edge: colors.border },
  }[tone];
  return (
    <View testID={testID} style={[styles.badge, { backgroundColor: palette.fill, borderColor: palette.edge }]}>
      {icon ? <Icon name={icon} size={iconSizes.sm} color={palette.text} /> : null}
      <AppText variant="smallStrong" color={palette.text}>
        {label}
      </AppText>
    </View>
  );
}

const styles = StyleSheet.create({
  badge: {
    flexDirection: 'row',
    alignItems: 'center',
    alignSelf: 'flex-start',
    gap: spacing.xxs,
    paddingHorizontal: spacing.sm,
    paddingVertical: spacing.xxs,
    borderRadius: radii.pill,
    borderWidth: borders.hairline,
  },
});
