import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { spacing } from '@/components/theme/tokens';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { describeError } from '@/components/ui/error-state';
import { LoadingState } from '@/components/ui/loading-state';
import { useGearSearchQuery } from '@/hooks/use-booking-gear';
import { KIND_LABELS, type ItemKind } from '@/shared/schemas/items';

/** The companion each gear rule asks for. */
export const COMPANION_KINDS: Record<string, ItemKind> = { 'grounding-stick': 'grounding-stick', 'isolation-stand': 'isolation-stand', interlock: 'interlock' };

interface SuitableItemsProps {
  kind: ItemKind;
  /** The rating the plan needs with the lab margin (the assessment's requiredKv). */
  minKv: number;
  picked: readonly number[];
  onAdd: (id: number) => void;
  testID: string;
}

/**
 * "Add a suitable one" beside a missing-companion warning: a few items of that kind rated for the
 * plan, in service with a current inspection, each one press from the set. The window's clash
 * check follows once it is added, as for any picked item.
 */
export function SuitableItems({ kind, minKv, picked, onAdd, testID }: SuitableItemsProps) {
  const [open, setOpen] = useState(false);
  if (!open) return <Button label="Add a suitable one" icon="plus" variant="secondary" testID={testID} onPress={() => setOpen(true)} />;
  return <SuitableList kind={kind} minKv={minKv} picked={picked} onAdd={onAdd} testID={testID} />;
}

function SuitableList({ kind, minKv, picked, onAdd, testID }: SuitableItemsProps) {
  const search = useGearSearchQuery('', { kind, minKv: Math.ceil(minKv * 10) / 10, limit: 12 });
  if (search.isPending) return <LoadingState label={`Finding a ${KIND_LABELS[kind].toLowerCase()}`} />;
  if (search.isError) return <AppText tone="error">{`The search failed: ${describeError(search.error)}`}</AppText>;
  const usable = search.data
    .filter(
      (i) =>
        i.status === 'in-service' &&
        (i.inspectionState === 'current' || i.inspectionState === 'due-soon') &&
        (i.ratedKv ?? 0) >= minKv &&
        !picked.includes(i.id),
    )
    .slice(0, 4);
  if (usable.length === 0) {
    return (
      <AppText variant="small" testID={`${testID}-none`}>
        {`No ${KIND_LABELS[kind].toLowerCase()} rated for ${minKv.toFixed(1)} kV is in service with a current inspection. Ask a manager.`}
      </AppText>
    );
  }
  return (
    <View style={styles.list} testID={`${testID}-list`}>
      {usable.map((item) => (
        <Button
          key={item.id}
          label={`Add ${item.tag} (${item.ratedKv} kV)`}
          icon="plus"
          variant="secondary"
          testID={`${testID}-add-${item.id}`}
          onPress={() => onAdd(item.id)}
        />
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  list: { gap: spacing.xs, alignItems: 'flex-start' },
});
