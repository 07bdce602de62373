import {
  EHD,
  ehdThrustBoundN,
  ehdThrustPerPowerBoundNPerW,
  electricalPowerW,
  gramsForceToNewtons,
  momentumFluxVelocityMps,
  thrustPerPowerNPerW,
  wattsPerGramForce,
} from '../../../shared/hv';
import { catchHvInputError, expectWithin } from './expect-within';

describe('one-dimensional EHD bound (Masuyama & Barrett, Proc. R. Soc. A 2013; T = I·d/μ)', () => {
  it('uses μ = 2 × 10⁻⁴ m²/(V·s) by default, marked from memory', () => {
    expect(EHD.ionMobilityM2PerVs.value).toBe(2e-4);
    expect(EHD.ionMobilityM2PerVs.marker).toBe('from-memory');
  });

  it('1 mA across 30 mm with μ = 2 × 10⁻⁴ bounds the thrust at 150 mN (T = I·d/μ = 1e-3 × 0.03 / 2e-4 [D])', () => {
    expectWithin(ehdThrustBoundN({ currentA: 1e-3, gapM: 0.03 }), 0.15);
  });

  it('its thrust per power is 1/(μ·E): a mean field of 1 kV/mm gives 5 N/kW = 5 mN/W [D from the same relation]', () => {
    expectWithin(ehdThrustPerPowerBoundNPerW({ voltageV: 30e3, gapM: 0.03 }), 5e-3);
  });

  it('the two bounds agree: (I·d/μ) / (V·I) = d/(μ·V) (identity of the 1-D model, any input)', () => {
    for (const [kv, ma, mm] of [
      [8, 0.05, 15],
      [12, 0.4, 30],
      [45, 1.2, 60],
    ] as const) {
      const thrust = ehdThrustBoundN({ currentA: ma * 1e-3, gapM: mm * 1e-3 });
      const power = electricalPowerW({ voltageV: kv * 1e3, currentA: ma * 1e-3 });
      expectWithin(thrust / power, ehdThrustPerPowerBoundNPerW({ voltageV: kv * 1e3, gapM: mm * 1e-3 }), 1e-9);
    }
  });

  it('a larger mobility lowers the bound in proportion', () => {
    expectWithin(ehdThrustBoundN({ currentA: 1e-3, gapM: 0.03, ionMobilityM2PerVs: 3e-4 }), 0.1);
    expect(catchHvInputError(() => ehdThrustBoundN({ currentA: 1e-3, gapM: 0.03, ionMobilityM2PerVs: 0 })).field).toBe('ionMobilityM2PerVs');
  });
});

describe('power, thrust per power, watts per gram-force', () => {
  it('12 kV at 0.25 mA is 3 W (P = V·I, textbook)', () => {
    expectWithin(electricalPowerW({ voltageV: 12e3, currentA: 0.25e-3 }), 3);
  });

  it('15 mN for 3 W is 5 mN/W', () => {
    expectWithin(thrustPerPowerNPerW({ thrustN: 15e-3, powerW: 3 }) * 1e3, 5);
  });

  it('90 W for 22 gf of thrust is ≈ 4.1 W/gf (common practice, no source; the figure of the trade-facts test)', () => {
    expectWithin(wattsPerGramForce({ powerW: 90, thrustN: gramsForceToNewtons(22) }), 4.1, 0.005);
  });
});

describe('momentumFluxVelocityMps (T = ρ·A·v², textbook momentum balance)', () => {
  it('12 mN through 100 cm² of air at 1.2 kg/m³ is 1.0 m/s [D]', () => {
    expectWithin(momentumFluxVelocityMps({ thrustN: 12e-3, airDensityKgPerM3: 1.2, outletAreaM2: 0.01 }), 1.0);
  });

  it('doubling the velocity needs four times the thrust', () => {
    const v1 = momentumFluxVelocityMps({ thrustN: 0.01, airDensityKgPerM3: 1.2, outletAreaM2: 0.02 });
    const v4 = momentumFluxVelocityMps({ thrustN: 0.04, airDensityKgPerM3: 1.2, outletAreaM2: 0.02 });
    expectWithin(v4 / v1, 2, 1e-9);
  });

  it('refuses a zero outlet area', () => {
    expect(catchHvInputError(() => momentumFluxVelocityMps({ thrustN: 0.01, airDensityKgPerM3: 1.2, outletAreaM2: 0 })).field).toBe('outletAreaM2');
  });
});
