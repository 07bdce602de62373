import { AIR_GAS } from './data/ehd';
import { HvInputError } from './errors';
import { requireFinite, requireFiniteResult, requirePositive } from './validate';

// Air density for the momentum-flux check (v = √(T/(ρA))). Peek's relative density δ
// (airDensityFactor in breakdown.ts) stays the one for breakdown and corona onset.

const PA_PER_HPA = 100;
const PA_PER_KPA = 1000;
/** 1 cmHg = 1333.22 Pa (13.5951 g/cm³ mercury under standard gravity). */
const PA_PER_CMHG = 1333.224;

function kelvinOf(temperatureC: number): number {
  const t = requireFinite(temperatureC, 'temperatureC');
  const kelvin = AIR_GAS.celsiusZeroK.value + t;
  if (kelvin <= 0) throw new HvInputError('temperatureC', 'temperatureC must be above absolute zero (−273.15 °C)');
  return kelvin;
}

/** kPa to cmHg, for Peek's formulas, which take the barometer reading in cmHg. */
export function kpaToCmHg(pressureKpa: number): number {
  return requireFinite(pressureKpa, 'pressureKpa') * (PA_PER_KPA / PA_PER_CMHG);
}

/**
 * Saturation vapour pressure over water, Buck's equation (A. L. Buck, J. Appl. Meteor. 20 (1981)
 * 1527, 1996 revision): e_s = 6.1121·exp((18.678 − t/234.5)·t/(257.14 + t)) hPa, t in °C.
 * Within 0.05 % of the steam tables from −40 to 50 °C; constants from memory.
 */
export function saturationVapourPressurePa({ temperatureC }: { readonly temperatureC: number }): number {
  const t = requireFinite(temperatureC, 'temperatureC');
  if (t <= -257.14 + 1e-9) throw new HvInputError('temperatureC', 'temperatureC is outside the range of the vapour-pressure formula');
  return requireFiniteResult(6.1121 * Math.exp((18.678 - t / 234.5) * (t / (257.14 + t))) * PA_PER_HPA, 'temperatureC');
}

export interface AirDensityInput {
  readonly temperatureC: number;
  readonly pressurePa: number;
  /** 0–100 %; omit for dry air. */
  readonly relativeHumidityPct?: number;
}

/**
 * Density of moist air as an ideal mixture of dry air and water vapour:
 * ρ = (p_d·M_a + p_v·M_v) / (R·T), p_v = RH·e_s(t), p_d = p − p_v. This is the CIPM-2007 formula
 * (Picard et al., Metrologia 45 (2008) 149) without its compressibility Z (≈ 0.9996) and
 * enhancement factor f (≈ 1.004), each under 0.1 % at bench conditions. Dry air at 20 °C and
 * 101.325 kPa: 1.204 kg/m³; ISA sea level (15 °C): 1.225 kg/m³.
 */
export function airDensityKgPerM3({ temperatureC, pressurePa, relativeHumidityPct = 0 }: AirDensityInput): number {
  const kelvin = kelvinOf(temperatureC);
  const p = requirePositive(pressurePa, 'pressurePa');
  const rh = requireFinite(relativeHumidityPct, 'relativeHumidityPct');
  if (rh < 0 || rh > 100) throw new HvInputError('relativeHumidityPct', 'relativeHumidityPct must be between 0 and 100');
  const vapourPa = rh === 0 ? 0 : Math.min((rh / 100) * saturationVapourPressurePa({ temperatureC }), p);
  const dryPa = p - vapourPa;
  const numerator = dryPa * AIR_GAS.dryAirMolarMassKgPerMol.value + vapourPa * AIR_GAS.waterMolarMassKgPerMol.value;
  return requireFiniteResult(numerator / (AIR_GAS.molarGasConstantJPerMolK.value * kelvin), 'pressurePa');
}
