import { linearRegression, linearRegressionLine, rSquared, standardDeviation } from 'simple-statistics';
import { CORONA_FIT_MIN_POINTS, fitCoronaCurrent } from '../../../shared/hv';
import { coronaSweep, SWEEP_VOLTAGES_V } from './corona-sweep';
import { expectWithin } from './expect-within';

// A single-wire emitter sweep of the order seen at an EHD bench: C = 3 × 10⁻¹² A/V²
// (0.003 mA/kV²), V₀ = 6.5 kV, 7–14 kV.
const C_TRUE = 3e-12;
const V0_TRUE = 6500;

describe("fitCoronaCurrent: Townsend's I = C·V·(V − V₀) by least squares of I/V against V", () => {
  it('recovers C and V₀ exactly from noise-free data, with R² = 1', () => {
    const fit = fitCoronaCurrent(coronaSweep({ cAPerV2: C_TRUE, onsetV: V0_TRUE, voltagesV: SWEEP_VOLTAGES_V, noise: 0, seed: 1 }))!;
    expectWithin(fit.cAPerV2, C_TRUE, 1e-9);
    expectWithin(fit.onsetV, V0_TRUE, 1e-9);
    expectWithin(fit.rSquared, 1, 1e-12);
    expect(fit.n).toBe(15);
  });

  it('recovers C within 5 % and V₀ within 2 % (and within 3 standard errors) from 2 % noise', () => {
    const fit = fitCoronaCurrent(coronaSweep({ cAPerV2: C_TRUE, onsetV: V0_TRUE, voltagesV: SWEEP_VOLTAGES_V, noise: 0.02, seed: 20261203 }))!;
    expectWithin(fit.cAPerV2, C_TRUE, 0.05);
    expectWithin(fit.onsetV, V0_TRUE, 0.02);
    expect(Math.abs(fit.onsetV - V0_TRUE)).toBeLessThan(3 * fit.onsetVStdErr);
    expect(Math.abs(fit.cAPerV2 - C_TRUE)).toBeLessThan(3 * fit.cAPerV2StdErr);
    expect(fit.rSquared).toBeGreaterThan(0.98);
    console.log(
      `corona fit, 2 % noise: C = ${(fit.cAPerV2 * 1e9).toFixed(5)} ± ${(fit.cAPerV2StdErr * 1e9).toFixed(5)} mA/kV², V₀ = ${(fit.onsetV / 1e3).toFixed(3)} ± ${(fit.onsetVStdErr / 1e3).toFixed(3)} kV, R² = ${fit.rSquared.toFixed(4)}`,
    );
  });

  it("agrees with simple-statistics' linearRegression and rSquared on the same I/V-against-V data", () => {
    const points = coronaSweep({ cAPerV2: C_TRUE, onsetV: V0_TRUE, voltagesV: SWEEP_VOLTAGES_V, noise: 0.05, seed: 7 });
    const pairs = points.map((p) => [p.voltageV, p.currentA / p.voltageV]);
    const { m, b } = linearRegression(pairs);
    const fit = fitCoronaCurrent(points)!;
    expectWithin(fit.cAPerV2, m, 1e-9);
    expectWithin(fit.onsetV, -b / m, 1e-9);
    expectWithin(fit.rSquared, rSquared(pairs, linearRegressionLine({ m, b })), 1e-9);
  });

  // The textbook OLS standard errors assume the same scatter on every I/V; with that scatter they
  // must match what repeated sweeps really do.
  it('its standard error of V₀ matches the scatter of V₀ over 400 repeated sweeps with constant scatter (within 15 %; simple-statistics standardDeviation)', () => {
    const onsets: number[] = [];
    const reported: number[] = [];
    for (let seed = 1; seed <= 400; seed += 1) {
      const fit = fitCoronaCurrent(coronaSweep({ cAPerV2: C_TRUE, onsetV: V0_TRUE, voltagesV: SWEEP_VOLTAGES_V, noise: 0.02, seed, scatter: 'constant' }))!;
      onsets.push(fit.onsetV);
      reported.push(fit.onsetVStdErr);
    }
    const meanReported = reported.reduce((s, x) => s + x, 0) / reported.length;
    expectWithin(meanReported, standardDeviation(onsets), 0.15);
    console.log(`corona fit, 400 sweeps: V₀ scatter ${standardDeviation(onsets).toFixed(1)} V, mean reported standard error ${meanReported.toFixed(1)} V`);
  });

  it(`leaves out points without current and needs ${CORONA_FIT_MIN_POINTS} above onset`, () => {
    const below = [5000, 5500, 6000].map((voltageV) => ({ voltageV, currentA: 0 }));
    const three = coronaSweep({ cAPerV2: C_TRUE, onsetV: V0_TRUE, voltagesV: [8000, 10000, 12000], noise: 0, seed: 1 });
    expect(fitCoronaCurrent([...below, ...three])).toBeNull();
    const four = coronaSweep({ cAPerV2: C_TRUE, onsetV: V0_TRUE, voltagesV: [8000, 9000, 10000, 12000], noise: 0, seed: 1 });
    const fit = fitCoronaCurrent([...below, ...four])!;
    expect(fit.n).toBe(4);
    expectWithin(fit.onsetV, V0_TRUE, 1e-9);
  });

  it('reports no fit for a flat or falling I/V (not a corona characteristic)', () => {
    expect(fitCoronaCurrent([8000, 9000, 10000, 11000].map((voltageV) => ({ voltageV, currentA: 1e-6 * voltageV })))).toBeNull();
  });
});
