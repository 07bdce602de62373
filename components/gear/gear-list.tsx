import { StyleSheet, View } from 'react-native';

import { formatKv } from '@/components/items/rating-fields';
import { spacing } from '@/components/theme/tokens';
import { AppText } from '@/components/ui/app-text';
import { Card } from '@/components/ui/card';
import { LinkRow } from '@/components/ui/link-row';
import { KIND_LABELS, type ItemSummary } from '@/shared/schemas/items';

import { InspectionBadge, StatusBadge } from './item-badges';

/** Phone layout: one row per item, tag and rating on top where a glance finds them. */
export function GearList({ items }: { items: ItemSummary[] }) {
  return (
    <Card flush testID="gear-list">
      {items.map((item, index) => (
        <GearRow key={item.id} item={item} divided={index > 0} />
      ))}
    </Card>
  );
}

function GearRow({ item, divided }: { item: ItemSummary; divided: boolean }) {
  return (
    <LinkRow href={{ pathname: '/gear/[id]', params: { id: String(item.id) } }} testID={`gear-row-${item.id}`} divided={divided}>
      <View style={styles.topLine}>
        <AppText variant="smallStrong" tone="muted" style={styles.tag}>
          {item.tag}
        </AppText>
        <AppText variant="bodyStrong">{formatKv(item.ratedKv)}</AppText>
      </View>
      <AppText variant="bodyStrong">{item.name}</AppText>
      <AppText variant="small" tone="muted">
        {`${KIND_LABELS[item.kind]} · ${item.location}`}
      </AppText>
      <View style={styles.badges}>
        <StatusBadge status={item.status} />
        <InspectionBadge state={item.inspectionState} />
      </View>
    </LinkRow>
  );
}

const styles = StyleSheet.create({
  topLine: { flexDirection: 'row', justifyContent: 'space-between', alignItems: 'baseline', gap: spacing.sm },
  tag: { letterSpacing: 0.5 },
  badges: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.xs, paddingTop: spacing.xxs },
});
