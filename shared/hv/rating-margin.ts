import { requireFinite, requireFiniteResult, requireNonNegative, requirePositive } from './validate';

export interface RatingMarginInput {
  /** The item's rated voltage (probe, divider, cable, stand), kV DC/peak. */
  readonly ratedKv: number;
  /** The planned peak voltage it will see, kV. */
  readonly plannedKv: number;
  /** The lab's required headroom over the planned voltage, percent. */
  readonly marginPct: number;
}

export interface RatingMargin {
  /** plannedKv × (1 + marginPct/100). */
  readonly requiredKv: number;
  /** ratedKv − plannedKv: headroom actually available (negative when under-rated). */
  readonly marginKv: number;
  /** Actual headroom as a percent of the planned voltage. */
  readonly marginPct: number;
  /** The lab's required percent, echoed so the result reads on its own. */
  readonly requiredMarginPct: number;
  readonly ok: boolean;
}

/**
 * Floating-point slack for the comparison only: 100 kV × 1.1 is 110.00000000000001 in binary,
 * which must not fail an item rated exactly 110 kV. A part in 1e12 has no safety meaning.
 */
const COMPARISON_SLACK = 1e-12;

/** Whether an item's rating covers the planned voltage plus the lab's margin (the brief's kit rule: rating ≥ V_peak). */
export function ratingMargin({ ratedKv, plannedKv, marginPct }: RatingMarginInput): RatingMargin {
  const rated = requireNonNegative(ratedKv, 'ratedKv');
  const planned = requirePositive(plannedKv, 'plannedKv');
  const required = requireNonNegative(marginPct, 'marginPct');
  const requiredKv = requireFiniteResult(planned * (1 + required / 100), 'plannedKv');
  const marginKv = rated - planned;
  return {
    requiredKv,
    marginKv,
    marginPct: requireFinite((marginKv / planned) * 100, 'plannedKv'),
    requiredMarginPct: required,
    ok: rated >= requiredKv * (1 - COMPARISON_SLACK),
  };
}
