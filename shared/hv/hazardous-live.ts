import { HAZARDOUS_LIVE_LEVELS as L } from './data/iec61010';
import type { Marker } from './data/types';
import { formatQuantity } from './units';
import { requireFiniteResult, requireNonNegative, requirePositive } from './validate';

export type HazardCriterion =
  | 'voltage-below-limit'
  | 'current-above-limit'
  | 'charge-above-45uC'
  | 'energy-above-350mJ'
  | 'capacitance-above-15kV-junction'
  | 'below-current-and-capacitance-limits';

export interface HazardInput {
  /** DC voltage of the node; for a supply or multiplier, its peak (no-load maximum). */
  readonly voltageV: number;
  /** Current the source can drive into a person (short-circuit capability); 0 once switched off. */
  readonly currentA: number;
  /** Capacitance of the node to ground. */
  readonly capacitanceF: number;
}

export interface HazardClassification {
  readonly hazardous: boolean;
  /** The deciding criterion; the first of `criteria` when several are exceeded. */
  readonly criterion: HazardCriterion;
  /** Every limit exceeded, in the order current, capacitance. Empty when not hazardous. */
  readonly criteria: readonly HazardCriterion[];
  readonly explanation: string;
  readonly chargeC: number;
  readonly energyJ: number;
  /** Capacitance limit at this voltage; null at or below 70 V, where no capacitance is hazardous. */
  readonly maxNonHazardousCapacitanceF: number | null;
  readonly marker: Marker;
  readonly source: string;
}

const SOURCE =
  'IEC 61010-1 6.3.1 (normal condition): hazardous live if above 70 V DC and either above 2 mA DC or above the Figure 3 capacitance level (line A: 45 µC up to 15 kV; line B: 350 mJ above 15 kV)';

interface CapacitanceLimit {
  readonly maxCapacitanceF: number;
  readonly criterion: 'charge-above-45uC' | 'energy-above-350mJ' | 'capacitance-above-15kV-junction';
}

/**
 * The Figure 3 level as a capacitance. Line A (Q = 45 µC) holds up to and including 15 kV, which
 * is also the stricter line there (3 nF against 3.11 nF for 350 mJ). Just above 15 kV, line B
 * alone would allow up to 3.11 nF, so a node could turn non-hazardous as its voltage rises; the
 * limit is therefore held at the 15 kV value (3 nF) until line B falls below it (at ≈ 15.3 kV).
 * That hold applies the brief's "more protective at an edge" rule to the line switchover.
 */
function capacitanceLimit(voltageV: number): CapacitanceLimit {
  const chargeLimitF = (v: number) => L.chargeLimitC.value / v;
  if (voltageV <= L.lineSwitchV.value) {
    return { maxCapacitanceF: chargeLimitF(voltageV), criterion: 'charge-above-45uC' };
  }
  const energyLimitF = (2 * L.energyLimitJ.value) / (voltageV * voltageV);
  const junctionF = chargeLimitF(L.lineSwitchV.value);
  return energyLimitF <= junctionF
    ? { maxCapacitanceF: energyLimitF, criterion: 'energy-above-350mJ' }
    : { maxCapacitanceF: junctionF, criterion: 'capacitance-above-15kV-junction' };
}

/** Largest capacitance that is not hazardous by the capacitance criterion; null at or below 70 V. */
export function maxNonHazardousCapacitanceF({ voltageV }: { readonly voltageV: number }): number | null {
  const v = requireNonNegative(voltageV, 'voltageV');
  if (v <= L.voltageDcV.value) return null;
  return capacitanceLimit(v).maxCapacitanceF;
}

/** Energy stored at the 45 µC charge line at a given voltage: ½ · 45 µC · V. */
export function energyAtChargeLimitJ({ voltageV }: { readonly voltageV: number }): number {
  const v = requirePositive(voltageV, 'voltageV');
  return requireFiniteResult(0.5 * L.chargeLimitC.value * v, 'voltageV');
}

const MARKERS: Record<HazardCriterion, Marker> = {
  'voltage-below-limit': L.voltageDcV.marker,
  'current-above-limit': L.currentDcA.marker,
  'charge-above-45uC': L.chargeLimitC.marker,
  'energy-above-350mJ': L.energyLimitJ.marker,
  'capacitance-above-15kV-junction': 'derived',
  'below-current-and-capacitance-limits': L.currentDcA.marker,
};

/** Classifies a DC node as hazardous live or not per IEC 61010-1 6.3.1. */
export function classifyHazardousLive({ voltageV, currentA, capacitanceF }: HazardInput): HazardClassification {
  const v = requireNonNegative(voltageV, 'voltageV');
  const i = requireNonNegative(currentA, 'currentA');
  const c = requireNonNegative(capacitanceF, 'capacitanceF');
  const chargeC = requireFiniteResult(c * v, 'capacitanceF');
  const energyJ = requireFiniteResult(0.5 * c * v * v, 'capacitanceF');
  // Four digits so that 15.01 kV is not printed as 15 kV beside the 15 kV line switch.
  const fmt = (value: number, unit: string) => formatQuantity({ value, unit, significantDigits: 4 });
  const base = { chargeC, energyJ, source: SOURCE };

  if (v <= L.voltageDcV.value) {
    return {
      ...base,
      hazardous: false,
      criterion: 'voltage-below-limit',
      criteria: [],
      explanation: `${fmt(v, 'V')} is at or below the ${fmt(L.voltageDcV.value, 'V')} DC level, so the part is not hazardous live whatever its current or capacitance.`,
      maxNonHazardousCapacitanceF: null,
      marker: MARKERS['voltage-below-limit'],
    };
  }

  const limit = capacitanceLimit(v);
  const criteria: HazardCriterion[] = [];
  const reasons: string[] = [];
  if (i > L.currentDcA.value) {
    criteria.push('current-above-limit');
    reasons.push(`the source can deliver ${fmt(i, 'A')}, above the ${fmt(L.currentDcA.value, 'A')} DC current level`);
  }
  if (c > limit.maxCapacitanceF) {
    criteria.push(limit.criterion);
    reasons.push(
      limit.criterion === 'charge-above-45uC'
        ? `the stored charge ${fmt(chargeC, 'C')} exceeds 45 µC (Figure 3 line A, up to 15 kV)`
        : limit.criterion === 'energy-above-350mJ'
          ? `the stored energy ${fmt(energyJ, 'J')} exceeds 350 mJ (Figure 3 line B, above 15 kV)`
          : `the capacitance ${fmt(c, 'F')} exceeds ${fmt(limit.maxCapacitanceF, 'F')}, the line A limit at 15 kV, held just above 15 kV so that a rising voltage never makes a node less hazardous`,
    );
  }

  const [first] = criteria;
  const above = `${fmt(v, 'V')} is above the ${fmt(L.voltageDcV.value, 'V')} DC level`;
  return {
    ...base,
    hazardous: first !== undefined,
    criterion: first ?? 'below-current-and-capacitance-limits',
    criteria,
    explanation:
      first !== undefined
        ? `Hazardous live: ${above} and ${reasons.join('; also ')}.`
        : `Not hazardous live: ${above}, but the available current ${fmt(i, 'A')} is within ${fmt(L.currentDcA.value, 'A')} and the capacitance ${fmt(c, 'F')} is within the ${fmt(limit.maxCapacitanceF, 'F')} limit at this voltage.`,
    maxNonHazardousCapacitanceF: limit.maxCapacitanceF,
    marker: MARKERS[first ?? 'below-current-and-capacitance-limits'],
  };
}
