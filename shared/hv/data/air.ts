import type { SourcedValue } from './types';

/** Air breakdown and corona constants. Peak values throughout (breakdown follows the peak). */
export const AIR = {
  uniformBreakdownFieldVPerM: {
    value: 3e6,
    unit: 'V/m',
    source: 'rule of thumb ≈ 3 kV/mm (30 kV/cm) for uniform fields, gaps about 1 cm, sea-level air density',
    edition: 'n/a',
    marker: 'confirmed',
  },
  nearSparkoverWarnFieldVPerM: {
    // Non-uniform (wire, point) gaps break down well below the uniform-field value, so the
    // warning sits below 3 kV/mm. A heuristic: keep it configurable per lab.
    value: 2e6,
    unit: 'V/m',
    source: 'lab heuristic: flag a mean field ≥ 2 kV/mm across an air gap as near sparkover',
    edition: 'n/a',
    marker: 'common-practice',
  },
  schumannLinearKvPerCm: {
    value: 24.22,
    unit: 'kV/cm',
    source: 'Schumann uniform-field formula V = 24.22 δd + 6.08 √(δd) kV (d in cm), as given by Kuffel & Zaengl',
    edition: 'n/a',
    marker: 'from-memory',
  },
  schumannRootKvPerSqrtCm: {
    value: 6.08,
    unit: 'kV/cm^½',
    source: 'Schumann uniform-field formula, as given by Kuffel & Zaengl',
    edition: 'n/a',
    marker: 'from-memory',
  },
  paschenAPerCmTorr: {
    value: 15,
    unit: '1/(cm·Torr)',
    source: "Paschen's law constants for air (A)",
    edition: 'n/a',
    marker: 'confirmed',
  },
  paschenBVPerCmTorr: {
    value: 365,
    unit: 'V/(cm·Torr)',
    source: "Paschen's law constants for air (B)",
    edition: 'n/a',
    marker: 'confirmed',
  },
  paschenSecondaryEmission: {
    value: 0.01,
    unit: '1',
    source: "Paschen's law, secondary-emission coefficient γ for air",
    edition: 'n/a',
    marker: 'confirmed',
  },
  peekG0KvPerCm: {
    value: 30,
    unit: 'kV/cm (peak)',
    source: "Peek's law, g₀ ≈ 30 kV/cm peak (F. W. Peek, Dielectric Phenomena in High-Voltage Engineering, 1929)",
    edition: '1929',
    marker: 'confirmed',
  },
  peekCSqrtCm: {
    value: 0.301,
    unit: 'cm^½',
    source: "Peek's law constant c (Peek 1929; Kuffel & Zaengl p. 366)",
    edition: '1929',
    marker: 'confirmed',
  },
  peekDensityCoefficient: {
    value: 3.92,
    unit: 'K/cmHg',
    source: 'air density factor δ = 3.92 b / (273 + t), b in cmHg, t in °C (Peek)',
    edition: '1929',
    marker: 'confirmed',
  },
  peekZeroCelsiusK: {
    // Peek's formula uses 273, not 273.15; keeping his constant reproduces his δ = 1 point.
    value: 273,
    unit: 'K',
    source: 'air density factor δ = 3.92 b / (273 + t) (Peek)',
    edition: '1929',
    marker: 'confirmed',
  },
} as const satisfies Record<string, SourcedValue>;
