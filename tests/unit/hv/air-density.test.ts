import { airDensityFactor, airDensityKgPerM3, kpaToCmHg, saturationVapourPressurePa } from '../../../shared/hv';
import { catchHvInputError, expectWithin } from './expect-within';

describe('airDensityKgPerM3 (ideal mixture of dry air and vapour, CIPM-2007 without Z and f)', () => {
  it('dry air at 20 °C and 101.325 kPa is 1.204 kg/m³ (handbook value for dry air, e.g. CRC Handbook table of air density)', () => {
    expectWithin(airDensityKgPerM3({ temperatureC: 20, pressurePa: 101_325 }), 1.204, 0.001);
  });

  it('ISA sea level, 15 °C and 101.325 kPa, is 1.225 kg/m³ (ISO 2533 / ICAO standard atmosphere)', () => {
    expectWithin(airDensityKgPerM3({ temperatureC: 15, pressurePa: 101_325, relativeHumidityPct: 0 }), 1.225, 0.001);
  });

  it('humid air is lighter: 20 °C, 101.325 kPa, 50 % RH is about 1.199 kg/m³ (moist-air tables; from memory)', () => {
    const humid = airDensityKgPerM3({ temperatureC: 20, pressurePa: 101_325, relativeHumidityPct: 50 });
    expectWithin(humid, 1.199, 0.002);
    expect(humid).toBeLessThan(airDensityKgPerM3({ temperatureC: 20, pressurePa: 101_325 }));
  });

  it('refuses a humidity outside 0–100 % and a temperature at absolute zero', () => {
    expect(catchHvInputError(() => airDensityKgPerM3({ temperatureC: 20, pressurePa: 101_325, relativeHumidityPct: 120 })).field).toBe('relativeHumidityPct');
    expect(catchHvInputError(() => airDensityKgPerM3({ temperatureC: -273.15, pressurePa: 101_325 })).field).toBe('temperatureC');
    expect(catchHvInputError(() => airDensityKgPerM3({ temperatureC: 20, pressurePa: 0 })).field).toBe('pressurePa');
  });
});

describe('saturationVapourPressurePa (Buck 1981/1996)', () => {
  // Steam-table values (IAPWS, as printed in the CRC Handbook; from memory).
  it.each([
    [0, 611.2],
    [20, 2339.3],
    [30, 4246.9],
    [50, 12352],
  ])('at %d °C is %d Pa (steam tables)', (temperatureC, expectedPa) => {
    expectWithin(saturationVapourPressurePa({ temperatureC }), expectedPa, 0.003);
  });
});

describe('kpaToCmHg, for Peek’s δ', () => {
  it('101.325 kPa is 76 cmHg (definition of the standard atmosphere), so δ at 25 °C is 1.000 (Peek)', () => {
    expectWithin(kpaToCmHg(101.325), 76, 1e-5);
    expectWithin(airDensityFactor({ pressureCmHg: kpaToCmHg(101.325), temperatureC: 25 }), 0.9997, 0.001);
  });
});
