import { HOT_STICK_TESTS } from './data/osha';
import type { Marker } from './data/types';
import { METRES_PER_FOOT } from './units';
import { requireFiniteResult, requireOneOf, requirePositive } from './validate';

export type HotStickMaterial = 'frp' | 'wood';
export type HotStickTest = 'design' | 'in-service';
const MATERIALS: readonly HotStickMaterial[] = ['frp', 'wood'];
const TESTS: readonly HotStickTest[] = ['design', 'in-service'];

export interface HotStickTestInput {
  /** Working length under test; the test must cover the whole working length. */
  readonly lengthM: number;
  readonly material: HotStickMaterial;
  readonly test: HotStickTest;
}

export interface HotStickTestVoltage {
  readonly testVoltageV: number;
  readonly durationS: number;
  readonly gradientVPerFt: number;
  readonly marker: Marker;
  readonly source: string;
  readonly edition: string;
}

const KEYS = {
  frp: { design: 'frpDesign', 'in-service': 'frpInService' },
  wood: { design: 'woodDesign', 'in-service': 'woodInService' },
} as const;

/**
 * Dielectric test voltage and hold time for a live-line tool (also the usual specification for
 * lab grounding and discharge sticks), per 29 CFR 1910.269(j). OSHA states the gradient per foot,
 * so the length is converted to feet exactly (0.3048 m/ft) rather than using its rounded V/m.
 */
export function hotStickTestVoltage({ lengthM, material, test }: HotStickTestInput): HotStickTestVoltage {
  const length = requirePositive(lengthM, 'lengthM');
  const m = requireOneOf(material, MATERIALS, 'material');
  const t = requireOneOf(test, TESTS, 'test');
  const row = HOT_STICK_TESTS[KEYS[m][t]];
  return {
    testVoltageV: requireFiniteResult((length / METRES_PER_FOOT) * row.gradientVPerFt.value, 'lengthM'),
    durationS: row.durationS.value,
    gradientVPerFt: row.gradientVPerFt.value,
    marker: row.gradientVPerFt.marker,
    source: row.gradientVPerFt.source,
    edition: row.gradientVPerFt.edition,
  };
}
