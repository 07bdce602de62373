import { Link } from 'expo-router';
import type { ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';

import { formatDay } from '@/components/items/format-dates';
import { formatKv } from '@/components/items/rating-fields';
import { borders, layout, spacing } from '@/components/theme/tokens';
import { useTheme } from '@/components/theme/use-theme';
import { AppText } from '@/components/ui/app-text';
import { Card } from '@/components/ui/card';
import { KIND_LABELS, type ItemSummary } from '@/shared/schemas/items';

import { itemAccessibleName } from './gear-list';
import { InspectionBadge, StatusBadge } from './item-badges';

const columns = [
  { key: 'item', label: 'Tag, name and place', flex: 5 },
  { key: 'rated', label: 'Rated', flex: 2 },
  { key: 'status', label: 'Status', flex: 3 },
  { key: 'inspection', label: 'Inspection', flex: 4 },
] as const;

/** Wide layout: the same rows as a table; the tag and name cell is the link to the item. */
export function GearTable({ items }: { items: ItemSummary[] }) {
  const { colors } = useTheme();
  return (
    <Card flush testID="gear-table">
      <View role="table" accessibilityLabel="Gear">
        <View role="row" style={[styles.row, { backgroundColor: colors.surfaceMuted }]}>
          {columns.map((column) => (
            <View key={column.key} role="columnheader" style={[styles.cell, { flex: column.flex }]}>
              <AppText variant="smallStrong" tone="muted">
                {column.label}
              </AppText>
            </View>
          ))}
        </View>
        {items.map((item) => (
          <View key={item.id} role="row" testID={`gear-row-${item.id}`} style={[styles.row, { borderTopColor: colors.border, borderTopWidth: borders.hairline }]}>
            <Cell flex={columns[0].flex}>
              <Link
                href={{ pathname: '/gear/[id]', params: { id: String(item.id) } }}
                accessibilityLabel={itemAccessibleName(item)}
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
            </Cell>
            <Cell flex={columns[1].flex}>
              <AppText variant="bodyStrong">{formatKv(item.ratedKv)}</AppText>
            </Cell>
            <Cell flex={columns[2].flex}>
              <StatusBadge status={item.status} />
            </Cell>
            <Cell flex={columns[3].flex}>
              <InspectionBadge state={item.inspectionState} />
              <AppText variant="small" tone="muted">
                {item.nextInspectionDue ? `Next due ${formatDay(item.nextInspectionDue)}` : 'No inspection on record'}
              </AppText>
            </Cell>
          </View>
        ))}
      </View>
    </Card>
  );
}

function Cell({ flex, children }: { flex: number; children: ReactNode }) {
  return (
    <View role="cell" style={[styles.cell, { flex }]}>
      {children}
    </View>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', alignItems: 'center', paddingHorizontal: spacing.xs },
  cell: { paddingHorizontal: spacing.xs, paddingVertical: spacing.sm, minWidth: 0, gap: spacing.xxs },
  link: { minHeight: layout.minTouchTarget, paddingVertical: spacing.xxs },
});
