import { Link, type Href } from 'expo-router';
import type { ReactNode } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';

import { borders, layout, spacing } from '@/components/theme/tokens';
import { useTheme } from '@/components/theme/use-theme';

import { Icon } from './icon';

interface LinkRowProps {
  href: Href;
  /** Draw a divider above the row (every row but a list's first). */
  divided?: boolean;
  testID?: string;
  /** The row's lines, stacked; the chevron is added on the right. */
  children: ReactNode;
}

/** A list row that opens a record: one link (a real anchor on the web) with the caller's lines. */
/**
 * The row's accessible name is its visible lines, read in order: an aria-label would have to
 * repeat them word for word (axe label-content-name-mismatch), so there is none.
 */
export function LinkRow({ href, divided = false, testID, children }: LinkRowProps) {
  const { colors } = useTheme();
  return (
    <Link href={href} asChild>
      <Pressable
        testID={testID}
        accessibilityRole="link"
        // Link's asChild Slot takes one flat style object (see list-row.tsx).
        style={StyleSheet.flatten([styles.row, divided && { borderTopWidth: borders.hairline, borderTopColor: colors.border }])}
      >
        <View style={styles.body}>{children}</View>
        <Icon name="chevron-right" color={colors.textMuted} />
      </Pressable>
    </Link>
  );
}

const styles = StyleSheet.create({
  row: {
    flexDirection: 'row',
    alignItems: 'center',
    gap: spacing.sm,
    minHeight: layout.listRowMinHeight,
    paddingHorizontal: spacing.md,
    paddingVertical: spacing.sm,
  },
  body: { flex: 1, gap: spacing.xxs },
});
