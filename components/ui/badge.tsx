import { StyleSheet, View } from 'react-native';

import { borders, iconSizes, shapes, spacing } from '@/components/theme/tokens';
import { useTheme } from '@/components/theme/use-theme';

import { AppText } from './app-text';
import { Icon, type IconName } from './icon';

/** 'ok', 'held' and 'late' carry a state by colour as well as by their word and icon. */
type Tone = 'neutral' | 'primary' | 'muted' | 'ok' | 'held' | 'late';

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
    ok: colors.state.ok,
    held: colors.state.held,
    late: colors.state.late,
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
    borderRadius: shapes.chipRadius,
    borderWidth: borders.hairline,
    borderLeftWidth: shapes.railThickness,
  },
});
