// The item's next safety step, at the top of its page: what stops it from being used, or that
// nothing does. A tagged-out item carries the trade's lockout/tagout danger tag (red, DANGER,
// "do not use"); registry states that only block a release are said in words, not safety colours.
import { StyleSheet, View } from 'react-native';

import { borders, iconSizes, radii, spacing } from '@/components/theme/tokens';
import { useTheme } from '@/components/theme/use-theme';
import { AppText } from '@/components/ui/app-text';
import { HazardBadge } from '@/components/ui/hazard-badge';
import { Icon, type IconName } from '@/components/ui/icon';
import type { Item } from '@/shared/schemas/items';

import { formatDay } from './format-dates';

export function ItemSafetyNotice({ item }: { item: Item }) {
  if (item.status === 'out-of-service') {
    return (
      <View style={styles.stack} testID="item-safety-notice">
        <HazardBadge level="danger" detail="Out of service: do not use" testID="item-tagged-out" />
        <AppText variant="bodyStrong" testID="item-status-reason">
          {item.statusReason ? `Reason: ${item.statusReason}` : 'No reason was recorded.'}
        </AppText>
        <AppText tone="muted">Next step: repair it, record a passing inspection, then a lab manager clears the tag.</AppText>
      </View>
    );
  }
  if (item.status === 'retired') {
    return (
      <Notice icon="archive" tone="muted" testID="item-safety-notice">
        {`Retired${item.statusReason ? `: ${item.statusReason}` : ''}. Kept for the record; it cannot be booked or changed.`}
      </Notice>
    );
  }
  if (item.inspectionState === 'overdue' || item.inspectionState === 'never') {
    return (
      <Notice icon="calendar-alert" tone="blocking" testID="item-safety-notice">
        {item.inspectionState === 'never'
          ? 'Never inspected: it cannot be released for a test until it passes an inspection.'
          : `Inspection overdue since ${formatDay(item.nextInspectionDue ?? '')}: it cannot be released until it passes one.`}
      </Notice>
    );
  }
  return (
    <Notice icon="check-circle" tone="ok" testID="item-safety-notice">
      {`In service and inspected; next inspection due ${formatDay(item.nextInspectionDue ?? '')}. Check it for damage before every use.`}
    </Notice>
  );
}

interface NoticeProps {
  icon: IconName;
  tone: 'ok' | 'blocking' | 'muted';
  testID?: string;
  children: string;
}

function Notice({ icon, tone, testID, children }: NoticeProps) {
  const { colors } = useTheme();
  const ink = tone === 'blocking' ? colors.errorText : tone === 'muted' ? colors.textMuted : colors.text;
  const edge = tone === 'blocking' ? colors.errorText : colors.border;
  return (
    <View testID={testID} style={[styles.notice, { borderColor: edge, backgroundColor: colors.surface }]}>
      <Icon name={icon} size={iconSizes.md} color={ink} />
      <AppText variant="bodyStrong" color={ink} style={styles.text}>
        {children}
      </AppText>
    </View>
  );
}

const styles = StyleSheet.create({
  stack: { gap: spacing.xs },
  notice: {
    flexDirection: 'row',
    alignItems: 'flex-start',
    gap: spacing.sm,
    padding: spacing.sm,
    borderWidth: borders.control,
    borderLeftWidth: spacing.xs,
    borderRadius: radii.md,
  },
  text: { flex: 1 },
});
