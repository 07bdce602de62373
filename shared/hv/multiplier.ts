import { requireFiniteResult, requireInteger, requireNonNegative, requirePositive } from './validate';

export interface MultiplierInput {
  /** n: stages, each with two capacitors and two diodes. */
  readonly stages: number;
  /** V_max: peak (not rms) voltage of the transformer or driver feeding the cascade. */
  readonly peakInputV: number;
  readonly frequencyHz: number;
  /** C: every stage capacitor, all assumed equal. */
  readonly stageCapacitanceF: number;
  /** I: DC load current; 0 for no load. */
  readonly loadCurrentA: number;
}

export interface MultiplierOutput {
  /** Ideal no-load output 2nV_max: the peak to use for boundary and hazard decisions. */
  readonly noLoadV: number;
  /** ΔV = (I/fC)(2n³/3 + n²/2 − n/6). */
  readonly dropV: number;
  /** Peak-to-peak ripple δV = (I/fC)·n(n+1)/2 (the "2δV" of Kuffel's notation). */
  readonly rippleV: number;
  /** Mean loaded output 2nV_max − ΔV, floored at 0. */
  readonly loadedV: number;
  /** True when the drop reaches the no-load voltage: the formulas no longer describe the circuit. */
  readonly overloaded: boolean;
  /** n_opt = √(V_max f C / I); null at no load, where more stages always give more voltage. */
  readonly optimumStages: number | null;
  /** C/n: the smoothing column's n capacitors in series. */
  readonly outputCapacitanceF: number;
  /** ½(C/n)(2nV_max)² = 2nCV_max²: energy reachable at the output terminal. */
  readonly outputEnergyJ: number;
  /** Oscillating column: ½CV_max² + (n−1)·½C(2V_max)². */
  readonly oscillatingEnergyJ: number;
  /** Whole stack, (4n − 1.5)CV_max²: what every stage node holds after the output is grounded. */
  readonly stackEnergyJ: number;
  readonly source: string;
}

const SOURCE =
  'Cockcroft–Walton (Greinacher) half-wave cascade formulas: Kuffel, Zaengl & Kuffel, High Voltage Engineering: Fundamentals, 2nd ed. (2000), ch. 2, cascade circuits (chapter attribution from memory); the same formulas appear in Wadhwa and in Naidu & Kamaraju, High Voltage Engineering. Stack energy derived from the no-load node voltages (every capacitor at 2V_max, the first oscillating one at V_max).';

/**
 * Output of an n-stage half-wave Cockcroft–Walton multiplier, in Kuffel's convention. The
 * half-wave drop is used even for symmetrical cascades because it is the larger, conservative one.
 */
export function multiplierOutput(input: MultiplierInput): MultiplierOutput {
  const n = requireInteger(input.stages, 'stages', 1);
  const vMax = requirePositive(input.peakInputV, 'peakInputV');
  const f = requirePositive(input.frequencyHz, 'frequencyHz');
  const c = requirePositive(input.stageCapacitanceF, 'stageCapacitanceF');
  const i = requireNonNegative(input.loadCurrentA, 'loadCurrentA');

  const perStageV = requireFiniteResult(i / (f * c), 'loadCurrentA');
  const noLoadV = requireFiniteResult(2 * n * vMax, 'peakInputV');
  // 2n³/3 + n²/2 − n/6 = n(4n − 1)(n + 1)/6, an integer: this form avoids rounding in the sum.
  const dropV = requireFiniteResult((perStageV * n * (4 * n - 1) * (n + 1)) / 6, 'loadCurrentA');
  const rippleV = requireFiniteResult((perStageV * n * (n + 1)) / 2, 'loadCurrentA');
  const overloaded = dropV >= noLoadV;
  const loadedV = overloaded ? 0 : noLoadV - dropV;
  // n_opt grows without bound as I → 0; at no load (or a current so small that it overflows)
  // there is no optimum, which null says without putting Infinity into JSON.
  const nOpt = Math.sqrt((vMax * f * c) / i);
  const optimumStages = Number.isFinite(nOpt) ? nOpt : null;

  const unitEnergyJ = requireFiniteResult(c * vMax * vMax, 'peakInputV');
  const outputEnergyJ = requireFiniteResult(2 * n * unitEnergyJ, 'peakInputV');
  const oscillatingEnergyJ = requireFiniteResult((2 * n - 1.5) * unitEnergyJ, 'peakInputV');
  const stackEnergyJ = requireFiniteResult(outputEnergyJ + oscillatingEnergyJ, 'peakInputV');

  return {
    noLoadV,
    dropV,
    rippleV,
    loadedV,
    overloaded,
    optimumStages,
    outputCapacitanceF: c / n,
    outputEnergyJ,
    oscillatingEnergyJ,
    stackEnergyJ,
    source: SOURCE,
  };
}
