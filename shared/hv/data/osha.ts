import type { SourcedValue } from './types';

/**
 * OSHA 29 CFR 1910.269(j): live-line tools. The rule states gradients per foot of length (the
 * metric figures are its own conversions), so the per-foot values are the primary data.
 */
export const HOT_STICK_TESTS = {
  frpDesign: {
    gradientVPerFt: {
      value: 100_000,
      unit: 'V/ft',
      source: '29 CFR 1910.269(j)(1): FRP tools, 100 000 V/ft (328 100 V/m) for 5 min',
      edition: 'current CFR text',
      marker: 'confirmed',
    },
    durationS: { value: 300, unit: 's', source: '29 CFR 1910.269(j)(1)', edition: 'current CFR text', marker: 'confirmed' },
  },
  woodDesign: {
    gradientVPerFt: {
      value: 75_000,
      unit: 'V/ft',
      source: '29 CFR 1910.269(j)(1): wood tools, 75 000 V/ft (246 100 V/m) for 3 min',
      edition: 'current CFR text',
      marker: 'confirmed',
    },
    durationS: { value: 180, unit: 's', source: '29 CFR 1910.269(j)(1)', edition: 'current CFR text', marker: 'confirmed' },
  },
  frpInService: {
    gradientVPerFt: {
      value: 75_000,
      unit: 'V/ft',
      source: '29 CFR 1910.269(j)(2): FRP in-service test, 75 000 V/ft (2 461 V/cm) for 1 min',
      edition: 'current CFR text',
      marker: 'confirmed',
    },
    durationS: { value: 60, unit: 's', source: '29 CFR 1910.269(j)(2)', edition: 'current CFR text', marker: 'confirmed' },
  },
  woodInService: {
    gradientVPerFt: {
      value: 50_000,
      unit: 'V/ft',
      source: '29 CFR 1910.269(j)(2): wood in-service test, 50 000 V/ft (1 640 V/cm) for 1 min',
      edition: 'current CFR text',
      marker: 'from-memory',
    },
    durationS: { value: 60, unit: 's', source: '29 CFR 1910.269(j)(2)', edition: 'current CFR text', marker: 'from-memory' },
  },
} as const satisfies Record<string, { gradientVPerFt: SourcedValue; durationS: SourcedValue }>;

/**
 * Electrical retest intervals. Rubber insulating PPE per 29 CFR 1910.137 (Table I-5 or I-6,
 * depending on edition); hot sticks used for primary protection per 1910.269(j)(2)(iii).
 */
export const RETEST_INTERVALS = {
  glove: {
    value: 6,
    unit: 'months',
    source: '29 CFR 1910.137: rubber insulating gloves, before first issue and every 6 months',
    edition: 'current CFR text',
    marker: 'confirmed',
  },
  sleeve: {
    value: 12,
    unit: 'months',
    source: '29 CFR 1910.137: rubber insulating sleeves, before first issue and every 12 months',
    edition: 'current CFR text',
    marker: 'confirmed',
  },
  blanket: {
    value: 12,
    unit: 'months',
    source: '29 CFR 1910.137: rubber insulating blankets, before first issue and every 12 months',
    edition: 'current CFR text',
    marker: 'confirmed',
  },
  'hot-stick': {
    value: 24,
    unit: 'months',
    source: '29 CFR 1910.269(j)(2)(iii): live-line tools for primary protection, examined (and tested as required) every 2 years',
    edition: 'current CFR text',
    marker: 'confirmed',
  },
} as const satisfies Record<string, SourcedValue>;
