import { StyleSheet, View } from 'react-native';

import { InspectionBadge, StatusBadge } from '@/components/gear/item-badges';
import { borders, iconSizes, radii, spacing } from '@/components/theme/tokens';
import { useTheme } from '@/components/theme/use-theme';
import { AppText } from '@/components/ui/app-text';
import { Card } from '@/components/ui/card';
import { Icon } from '@/components/ui/icon';
import { KIND_LABELS, type Item } from '@/shared/schemas/items';

import { ItemSafetyNotice } from './item-safety-notice';
import { formatKv } from './rating-fields';

/** Who and what the item is, and whether it may be used: the part read at arm's length. */
export function ItemSummaryCard({ item }: { item: Item }) {
  const { colors } = useTheme();
  const makeModel = [item.make, item.model].filter((part) => part !== '').join(' ');
  return (
    <Card testID="item-summary">
      <View style={[styles.tag, { borderColor: colors.borderStrong }]}>
        <AppText variant="display" testID="item-tag" selectable>
          {item.tag}
        </AppText>
      </View>
      <View style={styles.kindRow}>
        <AppText variant="bodyStrong" testID="item-kind" style={styles.kind}>
          {KIND_LABELS[item.kind]}
        </AppText>
        <AppText variant="heading" testID="item-rated-kv" accessibilityLabel={`Rated ${formatKv(item.ratedKv)}`}>
          {formatKv(item.ratedKv)}
        </AppText>
      </View>
      <View style={styles.badges}>
        <StatusBadge status={item.status} testID="item-status" />
        <InspectionBadge state={item.inspectionState} testID="item-inspection-state" />
      </View>
      <ItemSafetyNotice item={item} />
      <View style={styles.line}>
        <Icon name="map-marker" size={iconSizes.sm} color={colors.textMuted} />
        <AppText testID="item-location">{`Kept at ${item.location}`}</AppText>
      </View>
      {makeModel !== '' || item.serial !== '' ? (
        <AppText tone="muted">{[makeModel, item.serial !== '' ? `Serial ${item.serial}` : ''].filter(Boolean).join(' · ')}</AppText>
      ) : null}
      {item.notes !== '' ? <AppText testID="item-notes">{item.notes}</AppText> : null}
    </Card>
  );
}

const styles = StyleSheet.create({
  tag: { alignSelf: 'flex-start', paddingHorizontal: spacing.sm, borderWidth: borders.control, borderRadius: radii.sm, borderStyle: 'dashed' },
  kindRow: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'baseline', justifyContent: 'space-between', gap: spacing.sm },
  kind: { flexShrink: 1 },
  badges: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.xs },
  line: { flexDirection: 'row', alignItems: 'center', gap: spacing.xs },
});
