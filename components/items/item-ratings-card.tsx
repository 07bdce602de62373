import { StyleSheet, View } from 'react-native';

import { borders, spacing } from '@/components/theme/tokens';
import { useTheme } from '@/components/theme/use-theme';
import { AppText } from '@/components/ui/app-text';
import { Card } from '@/components/ui/card';
import type { Item } from '@/shared/schemas/items';

import { formatRating, RATING_FIELDS } from './rating-fields';

export function ItemRatingsCard({ item }: { item: Item }) {
  const { colors } = useTheme();
  const ratings = item.ratings as Record<string, unknown>;
  return (
    <Card title="Ratings" testID="item-ratings">
      <View role="list">
        {RATING_FIELDS[item.kind].map((field, index) => (
          <View
            key={field.name}
            role="listitem"
            testID={`item-rating-${field.name}`}
            style={[styles.row, index > 0 && { borderTopWidth: borders.hairline, borderTopColor: colors.border }]}
          >
            <AppText tone="muted" style={styles.label}>
              {field.label}
            </AppText>
            <AppText variant="bodyStrong" style={styles.value}>
              {formatRating(field, ratings[field.name])}
            </AppText>
          </View>
        ))}
      </View>
      <AppText variant="small" tone="muted">
        As registered from the maker&apos;s plate or data sheet. The release check compares the rated voltage with each plan, with the lab&apos;s margin.
      </AppText>
    </Card>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', flexWrap: 'wrap', justifyContent: 'space-between', gap: spacing.sm, paddingVertical: spacing.xs },
  label: { flexShrink: 1 },
  value: { textAlign: 'right' },
});
