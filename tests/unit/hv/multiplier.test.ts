import { classifyHazardousLive, multiplierOutput } from '../../../shared/hv';
import { catchHvInputError, expectWithin } from './expect-within';

// Source for the cascade formulas: Kuffel, Zaengl & Kuffel, High Voltage Engineering
// Fundamentals, cascade formulas (confirmed as formulas; chapter attribution from memory).
const example1 = { stages: 5, peakInputV: 10e3, frequencyHz: 50e3, stageCapacitanceF: 1e-9, loadCurrentA: 1e-3 };
const example2 = { stages: 3, peakInputV: 20e3, frequencyHz: 50, stageCapacitanceF: 1e-7, loadCurrentA: 1e-3 };

describe('multiplierOutput, kHz-driven lab multiplier (Kuffel cascade formulas; domain check 16)', () => {
  const out = multiplierOutput(example1);

  it('no-load output 2nVmax = 100 kV (Kuffel cascade formulas, confirmed)', () => {
    expectWithin(out.noLoadV, 100e3);
  });

  it('drop ΔV = (I/fC)(2n³/3 + n²/2 − n/6) = 1 900 V (Kuffel cascade formulas, confirmed)', () => {
    expectWithin(out.dropV, 1900);
  });

  it('ripple δV = (I/fC)·n(n+1)/2 = 300 V peak-to-peak (Kuffel cascade formulas, confirmed)', () => {
    expectWithin(out.rippleV, 300);
  });

  it('loaded output ≈ 98.1 kV (Kuffel cascade formulas, confirmed)', () => {
    expectWithin(out.loadedV, 98.1e3);
    expect(out.overloaded).toBe(false);
  });

  it('n_opt = √(Vmax·f·C/I) = 22.36 (Kuffel cascade formulas, confirmed)', () => {
    expectWithin(out.optimumStages, 22.36);
  });
});

describe('multiplierOutput, mains-driven teaching set (Kuffel cascade formulas; domain check 17)', () => {
  const out = multiplierOutput(example2);

  it('V0 = 120 kV, ΔV = 4 400 V, ripple = 1 200 V, n_opt = 10.0 (Kuffel cascade formulas, confirmed)', () => {
    expectWithin(out.noLoadV, 120e3);
    expectWithin(out.dropV, 4400);
    expectWithin(out.rippleV, 1200);
    expectWithin(out.optimumStages, 10.0);
  });

  it('C_eq = 33.3 nF, output energy 240 J, stack ≈ 420 J: lethal range (stack energy, derived, domain §4.1)', () => {
    expectWithin(out.outputCapacitanceF, 33.33e-9);
    expectWithin(out.outputEnergyJ, 240);
    expectWithin(out.stackEnergyJ, 420);
  });
});

describe('multiplier stack energy (derived, domain §4.1; domain check 18)', () => {
  const out = multiplierOutput(example1);

  it('n = 5, C = 1 nF, Vmax = 10 kV: C_eq = 0.2 nF, E_out = 1.00 J, E_total = 1.85 J (derived)', () => {
    expectWithin(out.outputCapacitanceF, 0.2e-9);
    expectWithin(out.outputEnergyJ, 1.0);
    expectWithin(out.stackEnergyJ, 1.85);
    expectWithin(out.oscillatingEnergyJ, 0.85);
  });

  it('the output stops being hazardous by the 350 mJ line below ≈ 59.2 kV (IEC 61010-1 line B with C_eq, derived)', () => {
    const node = (voltageV: number) => classifyHazardousLive({ voltageV, currentA: 0, capacitanceF: out.outputCapacitanceF });
    expect(node(59.5e3).hazardous).toBe(true);
    expect(node(58.9e3).hazardous).toBe(false);
  });
});

describe('multiplierOutput edge cases', () => {
  it('with no load there is no drop or ripple and no optimum stage count', () => {
    const out = multiplierOutput({ ...example1, loadCurrentA: 0 });
    expect(out.dropV).toBe(0);
    expect(out.rippleV).toBe(0);
    expect(out.loadedV).toBe(out.noLoadV);
    expect(out.optimumStages).toBeNull();
    expect(JSON.parse(JSON.stringify(out))).toEqual(out);
  });

  it('gives no optimum, rather than Infinity, for a vanishing load current', () => {
    expect(multiplierOutput({ ...example1, loadCurrentA: 5e-324 }).optimumStages).toBeNull();
  });

  it('matches the expanded drop form I/(6fC)(4n³ + 3n² − n) (voltage-multiplier notes, confirmed)', () => {
    for (let n = 1; n <= 50; n += 1) {
      const out = multiplierOutput({ ...example1, stages: n });
      const perStage = example1.loadCurrentA / (example1.frequencyHz * example1.stageCapacitanceF);
      expectWithin(out.dropV, (perStage / 6) * (4 * n ** 3 + 3 * n ** 2 - n), 1e-12);
    }
  });

  it('flags an overloaded cascade whose drop reaches the no-load voltage, and floors the output at 0', () => {
    const out = multiplierOutput({ ...example2, stages: 40 });
    expect(out.overloaded).toBe(true);
    expect(out.loadedV).toBe(0);
  });

  it('rejects fractional or zero stage counts, naming stages', () => {
    expect(catchHvInputError(() => multiplierOutput({ ...example1, stages: 2.5 })).field).toBe('stages');
    expect(catchHvInputError(() => multiplierOutput({ ...example1, stages: 0 })).field).toBe('stages');
  });
});
