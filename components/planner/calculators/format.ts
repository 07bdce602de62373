// Display formatting for Planner results: always a number with its unit, never NaN.
import type { Marker } from '@/shared/hv';
import { formatQuantity } from '@/shared/hv';

export function quantity(value: number, unit: string, significantDigits = 3): string {
  return formatQuantity({ value, unit, significantDigits });
}

/**
 * Seconds stay seconds (a "ks" prefix reads as nonsense at a bench), with minutes or hours beside
 * them once the wait is long enough for that to be how people think about it.
 */
export function duration(seconds: number): string {
  const base = seconds < 1000 ? quantity(seconds, 's', 4) : `${Math.round(seconds)} s`;
  if (seconds >= 2 * 86_400) return `${base} (${(seconds / 86_400).toFixed(1)} days)`;
  if (seconds >= 3600) return `${base} (${(seconds / 3600).toFixed(1)} h)`;
  if (seconds >= 60) return `${base} (${(seconds / 60).toFixed(1)} min)`;
  return base;
}

/** NFPA tables print one decimal (1.0 m); so do we. */
export function metres(value: number): string {
  return `${value.toFixed(1)} m`;
}

export const MARKER_LABELS: Record<Marker, string> = {
  confirmed: 'confirmed',
  'partly-confirmed': 'partly confirmed',
  'from-memory': 'from memory: check against the purchased standard',
  'common-practice': 'common practice: no single normative source',
  derived: 'derived from confirmed formulas',
};
