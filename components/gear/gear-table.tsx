import { Link, router } from 'expo-router';
import { StyleSheet } from 'react-native';

import { formatDay } from '@/components/items/format-dates';
import { formatKv } from '@/components/items/rating-fields';
import { layout, spacing } from '@/components/theme/tokens';
import { AppText } from '@/components/ui/app-text';
import { Card } from '@/components/ui/card';
import { Table, TableCell, TableRow } from '@/components/ui/table';
import { KIND_LABELS, type ItemSummary } from '@/shared/schemas/items';

import { InspectionBadge, StatusBadge } from './item-badges';

const columns = [
  { key: 'item', label: 'Tag, name and place', flex: 5 },
  { key: 'rated', label: 'Rated', flex: 2 },
  { key: 'status', label: 'Status', flex: 3 },
  { key: 'inspection', label: 'Inspection', flex: 4 },
] as const;

/**
 * Wide layout: the same items as a table at list density (tag and name on one line), the whole
 * row opening the item; the tag and name is the row's link for keyboards and screen readers.
 */
export function GearTable({ items }: { items: ItemSummary[] }) {
  const [itemColumn, ratedColumn, statusColumn, inspectionColumn] = columns;
  return (
    <Card flush testID="gear-table">
      <Table label="Gear" columns={columns}>
        {items.map((item) => (
          <TableRow key={item.id} testID={`gear-row-${item.id}`} onPress={() => router.push({ pathname: '/gear/[id]', params: { id: String(item.id) } })}>
            <TableCell column={itemColumn}>
              <Link href={{ pathname: '/gear/[id]', params: { id: String(item.id) } }} testID={`gear-link-${item.id}`} style={styles.link} numberOfLines={1}>
                <AppText variant="bodyStrong" tone="primary" style={styles.tag}>
                  {item.tag}
                </AppText>
                <AppText variant="body">{` ${item.name}`}</AppText>
              </Link>
              <AppText variant="small" tone="muted" numberOfLines={1}>
                {`${KIND_LABELS[item.kind]} · ${item.location}`}
              </AppText>
            </TableCell>
            <TableCell column={ratedColumn}>
              <AppText variant="bodyStrong">{formatKv(item.ratedKv)}</AppText>
            </TableCell>
            <TableCell column={statusColumn}>
              <StatusBadge status={item.status} />
            </TableCell>
            <TableCell column={inspectionColumn}>
              <InspectionBadge state={item.inspectionState} />
              <AppText variant="small" tone="muted" numberOfLines={1}>
                {item.nextInspectionDue ? `Next due ${formatDay(item.nextInspectionDue)}` : 'No inspection on record'}
              </AppText>
            </TableCell>
          </TableRow>
        ))}
      </Table>
    </Card>
  );
}

const styles = StyleSheet.create({
  // The link keeps a 48 px target; its text is one line.
  link: { minHeight: layout.minTouchTarget, paddingVertical: spacing.xxs, textAlignVertical: 'center' },
  // A tag is one word: never broken at its hyphen ("GST- / 0002").
  tag: { whiteSpace: 'nowrap' } as object,
});
