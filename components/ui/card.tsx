import type { ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';

import { shapes, spacing } from '@/components/theme/tokens';
import { useTheme } from '@/components/theme/use-theme';

import { AppText } from './app-text';

interface CardProps {
  title?: string;
  testID?: string;
  /** No inner padding: for lists and tables that draw their own rows edge to edge. */
  flush?: boolean;
  children: ReactNode;
}

export function Card({ title, testID, flush = false, children }: CardProps) {
  const { colors } = useTheme();
  return (
    <View testID={testID} style={[styles.card, flush && styles.flush, { backgroundColor: colors.surface, borderTopColor: colors.borderStrong }]}>
      {title ? (
        <View style={flush ? styles.flushTitle : undefined}>
          <AppText variant="heading" headingLevel={2}>
            {title}
          </AppText>
        </View>
      ) : null}
      {children}
    </View>
  );
}

const styles = StyleSheet.create({
  card: {
    // A squared tag with a heavy top rule (tokens.ts `shapes`), not a rounded outline.
    borderTopWidth: shapes.cardRule,
    borderRadius: shapes.cardRadius,
    padding: spacing.md,
    gap: spacing.sm,
    overflow: 'hidden',
  },
  flush: { padding: 0, gap: 0 },
  flushTitle: { paddingHorizontal: spacing.md, paddingTop: spacing.md, paddingBottom: spacing.xs },
});
