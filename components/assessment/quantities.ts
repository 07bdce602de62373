// Display of the assessment's numbers: each one with its unit, rounded for reading at a bench.
// The unit formatter on its own, not the shared/hv index: booking rows on Today use it, and the
// index would pull every physics module and table into the first download.
import { formatQuantity } from '@/shared/hv/units';

/** Up to `decimals` places, without trailing zeros: 25 → "25", 27.5 → "27.5". */
export function trimNumber(value: number, decimals = 2): string {
  return String(Number(value.toFixed(decimals)));
}

export function formatKv(kv: number): string {
  return `${trimNumber(kv, 2)} kV`;
}

/** SI prefix chosen for the size: 0.0625 J → "62.5 mJ". */
export function formatSi(value: number, unit: string): string {
  return Number.isFinite(value) ? formatQuantity({ value, unit }) : `— ${unit}`;
}

/** 8.4 → "8.4 s"; 125 → "2 min 5 s". */
export function formatSeconds(seconds: number): string {
  if (seconds < 60) return `${trimNumber(seconds, 1)} s`;
  const minutes = Math.floor(seconds / 60);
  const rest = Math.round(seconds - minutes * 60);
  return rest === 0 ? `${minutes} min` : `${minutes} min ${rest} s`;
}

export function formatMetres(metres: number | null, printed: string): string {
  return metres === null ? printed : `${trimNumber(metres, 2)} m (${printed})`;
}
