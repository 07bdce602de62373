// The usage report's period: a preset counted back from today, or two calendar dates typed in.
import { z } from 'zod';

import type { ReportPeriod } from '@/hooks/use-reports';

export const PRESETS = [
  { value: '7', label: 'Last 7 days' },
  { value: '30', label: 'Last 30 days' },
  { value: '90', label: 'Last 90 days' },
  { value: 'custom', label: 'Other dates' },
] as const;
export type PresetValue = (typeof PRESETS)[number]['value'];
export const DEFAULT_PRESET: PresetValue = '30';

function isoDate(date: Date): string {
  const pad = (n: number) => String(n).padStart(2, '0');
  return `${date.getFullYear()}-${pad(date.getMonth() + 1)}-${pad(date.getDate())}`;
}

/** The last `days` days, today included, in the device's calendar. */
export function lastDays(days: number, today: Date = new Date()): ReportPeriod {
  const from = new Date(today.getFullYear(), today.getMonth(), today.getDate() - (days - 1));
  return { from: isoDate(from), to: isoDate(today) };
}

export function todayIso(today: Date = new Date()): string {
  return isoDate(today);
}

// No shared schema exists for the report query yet (see the report to the lead); this one mirrors
// what the page sends: two calendar dates, in order.
const ISO_DATE = /^\d{4}-\d{2}-\d{2}$/;

export const customPeriodSchema = z
  .object({
    from: z.iso.date('Use the form YYYY-MM-DD'),
    to: z.iso.date('Use the form YYYY-MM-DD'),
  })
  // zod 4 runs this even when a date is malformed; only compare two real dates.
  .refine((period) => !(ISO_DATE.test(period.from) && ISO_DATE.test(period.to)) || period.from <= period.to, {
    message: 'The end must not be before the start',
    path: ['to'],
  });
