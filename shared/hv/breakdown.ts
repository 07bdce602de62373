import { AIR } from './data/air';
import type { Marker } from './data/types';
import { HvInputError } from './errors';
import { formatQuantity } from './units';
import { requireFinite, requireFiniteResult, requireNonNegative, requirePositive } from './validate';

const CM_PER_M = 100;
const PA_PER_TORR = 101_325 / 760;

function requireDensityFactor(value: unknown): number {
  return requirePositive(value, 'airDensityFactor');
}

/** 3 kV/mm × gap × δ: the uniform-field rule of thumb (about 30 kV for 1 cm at sea level). */
export function uniformBreakdownV({ gapM, airDensityFactor = 1 }: { readonly gapM: number; readonly airDensityFactor?: number }): number {
  const d = requirePositive(gapM, 'gapM');
  const delta = requireDensityFactor(airDensityFactor);
  return requireFiniteResult(AIR.uniformBreakdownFieldVPerM.value * delta * d, 'gapM');
}

/**
 * Schumann's empirical uniform-field curve for air, V = 24.22 δd + 6.08 √(δd) kV with d in cm;
 * slightly above the 3 kV/mm rule at 1 cm (30.3 kV). Constants from memory: prefer the rule.
 */
export function schumannBreakdownV({ gapM, airDensityFactor = 1 }: { readonly gapM: number; readonly airDensityFactor?: number }): number {
  const deltaD = requireDensityFactor(airDensityFactor) * requirePositive(gapM, 'gapM') * CM_PER_M;
  const kv = AIR.schumannLinearKvPerCm.value * deltaD + AIR.schumannRootKvPerSqrtCm.value * Math.sqrt(deltaD);
  return requireFiniteResult(kv * 1e3, 'gapM');
}

export interface SparkoverCheckInput {
  readonly voltageV: number;
  readonly gapM: number;
  /** Mean field at which to warn; the lab's setting, 2 kV/mm (2e6 V/m) by default. */
  readonly warnFieldVPerM?: number;
}

export interface SparkoverCheck {
  readonly meanFieldVPerM: number;
  /** Mean field at or above the warning level. */
  readonly nearSparkover: boolean;
  /** Mean field at or above 3 kV/mm: breakdown expected even in a uniform field. */
  readonly aboveUniformBreakdown: boolean;
  readonly warnFieldVPerM: number;
  readonly note: string;
  readonly marker: Marker;
  readonly source: string;
}

/**
 * Flags a planned or logged V/d across an air gap. Wire and point electrodes spark over at far
 * lower mean fields than 3 kV/mm, which is why the warning level sits below it.
 */
export function sparkoverCheck({ voltageV, gapM, warnFieldVPerM = AIR.nearSparkoverWarnFieldVPerM.value }: SparkoverCheckInput): SparkoverCheck {
  const v = requireNonNegative(voltageV, 'voltageV');
  const d = requirePositive(gapM, 'gapM');
  const warn = requirePositive(warnFieldVPerM, 'warnFieldVPerM');
  const meanFieldVPerM = requireFiniteResult(v / d, 'gapM');
  const nearSparkover = meanFieldVPerM >= warn;
  const aboveUniformBreakdown = meanFieldVPerM >= AIR.uniformBreakdownFieldVPerM.value;
  const field = (x: number) => `${formatQuantity({ value: x / 1e3, unit: 'V' })}/mm`;
  const note = aboveUniformBreakdown
    ? `Mean field ${field(meanFieldVPerM)} is at or above ${field(AIR.uniformBreakdownFieldVPerM.value)}: the gap is expected to break down even in a uniform field.`
    : nearSparkover
      ? `Mean field ${field(meanFieldVPerM)} is at or above the ${field(warn)} warning level: near sparkover, especially for wire or point electrodes.`
      : `Mean field ${field(meanFieldVPerM)} is below the ${field(warn)} warning level.`;
  return {
    meanFieldVPerM,
    nearSparkover,
    aboveUniformBreakdown,
    warnFieldVPerM: warn,
    note,
    marker: AIR.nearSparkoverWarnFieldVPerM.marker,
    source: `${AIR.nearSparkoverWarnFieldVPerM.source}; ${AIR.uniformBreakdownFieldVPerM.source}`,
  };
}

export interface PaschenInput {
  readonly pressurePa: number;
  readonly gapM: number;
  /** Defaults are the air constants A = 15 /(cm·Torr), B = 365 V/(cm·Torr), γ = 0.01. */
  readonly aPerCmTorr?: number;
  readonly bVPerCmTorr?: number;
  readonly secondaryEmission?: number;
}

export interface PaschenResult {
  /** null where p·d is left of the curve's asymptote and the fit has no breakdown solution. */
  readonly breakdownV: number | null;
  readonly pdTorrCm: number;
  /** Always true: the simple fit overestimates at 1 cm (35.5 kV against ≈ 30 kV measured). */
  readonly doNotUseForSafety: true;
  readonly note: string;
  readonly source: string;
}

function paschenConstants(input: Pick<PaschenInput, 'aPerCmTorr' | 'bVPerCmTorr' | 'secondaryEmission'>) {
  const a = requirePositive(input.aPerCmTorr ?? AIR.paschenAPerCmTorr.value, 'aPerCmTorr');
  const b = requirePositive(input.bVPerCmTorr ?? AIR.paschenBVPerCmTorr.value, 'bVPerCmTorr');
  const gamma = requirePositive(input.secondaryEmission ?? AIR.paschenSecondaryEmission.value, 'secondaryEmission');
  // C = ln(A / ln(1 + 1/γ))
  return { a, b, gamma, lnTerm: Math.log(1 + 1 / gamma) };
}

const PASCHEN_SOURCE = "Paschen's law V_b = B·pd / (C + ln pd), C = ln(A / ln(1 + 1/γ)); air constants A = 15 /(cm·Torr), B = 365 V/(cm·Torr), γ = 0.01";

/**
 * Paschen's law V_b = B·pd / (C + ln pd), C = ln(A / ln(1 + 1/γ)). Educational only: the
 * simple fit overestimates uniform-field breakdown in air at centimetre gaps.
 */
export function paschenBreakdown(input: PaschenInput): PaschenResult {
  const p = requirePositive(input.pressurePa, 'pressurePa');
  const d = requirePositive(input.gapM, 'gapM');
  const { a, b, lnTerm } = paschenConstants(input);
  const pdTorrCm = requireFiniteResult((p / PA_PER_TORR) * d * CM_PER_M, 'pressurePa');
  const denominator = Math.log(a / lnTerm) + Math.log(pdTorrCm);
  const note = 'Paschen fit: educational only, do not use for safety decisions (use the 3 kV/mm rule and the sparkover check).';
  if (denominator <= 0) {
    return {
      breakdownV: null,
      pdTorrCm,
      doNotUseForSafety: true,
      note: `${note} p·d is below the fit's asymptote: no breakdown solution.`,
      source: PASCHEN_SOURCE,
    };
  }
  return { breakdownV: requireFiniteResult((b * pdTorrCm) / denominator, 'pressurePa'), pdTorrCm, doNotUseForSafety: true, note, source: PASCHEN_SOURCE };
}

/** Minimum of the Paschen fit: pd = e·ln(1 + 1/γ)/A, V = (B/A)·e·ln(1 + 1/γ). About 305 V at 0.84 Torr·cm for air. */
export function paschenMinimum(input: Pick<PaschenInput, 'aPerCmTorr' | 'bVPerCmTorr' | 'secondaryEmission'> = {}): {
  readonly pdTorrCm: number;
  readonly breakdownV: number;
} {
  const { a, b, lnTerm } = paschenConstants(input);
  return {
    pdTorrCm: requireFiniteResult((Math.E * lnTerm) / a, 'aPerCmTorr'),
    breakdownV: requireFiniteResult((b / a) * Math.E * lnTerm, 'bVPerCmTorr'),
  };
}

/** Peek's air density factor δ = 3.92 b / (273 + t), b in cmHg, t in °C; 1.000 at 76 cmHg and 25 °C. */
export function airDensityFactor({ pressureCmHg, temperatureC }: { readonly pressureCmHg: number; readonly temperatureC: number }): number {
  const b = requirePositive(pressureCmHg, 'pressureCmHg');
  // Temperatures below 0 °C are ordinary; only at or below Peek's absolute zero does δ break.
  const t = requireFinite(temperatureC, 'temperatureC');
  const kelvin = AIR.peekZeroCelsiusK.value + t;
  if (kelvin <= 0) throw new HvInputError('temperatureC', 'temperatureC must be above absolute zero (−273 °C)');
  return requireFiniteResult((AIR.peekDensityCoefficient.value * b) / kelvin, 'pressureCmHg');
}

/**
 * Peek's visual critical (onset) surface gradient for a smooth wire, peak kV/cm:
 * g_v = g₀·δ·(1 + c/√(δr)), g₀ = 30 kV/cm, c = 0.301 cm^½, r in cm. The surface factor m_v
 * enters the onset voltage, as in Peek's formula, not this gradient.
 */
export function peekOnsetGradientKvPerCm({
  wireRadiusM,
  airDensityFactor: delta,
}: {
  readonly wireRadiusM: number;
  readonly airDensityFactor: number;
}): number {
  const rCm = requirePositive(wireRadiusM, 'wireRadiusM') * CM_PER_M;
  const d = requireDensityFactor(delta);
  return requireFiniteResult(AIR.peekG0KvPerCm.value * d * (1 + AIR.peekCSqrtCm.value / Math.sqrt(d * rCm)), 'wireRadiusM');
}

function requireSurfaceFactor(value: unknown): number {
  const m = requirePositive(value, 'surfaceFactor');
  if (m > 1) throw new HvInputError('surfaceFactor', 'surfaceFactor must be at most 1 (1 = smooth polished wire)');
  return m;
}

/** Wire inside a coaxial tube: V = m_v·g_v·r·ln(R/r). */
export function coaxialOnsetV(input: {
  readonly wireRadiusM: number;
  readonly outerRadiusM: number;
  readonly onsetGradientKvPerCm: number;
  readonly surfaceFactor?: number;
}): number {
  const r = requirePositive(input.wireRadiusM, 'wireRadiusM');
  const outer = requirePositive(input.outerRadiusM, 'outerRadiusM');
  if (outer <= r) throw new HvInputError('outerRadiusM', 'outerRadiusM must be larger than wireRadiusM');
  const g = requirePositive(input.onsetGradientKvPerCm, 'onsetGradientKvPerCm');
  const m = requireSurfaceFactor(input.surfaceFactor ?? 1);
  return requireFiniteResult(m * g * 1e3 * r * CM_PER_M * Math.log(outer / r), 'outerRadiusM');
}

/** Two parallel wires, centre spacing S: e_v = m_v·g_v·r·ln(S/r) (Peek). */
export function parallelWireOnsetV(input: {
  readonly wireRadiusM: number;
  readonly spacingM: number;
  readonly onsetGradientKvPerCm: number;
  readonly surfaceFactor?: number;
}): number {
  const r = requirePositive(input.wireRadiusM, 'wireRadiusM');
  const s = requirePositive(input.spacingM, 'spacingM');
  if (s <= r) throw new HvInputError('spacingM', 'spacingM must be larger than wireRadiusM');
  const g = requirePositive(input.onsetGradientKvPerCm, 'onsetGradientKvPerCm');
  const m = requireSurfaceFactor(input.surfaceFactor ?? 1);
  return requireFiniteResult(m * g * 1e3 * r * CM_PER_M * Math.log(s / r), 'spacingM');
}

export interface CoronaOnsetInput {
  readonly wireRadiusM: number;
  readonly pressureCmHg: number;
  readonly temperatureC: number;
  /** m_v: 1 smooth polished wire; 0.98–0.93 rough or weathered; 0.87–0.83 stranded. */
  readonly surfaceFactor: number;
  /** Collector tube radius for a coaxial geometry; omit for the gradient alone. */
  readonly outerRadiusM?: number;
}

export interface CoronaOnset {
  readonly airDensityFactor: number;
  /** Smooth-wire visual critical gradient g_v, peak kV/cm. */
  readonly onsetGradientKvPerCm: number;
  /** Coaxial onset voltage m_v·g_v·r·ln(R/r) (peak); present only when outerRadiusM is given. */
  readonly onsetV?: number;
  readonly source: string;
}

const PEEK_SOURCE =
  "Peek's law (F. W. Peek, Dielectric Phenomena in High-Voltage Engineering, McGraw-Hill, 1929; Kuffel & Zaengl, High Voltage Engineering Fundamentals, p. 366): g_v = g₀δ(1 + c/√(δr)), g₀ = 30 kV/cm, c = 0.301, δ = 3.92b/(273 + t); coaxial onset V = m_v·g_v·r·ln(R/r)";

/** Corona onset on a smooth or rough wire, optionally inside a coaxial collector. */
export function coronaOnset(input: CoronaOnsetInput): CoronaOnset {
  const delta = airDensityFactor(input);
  const m = requireSurfaceFactor(input.surfaceFactor);
  const onsetGradientKvPerCm = peekOnsetGradientKvPerCm({ wireRadiusM: input.wireRadiusM, airDensityFactor: delta });
  const base = { airDensityFactor: delta, onsetGradientKvPerCm, source: PEEK_SOURCE };
  if (input.outerRadiusM === undefined) return base;
  return {
    ...base,
    onsetV: coaxialOnsetV({ wireRadiusM: input.wireRadiusM, outerRadiusM: input.outerRadiusM, onsetGradientKvPerCm, surfaceFactor: m }),
  };
}
