// An item's status and inspection state as word + icon (never colour alone). These are registry
// states, not hazard levels, so they do not borrow the safety colours: a state that stops the
// item from being released is drawn in the error ink with a heavier edge instead.
import { StyleSheet, View } from 'react-native';

import { borders, iconSizes, shapes, spacing } from '@/components/theme/tokens';
import { useTheme } from '@/components/theme/use-theme';
import { AppText } from '@/components/ui/app-text';
import { Icon, type IconName } from '@/components/ui/icon';
import type { InspectionState, ItemStatus } from '@/shared/schemas/items';

type Tone = 'ok' | 'blocking' | 'muted';

interface StateLook {
  word: string;
  icon: IconName;
  tone: Tone;
}

export const STATUS_LOOKS: Record<ItemStatus, StateLook> = {
  'in-service': { word: 'In service', icon: 'check-circle', tone: 'ok' },
  'out-of-service': { word: 'Out of service', icon: 'tag-off', tone: 'blocking' },
  retired: { word: 'Retired', icon: 'archive', tone: 'muted' },
};

export const INSPECTION_LOOKS: Record<InspectionState, StateLook> = {
  // About dates, not results (a calendar, not a tick): a failed inspection also starts a new
  // interval, and the failure shows as the item's out-of-service status beside this badge.
  current: { word: 'Inspected', icon: 'calendar-check', tone: 'ok' },
  'due-soon': { word: 'Inspection due soon', icon: 'calendar-clock', tone: 'ok' },
  overdue: { word: 'Inspection overdue', icon: 'calendar-alert', tone: 'blocking' },
  never: { word: 'Never inspected', icon: 'help-circle', tone: 'blocking' },
};

function StateBadge({ look, testID }: { look: StateLook; testID?: string }) {
  const { colors } = useTheme();
  const palette = {
    ok: { text: colors.text, edge: colors.borderStrong, fill: colors.surface, width: borders.hairline },
    blocking: { text: colors.errorText, edge: colors.errorText, fill: colors.surface, width: borders.control },
    muted: { text: colors.textMuted, edge: colors.border, fill: colors.surfaceMuted, width: borders.hairline },
  }[look.tone];
  return (
    <View testID={testID} style={[styles.badge, { backgroundColor: palette.fill, borderColor: palette.edge, borderWidth: palette.width }]}>
      <Icon name={look.icon} size={iconSizes.sm} color={palette.text} />
      <AppText variant="smallStrong" color={palette.text}>
        {look.word}
      </AppText>
    </View>
  );
}

export function StatusBadge({ status, testID }: { status: ItemStatus; testID?: string }) {
  return <StateBadge look={STATUS_LOOKS[status]} testID={testID} />;
}

export function InspectionBadge({ state, testID }: { state: InspectionState; testID?: string }) {
  return <StateBadge look={INSPECTION_LOOKS[state]} testID={testID} />;
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
  },
});
