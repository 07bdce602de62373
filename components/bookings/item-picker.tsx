import { useState } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';

import { borders, iconSizes, layout, radii, spacing } from '@/components/theme/tokens';
import { useTheme } from '@/components/theme/use-theme';
import { AppText } from '@/components/ui/app-text';
import { Badge } from '@/components/ui/badge';
import { describeError } from '@/components/ui/error-state';
import { Icon } from '@/components/ui/icon';
import { ListRow } from '@/components/ui/list-row';
import { LoadingState } from '@/components/ui/loading-state';
import { TextField } from '@/components/ui/text-field';
import { useDebouncedValue } from '@/hooks/use-assessment';
import { useGearAvailability, useGearSearchQuery, type Availability } from '@/hooks/use-booking-gear';
import type { Item, ItemSummary } from '@/shared/schemas/items';
import { ITEM_KINDS, KIND_LABELS, type ItemKind } from '@/shared/schemas/items';
import { ChoiceChips } from '@/components/ui/choice-chips';

import { statusWords } from './booking-status';
import { formatWindow } from './booking-time';

interface ItemPickerProps {
  value: number[];
  onChange: (ids: number[]) => void;
  /** Full records of the picked items, loaded by the form (the assessment needs them too). */
  picked: Item[];
  /** The chosen window, or null while it is not valid: availability is asked for it. */
  window: { from: string; to: string } | null;
  /** When changing a booking, its own hold on the items is not a clash. */
  ownBookingId?: number;
  error?: string;
}

function summaryLine(item: ItemSummary): string {
  const rating = item.ratedKv === null ? 'no voltage rating' : `rated ${item.ratedKv} kV`;
  const state =
    item.status !== 'in-service'
      ? item.status === 'retired'
        ? 'retired'
        : 'out of service'
      : item.inspectionState === 'overdue' || item.inspectionState === 'never'
        ? 'inspection not current'
        : null;
  return [KIND_LABELS[item.kind], rating, state].filter(Boolean).join(' · ');
}

/** Search the registry, add and remove items, and see whether each is free over the window. */
export function ItemPicker({ value, onChange, picked, window, ownBookingId, error }: ItemPickerProps) {
  const { colors } = useTheme();
  const [query, setQuery] = useState('');
  const [kind, setKind] = useState<ItemKind | 'any'>('any');
  const [minKvText, setMinKvText] = useState('');
  const minKv = Number(minKvText.replace(',', '.'));
  const search = useGearSearchQuery(useDebouncedValue(query, 250), {
    kind: kind === 'any' ? undefined : kind,
    minKv: minKvText.trim() === '' || !Number.isFinite(minKv) ? undefined : minKv,
  });
  const availability = useGearAvailability(value, window);

  return (
    <View style={styles.root}>
      <View style={styles.picked} testID="picked-items">
        {value.length === 0 ? (
          <AppText tone="muted" testID="picked-items-empty">
            No gear picked yet. Search below and add each item the test needs, companions included.
          </AppText>
        ) : (
          value.map((id) => {
            const item = picked.find((i) => i.id === id);
            return (
              <View key={id} testID={`picked-item-${id}`} style={[styles.pickedRow, { borderColor: colors.border, backgroundColor: colors.surface }]}>
                <View style={styles.pickedText}>
                  <AppText variant="bodyStrong">{item ? `${item.tag} · ${item.name}` : `Item ${id}`}</AppText>
                  {item ? (
                    <AppText variant="small" tone="muted">
                      {summaryLine(item)}
                    </AppText>
                  ) : null}
                  <AvailabilityLine id={id} state={availability[id]} window={window} ownBookingId={ownBookingId} />
                </View>
                <RemoveButton
                  label={`Remove ${item?.tag ?? `item ${id}`}`}
                  testID={`remove-item-${id}`}
                  onPress={() => onChange(value.filter((v) => v !== id))}
                />
              </View>
            );
          })
        )}
      </View>
      {error ? (
        <View style={styles.errorRow}>
          <Icon name="alert-circle" size={iconSizes.sm} color={colors.errorText} />
          <AppText variant="smallStrong" tone="error" testID="book-items-error">
            {error}
          </AppText>
        </View>
      ) : null}

      <TextField
        label="Find gear"
        hint="Tag, name, make, model or place"
        value={query}
        onChangeText={setQuery}
        testID="item-search"
        autoCapitalize="none"
        autoCorrect={false}
        inputMode="search"
      />
      <ChoiceChips
        label="Kind"
        testID="item-search-kind"
        choices={[{ value: 'any', label: 'Any kind' }, ...ITEM_KINDS.map((k) => ({ value: k, label: KIND_LABELS[k] }))]}
        value={kind}
        onChange={setKind}
      />
      <TextField
        label="Rated for at least (kV)"
        hint="Leave empty for any rating"
        value={minKvText}
        onChangeText={setMinKvText}
        inputMode="decimal"
        testID="item-search-min-kv"
      />
      <View style={[styles.results, { borderColor: colors.border, backgroundColor: colors.surface }]} testID="item-search-results">
        {search.isPending ? (
          <LoadingState label="Searching the gear" />
        ) : search.isError ? (
          <AppText tone="error" style={styles.pad}>
            {`The search failed: ${describeError(search.error)}`}
          </AppText>
        ) : search.data.length === 0 ? (
          <AppText tone="muted" style={styles.pad}>
            {kind !== 'any' || minKvText.trim() !== ''
              ? 'No gear matches these filters. Try another kind or a lower rating.'
              : 'No gear matches. Try a tag such as SUP-0001, or a word of the name.'}
          </AppText>
        ) : (
          search.data.map((item, index) => {
            const added = value.includes(item.id);
            return (
              <ListRow
                key={item.id}
                testID={`pick-item-${item.id}`}
                divided={index > 0}
                title={`${item.tag} · ${item.name}`}
                subtitle={summaryLine(item)}
                onPress={added ? () => onChange(value.filter((v) => v !== item.id)) : () => onChange([...value, item.id])}
                trailing={<Badge label={added ? 'Added' : 'Add'} icon={added ? 'check-circle' : 'plus'} tone={added ? 'primary' : 'neutral'} />}
              />
            );
          })
        )}
      </View>
    </View>
  );
}

/** A picked item's remove control: the row is too narrow on a phone for a worded button. */
function RemoveButton({ label, onPress, testID }: { label: string; onPress: () => void; testID: string }) {
  const { colors } = useTheme();
  return (
    <Pressable
      accessibilityRole="button"
      accessibilityLabel={label}
      onPress={onPress}
      testID={testID}
      style={({ pressed }) => [
        styles.remove,
        { borderColor: colors.borderStrong, backgroundColor: colors.surface },
        pressed && { backgroundColor: colors.surfaceMuted },
      ]}
    >
      <Icon name="close" color={colors.text} />
    </Pressable>
  );
}

function AvailabilityLine({
  id,
  state,
  window,
  ownBookingId,
}: {
  id: number;
  state: Availability | undefined;
  window: ItemPickerProps['window'];
  ownBookingId?: number;
}) {
  if (!window)
    return (
      <AppText variant="small" tone="muted">
        Set a valid window to see whether it is free.
      </AppText>
    );
  if (!state || (state.busy === undefined && state.loading)) {
    return (
      <AppText variant="small" tone="muted" testID={`availability-${id}`}>
        Checking the window…
      </AppText>
    );
  }
  if (state.error) {
    return (
      <AppText variant="small" tone="error" testID={`availability-${id}`}>
        {`Availability did not load: ${describeError(state.error)}`}
      </AppText>
    );
  }
  const clashes = (state.busy ?? []).filter((slot) => slot.bookingId !== ownBookingId);
  if (clashes.length === 0) {
    return (
      <View testID={`availability-${id}`}>
        <Badge label="Free over this window" icon="check-circle" tone="ok" testID={`availability-${id}-free`} />
      </View>
    );
  }
  return (
    <View style={styles.clashes} testID={`availability-${id}`}>
      <Badge label="Already booked in this window" icon="clock-alert" tone="held" testID={`availability-${id}-busy`} />
      {clashes.map((slot) => (
        <AppText key={slot.bookingId} variant="small">
          {`${slot.personName}: ${formatWindow(slot.startsAt, slot.endsAt)} (${statusWords[slot.status as keyof typeof statusWords]?.label ?? slot.status})`}
        </AppText>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  root: { gap: spacing.md },
  picked: { gap: spacing.sm },
  pickedRow: { flexDirection: 'row', alignItems: 'flex-start', gap: spacing.sm, padding: spacing.sm, borderWidth: borders.hairline, borderRadius: radii.md },
  pickedText: { flex: 1, gap: spacing.xxs },
  remove: {
    width: layout.minTouchTarget,
    height: layout.minTouchTarget,
    alignItems: 'center',
    justifyContent: 'center',
    borderWidth: borders.control,
    borderRadius: radii.md,
  },
  results: { borderWidth: borders.hairline, borderRadius: radii.md, overflow: 'hidden' },
  pad: { padding: spacing.md },
  errorRow: { flexDirection: 'row', alignItems: 'center', gap: spacing.xxs },
  clashes: { gap: spacing.xxs },
});
