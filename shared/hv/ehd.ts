import { EHD } from './data/ehd';
import { specificPowerWPerG } from './trade-facts';
import { STANDARD_GRAVITY_M_PER_S2 } from './units';
import { requireFiniteResult, requireNonNegative, requirePositive } from './validate';

// Electrohydrodynamic (ionic-wind) figures for logged bench runs. SI inside; callers convert
// the bench's kV, mA, mN and mm at the edge.

const EHD_1D_SOURCE = 'one-dimensional EHD model, Masuyama & Barrett, Proc. R. Soc. A 469 (2013) (citation from memory)';

/** P = V·I (textbook). */
export function electricalPowerW({ voltageV, currentA }: { readonly voltageV: number; readonly currentA: number }): number {
  const v = requireNonNegative(voltageV, 'voltageV');
  const i = requireNonNegative(currentA, 'currentA');
  return requireFiniteResult(v * i, 'voltageV');
}

/** Thrust per electrical power, N/W (numerically equal to mN/mW and to kN/kW…; the bench quotes mN/W). */
export function thrustPerPowerNPerW({ thrustN, powerW }: { readonly thrustN: number; readonly powerW: number }): number {
  const t = requireNonNegative(thrustN, 'thrustN');
  const p = requirePositive(powerW, 'powerW');
  return requireFiniteResult(t / p, 'thrustN');
}

/**
 * Watts of electrical power per gram-force of thrust, the figure EHD work quotes for lift:
 * specificPowerWPerG with the thrust's mass equivalent T/g₀.
 */
export function wattsPerGramForce({ powerW, thrustN }: { readonly powerW: number; readonly thrustN: number }): number {
  const t = requirePositive(thrustN, 'thrustN');
  return specificPowerWPerG({ powerW, massKg: t / STANDARD_GRAVITY_M_PER_S2 });
}

export interface EhdBoundInput {
  readonly gapM: number;
  /** Defaults to EHD.ionMobilityM2PerVs (2 × 10⁻⁴ m²/(V·s), from memory). */
  readonly ionMobilityM2PerVs?: number;
}

function mobility(value: number | undefined): number {
  return requirePositive(value ?? EHD.ionMobilityM2PerVs.value, 'ionMobilityM2PerVs');
}

/**
 * The one-dimensional EHD thrust T = I·d/μ: all the ion current drifting across the gap d and
 * handing its momentum to the air. Real thrusters reach a fraction of it (losses to the sides,
 * back-flow, drag on the collector), so a reading above it points at the meter, not the device.
 */
export function ehdThrustBoundN({ currentA, gapM, ionMobilityM2PerVs }: EhdBoundInput & { readonly currentA: number }): number {
  const i = requireNonNegative(currentA, 'currentA');
  const d = requirePositive(gapM, 'gapM');
  return requireFiniteResult((i * d) / mobility(ionMobilityM2PerVs), 'currentA');
}

/** Its thrust-to-power bound T/P = d/(μ·V) = 1/(μ·E_mean), N/W. */
export function ehdThrustPerPowerBoundNPerW({ voltageV, gapM, ionMobilityM2PerVs }: EhdBoundInput & { readonly voltageV: number }): number {
  const v = requirePositive(voltageV, 'voltageV');
  const d = requirePositive(gapM, 'gapM');
  return requireFiniteResult(d / (mobility(ionMobilityM2PerVs) * v), 'gapM');
}

/**
 * Mean jet velocity that carries the thrust as momentum flux through the outlet, T = ρ·A·v²,
 * so v = √(T/(ρ·A)) (momentum balance on a uniform jet; textbook fluid mechanics).
 */
export function momentumFluxVelocityMps({
  thrustN,
  airDensityKgPerM3,
  outletAreaM2,
}: {
  readonly thrustN: number;
  readonly airDensityKgPerM3: number;
  readonly outletAreaM2: number;
}): number {
  const t = requireNonNegative(thrustN, 'thrustN');
  const rho = requirePositive(airDensityKgPerM3, 'airDensityKgPerM3');
  const a = requirePositive(outletAreaM2, 'outletAreaM2');
  return requireFiniteResult(Math.sqrt(t / (rho * a)), 'thrustN');
}

export const EHD_SOURCES = {
  thrustBound: `T ≤ I·d/μ and T/P ≤ d/(μ·V), ${EHD_1D_SOURCE}`,
  momentum: 'momentum flux of a uniform jet, T = ρ·A·v² (textbook fluid mechanics)',
  power: 'P = V·I (textbook)',
} as const;
