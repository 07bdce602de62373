import { router } from 'expo-router';
import { useMemo, useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { spacing } from '@/components/theme/tokens';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { LoadingState } from '@/components/ui/loading-state';
import { Screen } from '@/components/ui/screen';
import { LoadMore } from '@/components/ui/load-more';
import { useBreakpoints } from '@/hooks/use-breakpoints';
import { useItemsInfiniteQuery, type ItemFilters } from '@/hooks/use-items';
import { useCurrentUser } from '@/hooks/use-session';
import type { ItemSummary } from '@/shared/schemas/items';

import { activeFilterCount, EMPTY_FILTERS, GearFilters, type GearFilterValues } from './gear-filters';
import { GearList } from './gear-list';
import { GearTable } from './gear-table';
import { useDebouncedValue } from './use-debounced-value';

/** Typing pauses this long before the list is asked again. */
const SEARCH_DEBOUNCE_MS = 300;

function toQuery(values: GearFilterValues): ItemFilters {
  const minKvUsable = values.minKv !== undefined && !Number.isNaN(values.minKv) && values.minKv >= 0 && values.minKv <= 1000;
  return {
    q: values.q.trim() || undefined,
    kind: values.kind === 'any' ? undefined : values.kind,
    status: values.status === 'active' ? undefined : values.status,
    minKv: minKvUsable ? values.minKv : undefined,
    due: values.due === 'any' ? undefined : values.due,
    sort: values.sort,
  };
}

export function GearScreen() {
  const { isWide } = useBreakpoints();
  const isManager = useCurrentUser()?.role === 'manager';
  const [values, setValues] = useState<GearFilterValues>(EMPTY_FILTERS);
  const settled = useDebouncedValue(values, SEARCH_DEBOUNCE_MS);
  // Chips apply at once; only typing (search, kV) waits for a pause.
  const filters = useMemo(() => toQuery({ ...values, q: settled.q, minKv: settled.minKv }), [values, settled.q, settled.minKv]);
  const items = useItemsInfiniteQuery(filters);
  const rows = useMemo(() => items.data?.pages.flatMap((page) => page.items) ?? [], [items.data]);
  const filtered = activeFilterCount(values) > 0 || values.q.trim() !== '';

  return (
    <Screen testID="gear-screen" title="Gear" width={isWide ? 'wide' : 'regular'}>
      <AppText tone="muted">Every piece of the lab&apos;s shared HV gear, with its ratings and inspection state.</AppText>
      {isManager ? <Button label="Register gear" icon="plus" onPress={() => router.push('/gear/new')} testID="gear-register" block={!isWide} /> : null}
      {isWide ? (
        <View style={styles.columns}>
          <View style={styles.filterColumn}>
            <GearFilters values={values} onChange={setValues} alwaysOpen />
          </View>
          <View style={styles.resultColumn}>
            <GearResults items={items} rows={rows} filtered={filtered} isWide isManager={isManager} onClear={() => setValues(EMPTY_FILTERS)} />
          </View>
        </View>
      ) : (
        <>
          <GearFilters values={values} onChange={setValues} />
          <GearResults items={items} rows={rows} filtered={filtered} isWide={false} isManager={isManager} onClear={() => setValues(EMPTY_FILTERS)} />
        </>
      )}
    </Screen>
  );
}

interface GearResultsProps {
  items: ReturnType<typeof useItemsInfiniteQuery>;
  rows: ItemSummary[];
  /** A search or filter is on, so "nothing" means "nothing matches", not "nothing registered". */
  filtered: boolean;
  isWide: boolean;
  isManager: boolean;
  onClear: () => void;
}

function GearResults({ items, rows, filtered, isWide, isManager, onClear }: GearResultsProps) {
  if (items.isPending) return <LoadingState label="Loading gear" testID="gear-loading" />;
  if (items.isError && rows.length === 0) {
    return (
      <ErrorState
        testID="gear-error"
        title="The gear list did not load"
        error={items.error}
        onRetry={() => void items.refetch()}
        retrying={items.isRefetching}
      />
    );
  }
  if (rows.length === 0) {
    return filtered ? (
      <EmptyState
        testID="gear-empty"
        icon="magnify"
        title="No gear matches"
        message="Nothing in the registry fits this search and these filters."
        action={<Button label="Clear search and filters" icon="close" variant="secondary" onPress={onClear} />}
      />
    ) : (
      <EmptyState
        testID="gear-empty"
        icon="tools"
        title="No gear registered yet"
        message={isManager ? 'Register the lab’s first item to start.' : 'Gear appears here once the lab manager registers it.'}
      />
    );
  }
  return (
    <View style={[styles.results, items.isPlaceholderData && styles.stale]} accessibilityLabel={items.isPlaceholderData ? 'Updating results' : undefined}>
      <AppText variant="small" tone="muted" testID="gear-count" accessibilityLiveRegion="polite">
        {items.hasNextPage ? `Showing the first ${rows.length} items` : `${rows.length} ${rows.length === 1 ? 'item' : 'items'}`}
      </AppText>
      {isWide ? <GearTable items={rows} /> : <GearList items={rows} />}
      <LoadMore query={items} loadingLabel="Loading more gear" failedText="More gear did not load. Try again." block testID="gear-load-more" />
    </View>
  );
}

const styles = StyleSheet.create({
  results: { gap: spacing.sm },
  // Old rows stay readable while a new search runs; the dimming says they are about to change.
  stale: { opacity: 0.6 },
  columns: { flexDirection: 'row', alignItems: 'flex-start', gap: spacing.lg },
  filterColumn: { flex: 1, minWidth: 0 },
  resultColumn: { flex: 3, minWidth: 0 },
});
