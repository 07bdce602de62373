import type { SourcedValue } from './types';

/**
 * Residual voltage that labs treat as safe to touch after discharge. 50 V is the default because
 * it is the lower (more protective) of the two published figures; labs may choose 60 V.
 */
export const SAFE_RESIDUAL_VOLTAGE = {
  default: {
    value: 50,
    unit: 'V',
    source: 'NEC 460.6 / 460.28 and Cal/OSHA 8 CCR §2893: residual ≤ 50 V after discharge',
    edition: 'NEC edition not recorded; Cal/OSHA current text',
    marker: 'confirmed',
  },
  alternative: {
    value: 60,
    unit: 'V',
    source: 'IEC 61010-1 6.10.3 practice (≤ 60 V at 5 s) and NFPA 79 6.5.1',
    edition: 'NFPA 79-2024',
    marker: 'confirmed',
  },
} as const satisfies Record<string, SourcedValue>;

/**
 * "Wait five time constants" is folklore, not a standard: it leaves e^-5 ≈ 0.674 % of the start
 * voltage, which is above 50 V for any start voltage over about 7.4 kV.
 */
export const FIVE_TIME_CONSTANTS: SourcedValue = {
  value: 5,
  unit: 'τ',
  source: 'lab rule of thumb; no normative source',
  edition: 'n/a',
  marker: 'common-practice',
};
