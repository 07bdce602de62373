import { bleederPowerW, dischargePlan, residualAfterTimeConstantsV, residualVoltageV, timeConstantsToSafe, timeToSafeVoltageS } from '../../../shared/hv';
import { catchHvInputError, expectWithin } from './expect-within';

// Worked example of domain §3.1: C = 1 µF, V0 = 10 kV, R = 100 MΩ.
const example = { resistanceOhm: 100e6, capacitanceF: 1e-6, initialV: 10e3, safeV: 50 };

describe('time to a safe voltage', () => {
  it('100 MΩ, 1 µF, 10 kV → 50 V takes 529.8 s (t = RC·ln(V0/Vsafe), textbook RC discharge; domain check 3)', () => {
    expectWithin(timeToSafeVoltageS(example), 529.8);
  });

  it('that discharge needs 5.298 time constants (N = ln(V0/Vsafe), derived; domain check 3)', () => {
    expectWithin(timeConstantsToSafe(example), 5.298);
  });

  it('100 kV → 50 V needs 7.601 time constants (derived; domain check 5)', () => {
    expectWithin(timeConstantsToSafe({ initialV: 100e3, safeV: 50 }), 7.601);
  });

  // Domain §3.1 table of N for the two safe levels labs use (derived from ln(V0/Vsafe)).
  it.each([
    [1e3, 3.0, 2.81],
    [5e3, 4.61, 4.42],
    [10e3, 5.3, 5.12],
    [30e3, 6.4, 6.21],
    [50e3, 6.91, 6.73],
    [100e3, 7.6, 7.42],
  ])('from %s V: N = %s to 50 V and %s to 60 V (derived, domain §3.1 table)', (initialV, to50, to60) => {
    expectWithin(timeConstantsToSafe({ initialV, safeV: 50 }), to50);
    expectWithin(timeConstantsToSafe({ initialV, safeV: 60 }), to60);
  });

  it('30 kV through a 300 MΩ bleeder on 1 nF reaches 60 V in 1.86 s (derived worked example, domain §2.2)', () => {
    expectWithin(timeToSafeVoltageS({ resistanceOhm: 300e6, capacitanceF: 1e-9, initialV: 30e3, safeV: 60 }), 1.86);
  });

  it('…and leaves the 350 mJ line (26.46 kV) after 0.038 s (derived worked example, domain §2.2)', () => {
    expectWithin(timeToSafeVoltageS({ resistanceOhm: 300e6, capacitanceF: 1e-9, initialV: 30e3, safeV: Math.sqrt(0.7 / 1e-9) }), 0.0377, 0.01);
  });
});

describe('residual voltage', () => {
  it('10 kV after 5τ still holds 67.38 V (V0·e^−5, derived; domain check 4)', () => {
    expectWithin(residualAfterTimeConstantsV({ initialV: 10e3, timeConstants: 5 }), 67.38);
  });

  it('the same through R and C after 500 s (5τ of 100 s) is 67.38 V (textbook RC discharge)', () => {
    expectWithin(residualVoltageV({ ...example, timeS: 500 }), 67.38);
  });

  it('at t = 0 the full voltage remains', () => {
    expect(residualVoltageV({ ...example, timeS: 0 })).toBe(10e3);
  });
});

describe('dischargePlan', () => {
  it('says 5τ is not enough from 10 kV to 50 V, with 67.38 V left (derived; domain check 4, is_safe = false)', () => {
    const plan = dischargePlan(example);
    expect(plan.fiveTauIsEnough).toBe(false);
    expectWithin(plan.residualAfter5TauV, 67.38);
    expectWithin(plan.tauS, 100);
    expectWithin(plan.timeS, 529.8);
    expectWithin(plan.timeConstants, 5.298);
    expect(plan.note).toMatch(/not enough/);
    expect(plan.note).toMatch(/67\.4 V/);
  });

  it('places the 5τ limit for a 50 V target at 7 421 V (Vsafe·e^5, derived)', () => {
    expectWithin(dischargePlan(example).fiveTauLimitV, 7421);
  });

  it('accepts 5τ from 5 kV to 50 V (5 kV·e^−5 = 33.7 V, derived)', () => {
    const plan = dischargePlan({ ...example, initialV: 5e3 });
    expect(plan.fiveTauIsEnough).toBe(true);
    expectWithin(plan.residualAfter5TauV, 33.69);
  });

  it('flips exactly around 7.42 kV for a 50 V target', () => {
    expect(dischargePlan({ ...example, initialV: 7.4e3 }).fiveTauIsEnough).toBe(true);
    expect(dischargePlan({ ...example, initialV: 7.45e3 }).fiveTauIsEnough).toBe(false);
  });

  it('refuses a safe level at or above the start voltage, naming safeV', () => {
    expect(catchHvInputError(() => dischargePlan({ ...example, safeV: 10e3 })).field).toBe('safeV');
    expect(catchHvInputError(() => dischargePlan({ ...example, safeV: 20e3 })).field).toBe('safeV');
  });

  it('refuses a zero safe level (ln of infinity), naming safeV', () => {
    expect(catchHvInputError(() => dischargePlan({ ...example, safeV: 0 })).field).toBe('safeV');
  });
});

describe('bleeder dissipation', () => {
  it('100 MΩ at 10 kV dissipates 1 W (P = V²/R, textbook; domain §3.1 worked example)', () => {
    expectWithin(bleederPowerW({ voltageV: 10e3, resistanceOhm: 100e6 }), 1);
  });
});
