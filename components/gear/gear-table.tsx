import { Link } from 'expo-router';
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

/** Wide layout: the same rows as a table; the tag and name cell is the link to the item. */
export function GearTable({ items }: { items: ItemSummary[] }) {
  const [itemColumn, ratedColumn, statusColumn, inspectionColumn] = columns;
  return (
    <Card flush testID="gear-table">
      <Table label="Gear" columns={columns}>
        {items.map((item) => (
          <TableRow key={item.id} testID={`gear-row-${item.id}`}>
            <TableCell column={itemColumn}>
              <Link
                href={{ pathname: '/gear/[id]', params: { id: String(item.id) } }}
                testID={`gear-link-${item.id}`}
                style={styles.link}
              >
                <AppText variant="bodyStrong" tone="primary">
                  {item.tag}
                </AppText>
                {'\n'}
                <AppText variant="body">{item.name}</AppText>
              </Link>
              <AppText variant="small" tone="muted">
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
              <AppText variant="small" tone="muted">
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
  link: { minHeight: layout.minTouchTarget, paddingVertical: spacing.xxs },
});
