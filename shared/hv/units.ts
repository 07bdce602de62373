import { requireFinite, requireNonNegative } from './validate';

// Display conversions only: every calculation works in SI. A converter takes one number and
// carries both units in its name, so a single positional argument cannot be misread.

const scale =
  (factor: number, field: string) =>
  (value: number): number =>
    requireFinite(value, field) * factor;

export const voltsToKv = scale(1e-3, 'voltageV');
export const kvToVolts = scale(1e3, 'voltageKv');

export const faradsToUf = scale(1e6, 'capacitanceF');
export const faradsToNf = scale(1e9, 'capacitanceF');
export const faradsToPf = scale(1e12, 'capacitanceF');
export const ufToFarads = scale(1e-6, 'capacitanceUf');
export const nfToFarads = scale(1e-9, 'capacitanceNf');
export const pfToFarads = scale(1e-12, 'capacitancePf');

export const ohmsToMohm = scale(1e-6, 'resistanceOhm');
export const ohmsToGohm = scale(1e-9, 'resistanceOhm');
export const mohmToOhms = scale(1e6, 'resistanceMohm');
export const gohmToOhms = scale(1e9, 'resistanceGohm');

export const ampsToMa = scale(1e3, 'currentA');
export const ampsToUa = scale(1e6, 'currentA');
export const maToAmps = scale(1e-3, 'currentMa');
export const uaToAmps = scale(1e-6, 'currentUa');

export const joulesToMillijoules = scale(1e3, 'energyJ');
export const millijoulesToJoules = scale(1e-3, 'energyMj');

/** Exact by definition of the international foot (0.3048 m). */
export const METRES_PER_FOOT = 0.3048;
/** Standard gravity, used to turn a thrust quoted in grams-force into newtons. */
export const STANDARD_GRAVITY_M_PER_S2 = 9.80665;

export const feetToMetres = scale(METRES_PER_FOOT, 'lengthFt');
export const metresToFeet = scale(1 / METRES_PER_FOOT, 'lengthM');
export const gramsForceToNewtons = scale(STANDARD_GRAVITY_M_PER_S2 / 1000, 'thrustGf');

export interface FeetInches {
  readonly feet: number;
  readonly inches: number;
  /** e.g. "3 ft 3 in" */
  readonly text: string;
}

/**
 * Rounds to the nearest whole inch. Not for NFPA boundaries: those tables print their own
 * imperial values (1.0 m is printed as 3 ft 6 in), which the boundary records carry verbatim.
 */
export function metresToFeetInches(lengthM: number): FeetInches {
  const totalInches = Math.round(requireNonNegative(lengthM, 'lengthM') / (METRES_PER_FOOT / 12));
  const feet = Math.floor(totalInches / 12);
  const inches = totalInches - feet * 12;
  return { feet, inches, text: `${feet} ft ${inches} in` };
}

const PREFIXES: Readonly<Record<number, string>> = {
  [-15]: 'f',
  [-12]: 'p',
  [-9]: 'n',
  [-6]: 'µ',
  [-3]: 'm',
  0: '',
  3: 'k',
  6: 'M',
  9: 'G',
  12: 'T',
};
const MIN_EXPONENT = -15;
const MAX_EXPONENT = 12;

export interface FormatQuantityInput {
  readonly value: number;
  /** Base SI unit symbol: 'V', 'F', 'Ω', 'A', 'J', 'C', 'm', 's', 'W'. */
  readonly unit: string;
  readonly significantDigits?: number;
}

/**
 * Picks the SI prefix that puts the number between 1 and 1000: 4.5e-9 F → "4.5 nF",
 * 30000 V → "30 kV", 0.45 J → "450 mJ".
 */
export function formatQuantity({ value, unit, significantDigits = 3 }: FormatQuantityInput): string {
  const v = requireFinite(value, 'value');
  const digits = Math.min(Math.max(Math.round(requireFinite(significantDigits, 'significantDigits')), 1), 15);
  if (v === 0) return `0 ${unit}`;
  let exponent = Math.floor(Math.log10(Math.abs(v)) / 3) * 3;
  exponent = Math.min(Math.max(exponent, MIN_EXPONENT), MAX_EXPONENT);
  let mantissa = Number((v / 10 ** exponent).toPrecision(digits));
  // Rounding can carry into the next prefix (999.7 → 1000), or log10 can land a hair low.
  if (Math.abs(mantissa) >= 1000 && exponent < MAX_EXPONENT) {
    exponent += 3;
    mantissa = Number((v / 10 ** exponent).toPrecision(digits));
  }
  return `${String(mantissa)} ${PREFIXES[exponent] ?? ''}${unit}`;
}
