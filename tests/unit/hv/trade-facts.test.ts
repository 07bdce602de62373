import { currentFromPowerA, gramsForceToNewtons, specificPowerWPerG, thrustToWeightRatio } from '../../../shared/hv';
import { expectWithin } from './expect-within';

describe('trade facts for sanity-checking EHD data (common practice, no source)', () => {
  it('45 kV drawing 90 W carries 2.0 mA (I = P/V; common practice, no source)', () => {
    expectWithin(currentFromPowerA({ powerW: 90, voltageV: 45e3 }), 2.0e-3);
  });

  it('22 g of thrust on a 490 g device is 4.5 % thrust-to-weight (common practice, no source)', () => {
    expectWithin(thrustToWeightRatio({ thrustN: gramsForceToNewtons(22), massKg: 0.49 }), 0.045);
  });

  it('90 W for 22 g is ≈ 4.1 W/g (common practice, no source)', () => {
    expectWithin(specificPowerWPerG({ powerW: 90, massKg: 0.022 }), 4.1);
  });
});
