import { capacitorEnergy, storedChargeC, storedEnergyJ } from '../../../shared/hv';
import { expectWithin } from './expect-within';

describe('stored energy and charge', () => {
  it('1 µF at 10 kV stores 50.0 J (E = ½CV², textbook electrostatics; domain check 1)', () => {
    expectWithin(storedEnergyJ({ capacitanceF: 1e-6, voltageV: 10e3 }), 50.0);
  });

  it('1 µF at 10 kV holds 10 mC (Q = CV, textbook electrostatics; domain check 2)', () => {
    expectWithin(storedChargeC({ capacitanceF: 1e-6, voltageV: 10e3 }), 0.01);
  });

  it('a 30 kV electrospinning output with 1 nF stores 0.45 J, above 350 mJ (E = ½CV², derived worked example)', () => {
    expectWithin(storedEnergyJ({ capacitanceF: 1e-9, voltageV: 30e3 }), 0.45);
  });

  it('capacitorEnergy returns both quantities with their source', () => {
    const result = capacitorEnergy({ capacitanceF: 1e-6, voltageV: 10e3 });
    expectWithin(result.energyJ, 50);
    expectWithin(result.chargeC, 0.01);
    expect(result.source).toMatch(/½CV²/);
  });

  it('no voltage means no energy', () => {
    expect(storedEnergyJ({ capacitanceF: 1e-6, voltageV: 0 })).toBe(0);
  });
});
