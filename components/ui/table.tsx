import type { ReactNode } from 'react';
import { Pressable, StyleSheet, View, type StyleProp, type ViewStyle } from 'react-native';

import { borders, spacing } from '@/components/theme/tokens';
import { useTheme } from '@/components/theme/use-theme';

import { AppText } from './app-text';

export interface TableColumn {
  key: string;
  label: string;
  /** Share of the row's width. */
  flex: number;
  /** Counts and amounts sit right-aligned, so their digits line up. */
  numeric?: boolean;
}

interface TableProps {
  /** What the table holds, for screen readers ("Gear", "People"). */
  label: string;
  columns: readonly TableColumn[];
  testID?: string;
  style?: StyleProp<ViewStyle>;
  /** TableRow elements. */
  children: ReactNode;
}

/** A wide-screen table with real table roles on the web: a header row, then the caller's rows. */
export function Table({ label, columns, testID, style, children }: TableProps) {
  const { colors } = useTheme();
  return (
    <View role="table" accessibilityLabel={label} testID={testID} style={style}>
      <View role="row" style={[styles.row, { backgroundColor: colors.surfaceMuted }]}>
        {columns.map((column) => (
          <View key={column.key} role="columnheader" style={cellStyle(column)}>
            <AppText variant="smallStrong" tone="muted">
              {column.label}
            </AppText>
          </View>
        ))}
      </View>
      {children}
    </View>
  );
}

/**
 * One row under the header, divided from the one above. With `onPress` a click or tap anywhere
 * on the row opens its record; keyboard and screen-reader users reach the same place through the
 * link inside the row, so the row itself is not a second tab stop.
 */
export function TableRow({ testID, onPress, children }: { testID?: string; onPress?: () => void; children: ReactNode }) {
  const { colors } = useTheme();
  const frame = [styles.row, { borderTopColor: colors.border, borderTopWidth: borders.hairline }];
  if (!onPress) {
    return (
      <View role="row" testID={testID} style={frame}>
        {children}
      </View>
    );
  }
  return (
    <Pressable
      role="row"
      testID={testID}
      onPress={onPress}
      focusable={false}
      style={(state) => [frame, hoveredOf(state) && { backgroundColor: colors.surfaceMuted }]}
    >
      {children}
    </Pressable>
  );
}

/** react-native-web adds `hovered` to a Pressable's state; React Native's own type leaves it out. */
const hoveredOf = (state: object) => (state as { hovered?: boolean }).hovered === true;

/** A cell sized and aligned by its column. */
export function TableCell({ column, children }: { column: TableColumn; children: ReactNode }) {
  return (
    <View role="cell" style={cellStyle(column)}>
      {children}
    </View>
  );
}

const cellStyle = (column: TableColumn) => [styles.cell, { flex: column.flex }, column.numeric === true && styles.numeric];

const styles = StyleSheet.create({
  row: { flexDirection: 'row', alignItems: 'center', paddingHorizontal: spacing.xs },
  cell: { paddingHorizontal: spacing.xs, paddingVertical: spacing.xs, minWidth: 0, gap: spacing.xxs },
  numeric: { alignItems: 'flex-end' },
});
