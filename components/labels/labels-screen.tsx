// Loaded on demand (lazy-labels-screen.tsx): a manager's occasional job. Default export for
// React.lazy.
import { useMemo, useState } from 'react';
import { Linking, StyleSheet, View } from 'react-native';

import { useDebouncedValue } from '@/components/gear/use-debounced-value';
import { formatKv } from '@/components/items/rating-fields';
import { spacing } from '@/components/theme/tokens';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Checkbox } from '@/components/ui/checkbox';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { LoadingState } from '@/components/ui/loading-state';
import { Screen } from '@/components/ui/screen';
import { TextField } from '@/components/ui/text-field';
import { LoadMore } from '@/components/ui/load-more';
import { useItemsInfiniteQuery, itemUrls } from '@/hooks/use-items';
import { KIND_LABELS, type ItemSummary } from '@/shared/schemas/items';

/** The server's limit per request: ten sheets of 21 (server/routes/labels.ts). */
const MAX_LABELS = 210;
const PAGE_SIZE = 50;

export default function LabelsScreen() {
  const [search, setSearch] = useState('');
  const q = useDebouncedValue(search.trim(), 300);
  const items = useItemsInfiniteQuery(
    useMemo(() => ({ q: q || undefined, sort: 'tag' as const }), [q]),
    PAGE_SIZE,
  );
  const rows = useMemo(() => items.data?.pages.flatMap((page) => page.items) ?? [], [items.data]);
  // Kept across searches, in the order picked, so a sheet prints in that order.
  const [selected, setSelected] = useState<Map<number, ItemSummary>>(new Map());

  const toggle = (item: ItemSummary, on: boolean) =>
    setSelected((current) => {
      const next = new Map(current);
      if (on) next.set(item.id, item);
      else next.delete(item.id);
      return next;
    });
  const selectShown = () =>
    setSelected((current) => {
      const next = new Map(current);
      for (const item of rows) if (next.size < MAX_LABELS) next.set(item.id, item);
      return next;
    });

  const count = selected.size;
  const tooMany = count > MAX_LABELS;
  const sheets = Math.ceil(count / 21);

  return (
    <Screen testID="labels-screen" title="Labels">
      <AppText tone="muted">
        Pick gear and print its QR labels: 21 labels of 63.5 × 38.1 mm on each A4 sheet. Each label shows the tag, the name and the rated voltage, and opens the
        item&apos;s page when scanned.
      </AppText>
      <Card testID="labels-selection">
        <AppText variant="bodyStrong" testID="labels-count" accessibilityLiveRegion="polite">
          {count === 0 ? 'No gear picked yet' : `${count} ${count === 1 ? 'label' : 'labels'} on ${sheets} ${sheets === 1 ? 'sheet' : 'sheets'}`}
        </AppText>
        {count > 0 ? (
          <AppText variant="small" tone="muted" numberOfLines={3}>
            {[...selected.values()].map((item) => item.tag).join(', ')}
          </AppText>
        ) : null}
        {tooMany ? <AppText tone="error" variant="smallStrong">{`At most ${MAX_LABELS} labels at a time; remove ${count - MAX_LABELS}.`}</AppText> : null}
        <View style={styles.buttons}>
          <Button
            label="Print labels"
            icon="printer"
            disabled={count === 0 || tooMany}
            onPress={() => void Linking.openURL(itemUrls.labelSheetPdf([...selected.keys()]))}
            testID="labels-print"
          />
          {count > 0 ? <Button label="Clear" icon="close" variant="secondary" onPress={() => setSelected(new Map())} testID="labels-clear" /> : null}
        </View>
      </Card>
      <TextField
        label="Find gear"
        hint="Tag, name, make, model, serial or location"
        value={search}
        onChangeText={setSearch}
        autoCapitalize="none"
        autoCorrect={false}
        testID="labels-search"
      />
      {items.isPending ? (
        <LoadingState label="Loading gear" />
      ) : items.isError && rows.length === 0 ? (
        <ErrorState title="The gear list did not load" error={items.error} onRetry={() => void items.refetch()} retrying={items.isRefetching} />
      ) : rows.length === 0 ? (
        <EmptyState
          testID="labels-empty"
          icon="magnify"
          title="No gear found"
          message={q ? 'Nothing matches this search.' : 'Register gear first; its labels are printed here.'}
        />
      ) : (
        <View style={styles.list}>
          <Button label={`Pick all ${rows.length} shown`} icon="checkbox-marked" variant="secondary" onPress={selectShown} testID="labels-pick-shown" />
          {rows.map((item) => (
            <Checkbox
              key={item.id}
              label={`${item.tag} · ${item.name}`}
              detail={`${KIND_LABELS[item.kind]} · ${formatKv(item.ratedKv)}`}
              checked={selected.has(item.id)}
              onChange={(on) => toggle(item, on)}
              testID={`labels-item-${item.id}`}
            />
          ))}
          <LoadMore query={items} loadingLabel="Loading more gear" failedText="More gear did not load. Try again." block testID="labels-load-more" />
        </View>
      )}
    </Screen>
  );
}

const styles = StyleSheet.create({
  buttons: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.xs },
  list: { gap: spacing.xs },
});
