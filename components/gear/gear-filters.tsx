import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { spacing } from '@/components/theme/tokens';
import { Button } from '@/components/ui/button';
import { ChoiceChips, type Choice } from '@/components/ui/choice-chips';
import { NumberField } from '@/components/ui/number-field';
import { TextField } from '@/components/ui/text-field';
import { ITEM_KINDS, KIND_LABELS, type ItemKind, type ItemStatus } from '@/shared/schemas/items';

/** What the person has typed and picked; the screen debounces the typed parts before asking. */
export interface GearFilterValues {
  q: string;
  kind: ItemKind | 'any';
  /** `active` is the server's default: everything not retired. */
  status: ItemStatus | 'active';
  /** As typed; `undefined` empty, `NaN` not a number. */
  minKv: number | undefined;
  due: 'soon' | 'overdue' | 'any';
  sort: 'tag' | 'name' | 'ratedKv' | 'nextDue';
}

export const EMPTY_FILTERS: GearFilterValues = { q: '', kind: 'any', status: 'active', minKv: undefined, due: 'any', sort: 'tag' };

const kindChoices: Choice<ItemKind | 'any'>[] = [
  { value: 'any', label: 'All kinds' },
  ...ITEM_KINDS.map((kind) => ({ value: kind, label: KIND_LABELS[kind] })),
];
const statusChoices: Choice<GearFilterValues['status']>[] = [
  { value: 'active', label: 'Not retired' },
  { value: 'in-service', label: 'In service' },
  { value: 'out-of-service', label: 'Out of service' },
  { value: 'retired', label: 'Retired' },
];
const dueChoices: Choice<GearFilterValues['due']>[] = [
  { value: 'any', label: 'Any' },
  { value: 'soon', label: 'Due soon or overdue' },
  { value: 'overdue', label: 'Overdue' },
];
const sortChoices: Choice<GearFilterValues['sort']>[] = [
  { value: 'tag', label: 'Tag' },
  { value: 'name', label: 'Name' },
  { value: 'ratedKv', label: 'Highest kV first' },
  { value: 'nextDue', label: 'Next inspection' },
];

/** How many filters differ from the defaults (the search box is counted on its own). */
export function activeFilterCount(values: GearFilterValues): number {
  return [values.kind !== 'any', values.status !== 'active', values.minKv !== undefined, values.due !== 'any', values.sort !== 'tag'].filter(Boolean).length;
}

interface GearFiltersProps {
  values: GearFilterValues;
  onChange: (values: GearFilterValues) => void;
  /** Wide screens show the filters in their own column beside the results, always open. */
  alwaysOpen?: boolean;
}

export function GearFilters({ values, onChange, alwaysOpen = false }: GearFiltersProps) {
  const [toggledOpen, setOpen] = useState(false);
  const open = alwaysOpen || toggledOpen;
  const count = activeFilterCount(values);
  const set = <K extends keyof GearFilterValues>(key: K, value: GearFilterValues[K]) => onChange({ ...values, [key]: value });
  const minKvInvalid = values.minKv !== undefined && (Number.isNaN(values.minKv) || values.minKv < 0 || values.minKv > 1000);

  return (
    <View style={styles.root} testID="gear-filters">
      <TextField
        label="Search gear"
        hint="Tag, name, make, model, serial or location"
        value={values.q}
        onChangeText={(q) => set('q', q)}
        autoCorrect={false}
        autoCapitalize="none"
        returnKeyType="search"
        testID="gear-search"
      />
      <View style={styles.toggleRow}>
        {alwaysOpen ? null : (
          <Button
            label={open ? 'Hide filters' : count > 0 ? `Filter and sort (${count} on)` : 'Filter and sort'}
            icon={open ? 'chevron-up' : 'filter-variant'}
            variant="secondary"
            onPress={() => setOpen(!open)}
            testID="gear-filters-toggle"
          />
        )}
        {count > 0 ? (
          <Button
            label="Clear filters"
            icon="close"
            variant="secondary"
            onPress={() => onChange({ ...EMPTY_FILTERS, q: values.q })}
            testID="gear-filters-clear"
          />
        ) : null}
      </View>
      {open ? (
        <View style={styles.panel} testID="gear-filters-panel">
          <ChoiceChips label="Kind" choices={kindChoices} value={values.kind} onChange={(kind) => set('kind', kind)} testID="gear-filter-kind" />
          <NumberField
            label="Rated at least"
            unit="kV"
            value={values.minKv}
            onChange={(minKv) => set('minKv', minKv)}
            hint="Shows gear rated at or above this voltage"
            error={minKvInvalid ? 'Enter a voltage from 0 to 1000 kV' : undefined}
            testID="gear-filter-min-kv"
          />
          <ChoiceChips label="Status" choices={statusChoices} value={values.status} onChange={(status) => set('status', status)} testID="gear-filter-status" />
          <ChoiceChips label="Inspection" choices={dueChoices} value={values.due} onChange={(due) => set('due', due)} testID="gear-filter-due" />
          <ChoiceChips label="Sort by" choices={sortChoices} value={values.sort} onChange={(sort) => set('sort', sort)} testID="gear-sort" />
        </View>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  root: { gap: spacing.sm },
  toggleRow: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.xs },
  panel: { gap: spacing.md },
});
