import type { SourcedValue } from './types';

/**
 * Constants for the ionic-wind (EHD) sanity checks on logged bench runs. Settings a lab may want
 * to change are data here, with the source and how far the value can be trusted.
 */
export const EHD = {
  ionMobilityM2PerVs: {
    // Positive ions in room air; the literature spreads it over about 1.5–2.7 × 10⁻⁴ with
    // polarity and humidity, so the thrust-bound tolerance below is wide on purpose.
    value: 2e-4,
    unit: 'm²/(V·s)',
    source:
      'typical mobility of positive ions in air at room conditions, about 2 × 10⁻⁴ m²/(V·s), the value used with the one-dimensional EHD model of Masuyama & Barrett, Proc. R. Soc. A 469 (2013); value and citation from memory',
    edition: 'n/a',
    marker: 'from-memory',
  },
  thrustBoundTolerancePct: {
    // Covers the mobility's spread (2.7/2.0 ≈ 1.35) plus meter error: above this the reading is
    // more likely a unit slip or a mis-zeroed balance than physics.
    value: 40,
    unit: '%',
    source: 'lab setting: flag a thrust more than 40 % above the one-dimensional bound I·d/μ',
    edition: 'n/a',
    marker: 'common-practice',
  },
  momentumMismatchFactor: {
    // The jet is not a uniform slug through the outlet: measured centre-line speeds and the
    // momentum-flux mean differ by tens of percent; a factor of two means a wrong unit or area.
    value: 2,
    unit: '×',
    source: 'lab setting: flag when measured velocity and √(T/(ρA)) differ by more than a factor of 2',
    edition: 'n/a',
    marker: 'common-practice',
  },
} as const satisfies Record<string, SourcedValue>;

/** Constants of the air-density formula (ideal-gas mixture of dry air and water vapour). */
export const AIR_GAS = {
  molarGasConstantJPerMolK: {
    value: 8.314462618,
    unit: 'J/(mol·K)',
    source: 'CODATA 2018 molar gas constant R (exact since the 2019 SI redefinition)',
    edition: '2018',
    marker: 'from-memory',
  },
  dryAirMolarMassKgPerMol: {
    value: 0.028965,
    unit: 'kg/mol',
    source: 'molar mass of dry air, CIPM-2007 air-density formula (Picard et al., Metrologia 45 (2008) 149): M_a = 28.96546 g/mol at 400 ppm CO₂, rounded',
    edition: '2007',
    marker: 'from-memory',
  },
  waterMolarMassKgPerMol: {
    value: 0.018015,
    unit: 'kg/mol',
    source: 'molar mass of water, CIPM-2007 air-density formula: M_v = 18.01528 g/mol',
    edition: '2007',
    marker: 'from-memory',
  },
  celsiusZeroK: {
    value: 273.15,
    unit: 'K',
    source: 'definition of the Celsius scale',
    edition: 'SI',
    marker: 'confirmed',
  },
} as const satisfies Record<string, SourcedValue>;
