import { airDensityKgPerM3 } from './air-density';
import { sparkoverCheck } from './breakdown';
import { EHD } from './data/ehd';
import { EHD_SOURCES, electricalPowerW, ehdThrustBoundN, momentumFluxVelocityMps, thrustPerPowerNPerW, wattsPerGramForce } from './ehd';
import { thrustToWeightRatio } from './trade-facts';

// One logged bench run: the figures a researcher works out by hand, and the checks that catch a
// reading physics says is impossible. Inputs in the bench's own units (kV, mA, mm, mN, g, cm²,
// °C, kPa, %), each named in its field; everything is converted to SI before the formulas.

export interface BenchRunReadings {
  readonly appliedKv: number;
  readonly currentMa: number;
  readonly gapMm: number;
  readonly velocityMps?: number | null;
  readonly thrustMn?: number | null;
  readonly massG?: number | null;
  readonly outletAreaCm2?: number | null;
  readonly temperatureC?: number | null;
  readonly pressureKpa?: number | null;
  readonly humidityPct?: number | null;
}

/** Null where an input is missing (or, for ratios, zero). */
export interface BenchRunDerived {
  readonly powerW: number;
  readonly thrustPerPowerMnPerW: number | null;
  readonly thrustToWeightPct: number | null;
  readonly wattsPerGramForce: number | null;
  readonly airDensityKgM3: number | null;
  readonly ehdThrustBoundMn: number;
  readonly momentumVelocityMps: number | null;
}

const present = (v: number | null | undefined): v is number => typeof v === 'number' && Number.isFinite(v);

export function deriveBenchRun(run: BenchRunReadings, ionMobilityM2PerVs: number = EHD.ionMobilityM2PerVs.value): BenchRunDerived {
  const voltageV = run.appliedKv * 1e3;
  const currentA = run.currentMa * 1e-3;
  const gapM = run.gapMm * 1e-3;
  const thrustN = present(run.thrustMn) ? run.thrustMn * 1e-3 : null;
  const powerW = electricalPowerW({ voltageV, currentA });
  const airDensityKgM3 =
    present(run.temperatureC) && present(run.pressureKpa)
      ? airDensityKgPerM3({ temperatureC: run.temperatureC, pressurePa: run.pressureKpa * 1e3, relativeHumidityPct: run.humidityPct ?? 0 })
      : null;
  return {
    powerW,
    thrustPerPowerMnPerW: thrustN !== null && powerW > 0 ? thrustPerPowerNPerW({ thrustN, powerW }) * 1e3 : null,
    thrustToWeightPct: thrustN !== null && present(run.massG) && run.massG > 0 ? thrustToWeightRatio({ thrustN, massKg: run.massG * 1e-3 }) * 100 : null,
    wattsPerGramForce: thrustN !== null && thrustN > 0 ? wattsPerGramForce({ powerW, thrustN }) : null,
    airDensityKgM3,
    ehdThrustBoundMn: ehdThrustBoundN({ currentA, gapM, ionMobilityM2PerVs }) * 1e3,
    momentumVelocityMps:
      thrustN !== null && airDensityKgM3 !== null && present(run.outletAreaCm2) && run.outletAreaCm2 > 0
        ? momentumFluxVelocityMps({ thrustN, airDensityKgPerM3: airDensityKgM3, outletAreaM2: run.outletAreaCm2 * 1e-4 })
        : null,
  };
}

export const BENCH_FLAG_CODES = [
  'above-plan-kv',
  'above-plan-current',
  'above-supply-rating',
  'thrust-above-ehd-bound',
  'momentum-mismatch',
  'near-sparkover',
] as const;
export type BenchFlagCode = (typeof BENCH_FLAG_CODES)[number];
export interface BenchFlag {
  readonly code: BenchFlagCode;
  readonly message: string;
}

/** Flags that mean the run went beyond what the officer approved (they are e-mailed). */
export const BEYOND_PLAN_FLAGS: readonly BenchFlagCode[] = ['above-plan-kv', 'above-plan-current'];

export interface BenchRunContext {
  readonly plannedKv: number;
  readonly maxCurrentMa: number;
  /** Supplies and multipliers of the booking, with their output ratings. */
  readonly supplies: readonly { readonly tag: string; readonly maxKv: number; readonly maxMa: number }[];
  readonly ionMobilityM2PerVs?: number;
  readonly thrustBoundTolerancePct?: number;
  readonly momentumMismatchFactor?: number;
}

const fmt = (value: number, digits = 3) => Number(value.toPrecision(digits)).toString();

export function benchRunFlags(run: BenchRunReadings, derived: BenchRunDerived, ctx: BenchRunContext): BenchFlag[] {
  const flags: BenchFlag[] = [];
  if (run.appliedKv > ctx.plannedKv) {
    flags.push({ code: 'above-plan-kv', message: `Applied ${fmt(run.appliedKv)} kV is above the approved plan's ${fmt(ctx.plannedKv)} kV.` });
  }
  if (run.currentMa > ctx.maxCurrentMa) {
    const planPowerW = ctx.plannedKv * ctx.maxCurrentMa;
    flags.push({
      code: 'above-plan-current',
      message: `Current ${fmt(run.currentMa)} mA is above the approved plan's ${fmt(ctx.maxCurrentMa)} mA (${fmt(derived.powerW)} W against at most ${fmt(planPowerW)} W planned).`,
    });
  }
  for (const supply of ctx.supplies) {
    const over: string[] = [];
    if (run.appliedKv > supply.maxKv) over.push(`${fmt(run.appliedKv)} kV against its ${fmt(supply.maxKv)} kV`);
    if (run.currentMa > supply.maxMa) over.push(`${fmt(run.currentMa)} mA against its ${fmt(supply.maxMa)} mA`);
    if (over.length > 0) flags.push({ code: 'above-supply-rating', message: `Beyond the rating of ${supply.tag}: ${over.join(' and ')}.` });
  }
  if (present(run.thrustMn)) {
    const tolerance = ctx.thrustBoundTolerancePct ?? EHD.thrustBoundTolerancePct.value;
    const bound = derived.ehdThrustBoundMn;
    if (run.thrustMn > bound * (1 + tolerance / 100)) {
      const pct = bound > 0 ? ` (${fmt((run.thrustMn / bound) * 100)} % of it)` : '';
      flags.push({
        code: 'thrust-above-ehd-bound',
        message: `Thrust ${fmt(run.thrustMn)} mN is above the one-dimensional bound I·d/μ = ${fmt(bound)} mN for ${fmt(run.currentMa)} mA across ${fmt(run.gapMm)} mm${pct}, beyond the ${tolerance} % allowance: check the balance's zero and units (grams-force entered as mN?). ${EHD_SOURCES.thrustBound}.`,
      });
    }
  }
  if (present(run.velocityMps) && derived.momentumVelocityMps !== null && derived.momentumVelocityMps > 0 && run.velocityMps > 0) {
    const factor = ctx.momentumMismatchFactor ?? EHD.momentumMismatchFactor.value;
    const ratio = run.velocityMps / derived.momentumVelocityMps;
    if (ratio > factor || ratio < 1 / factor) {
      flags.push({
        code: 'momentum-mismatch',
        message: `Measured ${fmt(run.velocityMps)} m/s but thrust and outlet area give ${fmt(derived.momentumVelocityMps)} m/s by momentum flux: more than a factor ${factor} apart. Check the outlet area, the anemometer position and the units.`,
      });
    }
  }
  const spark = sparkoverCheck({ voltageV: run.appliedKv * 1e3, gapM: run.gapMm * 1e-3 });
  if (spark.nearSparkover) flags.push({ code: 'near-sparkover', message: spark.note });
  return flags;
}
