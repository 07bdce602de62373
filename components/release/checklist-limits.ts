import { trimNumber } from '@/components/assessment/quantities';
import type { ChecklistEntry } from '@/shared/schemas/bookings';

type Limits = Pick<ChecklistEntry, 'min' | 'max' | 'unit'>;

/** A reading line's limits in words ("10 to 2000 MΩ", "at most 50 V"), or null when it has none. */
export function limitsPhrase({ min, max, unit }: Limits): string | null {
  const suffix = unit ? ` ${unit}` : '';
  if (min !== undefined && max !== undefined) return `${trimNumber(min, 3)} to ${trimNumber(max, 3)}${suffix}`;
  if (max !== undefined) return `at most ${trimNumber(max, 3)}${suffix}`;
  if (min !== undefined) return `at least ${trimNumber(min, 3)}${suffix}`;
  return null;
}

/** Whether a range (both ends) is given, which the wording says as "limits", not "limit". */
export const hasRange = ({ min, max }: Limits) => min !== undefined && max !== undefined;
