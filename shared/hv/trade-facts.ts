import { STANDARD_GRAVITY_M_PER_S2 } from './units';
import { requireFiniteResult, requireNonNegative, requirePositive } from './validate';

// Sanity checks for logged EHD / plasma data (P = VI and simple ratios). Plain physics; the
// figures they are tested against are common lab talk with no single source.

/** I = P / V. */
export function currentFromPowerA({ powerW, voltageV }: { readonly powerW: number; readonly voltageV: number }): number {
  const p = requireNonNegative(powerW, 'powerW');
  const v = requirePositive(voltageV, 'voltageV');
  return requireFiniteResult(p / v, 'powerW');
}

/** Thrust over weight (dimensionless): thrust / (m·g₀). 0.045 means 4.5 %. */
export function thrustToWeightRatio({ thrustN, massKg }: { readonly thrustN: number; readonly massKg: number }): number {
  const t = requireNonNegative(thrustN, 'thrustN');
  const m = requirePositive(massKg, 'massKg');
  return requireFiniteResult(t / (m * STANDARD_GRAVITY_M_PER_S2), 'thrustN');
}

/**
 * Electrical power per gram, W/g. EHD write-ups quote it per gram of device mass or per gram(-force)
 * of thrust; pass whichever mass the comparison needs (kg, SI).
 */
export function specificPowerWPerG({ powerW, massKg }: { readonly powerW: number; readonly massKg: number }): number {
  const p = requireNonNegative(powerW, 'powerW');
  const m = requirePositive(massKg, 'massKg');
  return requireFiniteResult(p / (m * 1000), 'powerW');
}
