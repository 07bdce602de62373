import { HvInputError } from './errors';
import { requireFinite } from './validate';

// Townsend's corona current relation I = C·V·(V − V₀), fitted to a sweep at one gap and polarity.
// I/V = C·V − C·V₀ is a straight line in V, so ordinary least squares of I/V against V gives
// slope C and intercept −C·V₀ (Townsend's relation as given by Kuffel & Zaengl, corona chapter;
// from memory). Points below onset (no current) carry no information about C and are left out.

/** Fewer points above onset than this and the fit has too few degrees of freedom to trust. */
export const CORONA_FIT_MIN_POINTS = 4;

export interface CoronaPoint {
  readonly voltageV: number;
  readonly currentA: number;
}

export interface CoronaFit {
  /** Points used (current above zero). */
  readonly n: number;
  readonly onsetV: number;
  /** Standard error of V₀ from the line's covariance (first-order propagation of −b/m). */
  readonly onsetVStdErr: number;
  readonly cAPerV2: number;
  readonly cAPerV2StdErr: number;
  /** R² of the straight-line fit of I/V against V. */
  readonly rSquared: number;
  readonly source: string;
}

export const CORONA_FIT_SOURCE = "Townsend's corona current I = C·V·(V − V₀), least squares of I/V against V (Kuffel & Zaengl, corona chapter; from memory)";

/** Simple linear regression y = slope·x + intercept with the usual OLS standard errors. */
export function linearLeastSquares(xs: readonly number[], ys: readonly number[]) {
  const n = xs.length;
  if (n !== ys.length || n < 3) throw new HvInputError('points', 'a straight-line fit with standard errors needs at least three points');
  const meanX = xs.reduce((s, x) => s + x, 0) / n;
  const meanY = ys.reduce((s, y) => s + y, 0) / n;
  let sxx = 0;
  let sxy = 0;
  let syy = 0;
  for (let i = 0; i < n; i += 1) {
    const dx = xs[i]! - meanX;
    const dy = ys[i]! - meanY;
    sxx += dx * dx;
    sxy += dx * dy;
    syy += dy * dy;
  }
  if (sxx === 0) throw new HvInputError('points', 'every point is at the same voltage: sweep the voltage to fit a line');
  const slope = sxy / sxx;
  const intercept = meanY - slope * meanX;
  const residualSs = Math.max(0, syy - slope * sxy);
  const variance = residualSs / (n - 2);
  const slopeVar = variance / sxx;
  const interceptVar = variance * (1 / n + (meanX * meanX) / sxx);
  const covariance = (-meanX * variance) / sxx;
  return { n, slope, intercept, slopeVar, interceptVar, covariance, rSquared: syy === 0 ? 1 : 1 - residualSs / syy };
}

/** Null when fewer than CORONA_FIT_MIN_POINTS points carry current, or the line does not rise. */
export function fitCoronaCurrent(points: readonly CoronaPoint[]): CoronaFit | null {
  const above = points.filter((p) => requireFinite(p.currentA, 'currentA') > 0 && requireFinite(p.voltageV, 'voltageV') > 0);
  if (above.length < CORONA_FIT_MIN_POINTS) return null;
  const xs = above.map((p) => p.voltageV);
  if (new Set(xs).size < 2) return null;
  const line = linearLeastSquares(
    xs,
    above.map((p) => p.currentA / p.voltageV),
  );
  // A flat or falling I/V is no corona characteristic: no positive C, no onset to report.
  if (!(line.slope > 0)) return null;
  const c = line.slope;
  const onsetV = -line.intercept / c;
  // V₀ = −b/m: ∂V₀/∂b = −1/m, ∂V₀/∂m = b/m² = −V₀/m.
  const onsetVar = (line.interceptVar + onsetV * onsetV * line.slopeVar + 2 * onsetV * line.covariance) / (c * c);
  return {
    n: line.n,
    onsetV,
    onsetVStdErr: Math.sqrt(Math.max(0, onsetVar)),
    cAPerV2: c,
    cAPerV2StdErr: Math.sqrt(line.slopeVar),
    rSquared: line.rSquared,
    source: CORONA_FIT_SOURCE,
  };
}
