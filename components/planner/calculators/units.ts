// Everyday input units for the Planner. Conversions to SI go through shared/hv's converters where
// one exists, so the client and the server agree on every factor.
import { gohmToOhms, kvToVolts, maToAmps, mohmToOhms, nfToFarads, pfToFarads, uaToAmps, ufToFarads } from '@/shared/hv';

export interface UnitOption {
  /** Stable id for testIDs (no µ or Ω in selectors). */
  id: string;
  /** What the member reads, e.g. "µF". */
  symbol: string;
  toSi: (value: number) => number;
}

const identity = (value: number) => value;
const times = (factor: number) => (value: number) => value * factor;

export const VOLTAGE_UNITS: readonly UnitOption[] = [
  { id: 'kV', symbol: 'kV', toSi: kvToVolts },
  { id: 'V', symbol: 'V', toSi: identity },
];

export const CAPACITANCE_UNITS: readonly UnitOption[] = [
  { id: 'nF', symbol: 'nF', toSi: nfToFarads },
  { id: 'uF', symbol: 'µF', toSi: ufToFarads },
  { id: 'pF', symbol: 'pF', toSi: pfToFarads },
];

export const RESISTANCE_UNITS: readonly UnitOption[] = [
  { id: 'Mohm', symbol: 'MΩ', toSi: mohmToOhms },
  { id: 'Gohm', symbol: 'GΩ', toSi: gohmToOhms },
];

export const CURRENT_UNITS: readonly UnitOption[] = [
  { id: 'mA', symbol: 'mA', toSi: maToAmps },
  { id: 'uA', symbol: 'µA', toSi: uaToAmps },
];

export const FREQUENCY_UNITS: readonly UnitOption[] = [
  { id: 'kHz', symbol: 'kHz', toSi: times(1e3) },
  { id: 'Hz', symbol: 'Hz', toSi: identity },
];

export const SMALL_LENGTH_UNITS: readonly UnitOption[] = [
  { id: 'mm', symbol: 'mm', toSi: times(1e-3) },
  { id: 'um', symbol: 'µm', toSi: times(1e-6) },
];

export const LENGTH_UNITS: readonly UnitOption[] = [
  { id: 'mm', symbol: 'mm', toSi: times(1e-3) },
  { id: 'cm', symbol: 'cm', toSi: times(1e-2) },
];

/** Quantities the shared functions already take in these units (counts, °C, cmHg). */
export const unitless = (symbol: string): readonly UnitOption[] => [{ id: 'one', symbol, toSi: identity }];

export function findUnit(units: readonly UnitOption[], id: string): UnitOption {
  // Specs always list at least one unit; an unknown id (stale state) falls back to the first.
  return units.find((unit) => unit.id === id) ?? units[0]!;
}
