import { FIVE_TIME_CONSTANTS } from './data/residual-voltage';
import { HvInputError } from './errors';
import { formatQuantity } from './units';
import { requireFiniteResult, requireNonNegative, requirePositive } from './validate';

const SOURCE = 'V(t) = V₀·e^(−t/RC); t_safe = RC·ln(V₀/V_safe) (exponential RC discharge, textbook)';

export interface RcInput {
  readonly resistanceOhm: number;
  readonly capacitanceF: number;
}

export function timeConstantS({ resistanceOhm, capacitanceF }: RcInput): number {
  const r = requirePositive(resistanceOhm, 'resistanceOhm');
  const c = requirePositive(capacitanceF, 'capacitanceF');
  return requireFiniteResult(r * c, 'resistanceOhm');
}

/** Voltage left on a capacitor discharging through R after `timeS`. */
export function residualVoltageV(input: RcInput & { readonly initialV: number; readonly timeS: number }): number {
  const v0 = requireNonNegative(input.initialV, 'initialV');
  const t = requireNonNegative(input.timeS, 'timeS');
  const tau = timeConstantS(input);
  return v0 * Math.exp(-t / tau);
}

/** Voltage left after a given number of time constants (V₀·e^−N). */
export function residualAfterTimeConstantsV({ initialV, timeConstants }: { readonly initialV: number; readonly timeConstants: number }): number {
  const v0 = requireNonNegative(initialV, 'initialV');
  const n = requireNonNegative(timeConstants, 'timeConstants');
  return v0 * Math.exp(-n);
}

/** Validates a start/safe pair: both positive (they are divided and logged) and safe below start. */
function requireSafeBelowInitial(initialV: unknown, safeV: unknown): { v0: number; vs: number } {
  const v0 = requirePositive(initialV, 'initialV');
  const vs = requirePositive(safeV, 'safeV');
  if (vs >= v0) {
    throw new HvInputError('safeV', 'safeV must be below initialV: there is nothing to discharge');
  }
  return { v0, vs };
}

/** N = ln(V₀ / V_safe): how many time constants the discharge really needs. */
export function timeConstantsToSafe({ initialV, safeV }: { readonly initialV: number; readonly safeV: number }): number {
  const { v0, vs } = requireSafeBelowInitial(initialV, safeV);
  return Math.log(v0 / vs);
}

/** t_safe = RC·ln(V₀ / V_safe). */
export function timeToSafeVoltageS(input: RcInput & { readonly initialV: number; readonly safeV: number }): number {
  const n = timeConstantsToSafe(input);
  return requireFiniteResult(timeConstantS(input) * n, 'resistanceOhm');
}

/** Steady-state bleeder dissipation P = V²/R; the bleeder must also be rated for V. */
export function bleederPowerW({ voltageV, resistanceOhm }: { readonly voltageV: number; readonly resistanceOhm: number }): number {
  const v = requireNonNegative(voltageV, 'voltageV');
  const r = requirePositive(resistanceOhm, 'resistanceOhm');
  return requireFiniteResult((v * v) / r, 'voltageV');
}

export interface DischargePlanInput extends RcInput {
  readonly initialV: number;
  readonly safeV: number;
}

export interface DischargePlan {
  /** Time to reach safeV through the bleeder: RC·ln(V₀/V_safe). */
  readonly timeS: number;
  /** ln(V₀/V_safe). */
  readonly timeConstants: number;
  readonly tauS: number;
  /** V₀·e^−5: what the "wait 5τ" habit actually leaves. */
  readonly residualAfter5TauV: number;
  readonly fiveTauIsEnough: boolean;
  /** Highest start voltage for which 5τ reaches safeV: V_safe·e^5 (≈ 7 421 V for 50 V). */
  readonly fiveTauLimitV: number;
  readonly note: string;
  readonly source: string;
}

/**
 * The wait before touching a node after switch-off. The brief insists the tool compute N instead
 * of assuming five time constants, because 5τ leaves 0.674 % of V₀, i.e. more than 50 V from
 * any start above about 7.4 kV. The plan still ends with a discharge stick and a ground hook.
 */
export function dischargePlan(input: DischargePlanInput): DischargePlan {
  const timeConstants = timeConstantsToSafe(input);
  const tauS = timeConstantS(input);
  const timeS = requireFiniteResult(tauS * timeConstants, 'resistanceOhm');
  const fiveTau = FIVE_TIME_CONSTANTS.value;
  const residualAfter5TauV = input.initialV * Math.exp(-fiveTau);
  const fiveTauIsEnough = residualAfter5TauV <= input.safeV;
  const fiveTauLimitV = requireFiniteResult(input.safeV * Math.exp(fiveTau), 'safeV');
  const fmtV = (v: number) => formatQuantity({ value: v, unit: 'V' });
  const fmtS = (s: number) => formatQuantity({ value: s, unit: 's' });
  const wait = `Wait ${fmtS(timeS)} (${timeConstants.toFixed(2)} time constants of ${fmtS(tauS)}) for ${fmtV(input.initialV)} to fall to ${fmtV(input.safeV)}.`;
  const note = fiveTauIsEnough
    ? `${wait} Five time constants would also do, since ${fmtV(input.initialV)} is below ${fmtV(fiveTauLimitV)}.`
    : `${wait} Five time constants are not enough: after 5τ the node still holds ${fmtV(residualAfter5TauV)}, above the ${fmtV(input.safeV)} safe level (5τ only suffices up to ${fmtV(fiveTauLimitV)}).`;
  return { timeS, timeConstants, tauS, residualAfter5TauV, fiveTauIsEnough, fiveTauLimitV, note, source: SOURCE };
}
