// The setup assessment. The booking form runs the shared `assessSetup` in the browser as the member
// types (debounced), from the same inputs the server uses: the items' ratings, the lab rules and
// the member's qualification. The server recomputes and stores its own when the booking is saved;
// that stored one is the record.
import { useEffect, useMemo, useState } from 'react';

import { assessSetup } from '@/shared/rules/assessment';
import type { AssessedItem, Assessment } from '@/shared/schemas/assessment';
import { testPlanSchema, type TestPlan } from '@/shared/schemas/bookings';
import type { Item } from '@/shared/schemas/items';

import { useLabRulesQuery } from './use-lab-rules';
import { useQualificationQuery } from './use-qualification';

/** `value`, once it has stopped changing for `delayMs`. */
export function useDebouncedValue<T>(value: T, delayMs: number): T {
  const [settled, setSettled] = useState(value);
  useEffect(() => {
    const timer = setTimeout(() => setSettled(value), delayMs);
    return () => clearTimeout(timer);
  }, [value, delayMs]);
  return settled;
}

/** Calendar dates are compared as UTC dates, as the server records them (server/services/dates.ts). */
export function todayUtcIso(now = new Date()): string {
  return now.toISOString().slice(0, 10);
}

function toAssessedItem(item: Item): AssessedItem {
  return {
    id: item.id,
    tag: item.tag,
    name: item.name,
    kind: item.kind,
    ratedKv: item.ratedKv,
    ratings: item.ratings as Record<string, unknown>,
    status: item.status,
    inspectionState: item.inspectionState,
  };
}

export type LiveAssessment =
  { state: 'waiting'; reason: string } | { state: 'loading' } | { state: 'error'; error: unknown } | { state: 'ready'; assessment: Assessment; stale: boolean };

const DEBOUNCE_MS = 350;

/**
 * The assessment of the plan being typed, recomputed once typing pauses. `stale` is true while
 * the inputs have changed and the pause has not yet come.
 */
export function useLiveAssessment({
  items,
  itemsLoading,
  plan,
  personId,
}: {
  items: Item[];
  itemsLoading: boolean;
  plan: unknown;
  personId: number | undefined;
}): LiveAssessment {
  const rules = useLabRulesQuery();
  const qualification = useQualificationQuery(personId);
  const inputKey = JSON.stringify({ plan, items: items.map((i) => [i.id, i.updatedAt]) });
  const settledKey = useDebouncedValue(inputKey, DEBOUNCE_MS);
  const stale = settledKey !== inputKey;

  // Computed from the settled inputs only, so the panel does not flicker on every keystroke.
  const settled = useMemo(() => JSON.parse(settledKey) as { plan: unknown; items: [number, string][] }, [settledKey]);
  const result = useMemo((): LiveAssessment => {
    if (rules.error) return { state: 'error', error: rules.error };
    if (qualification.error) return { state: 'error', error: qualification.error };
    const parsed = testPlanSchema.safeParse(settled.plan);
    const chosen = settled.items.map(([id]) => items.find((i) => i.id === id)).filter((i): i is Item => i !== undefined);
    if (settled.items.length === 0) return { state: 'waiting', reason: 'Pick the gear for the test to see its assessment.' };
    if (!parsed.success) return { state: 'waiting', reason: 'Fill in the test plan (voltage, polarity, current, people) to see its assessment.' };
    if (!rules.data || qualification.isPending || itemsLoading || chosen.length < settled.items.length) return { state: 'loading' };
    try {
      const assessment = assessSetup({
        items: chosen.map(toAssessedItem),
        plan: parsed.data as TestPlan,
        rules: rules.data,
        qualification: qualification.data ?? null,
        today: todayUtcIso(),
      });
      return { state: 'ready', assessment, stale: false };
    } catch (error) {
      return { state: 'error', error };
    }
  }, [settled, items, itemsLoading, rules.data, rules.error, qualification.data, qualification.error, qualification.isPending]);

  return result.state === 'ready' ? { ...result, stale } : result;
}
