import {
  ampsToMa,
  ampsToUa,
  faradsToNf,
  faradsToPf,
  faradsToUf,
  formatQuantity,
  joulesToMillijoules,
  kvToVolts,
  metresToFeetInches,
  ohmsToGohm,
  ohmsToMohm,
  voltsToKv,
  HvInputError,
} from '../../../shared/hv';
import { expectWithin } from './expect-within';

describe('unit conversions for display', () => {
  it('converts volts, farads, ohms, amps and joules', () => {
    expectWithin(voltsToKv(45e3), 45);
    expectWithin(kvToVolts(45), 45e3);
    expectWithin(faradsToNf(4.5e-9), 4.5);
    expectWithin(faradsToPf(70e-12), 70);
    expectWithin(faradsToUf(1e-6), 1);
    expectWithin(ohmsToMohm(300e6), 300);
    expectWithin(ohmsToGohm(2e9), 2);
    expectWithin(ampsToMa(2e-3), 2);
    expectWithin(ampsToUa(100e-6), 100);
    expectWithin(joulesToMillijoules(0.35), 350);
  });

  it('refuses NaN rather than pass it on', () => {
    expect(() => voltsToKv(Number.NaN)).toThrow(HvInputError);
  });
});

describe('metresToFeetInches', () => {
  it('1.0 m is 3 ft 3 in (0.3048 m/ft exactly), not the 3 ft 6 in the NFPA table prints', () => {
    expect(metresToFeetInches(1.0)).toEqual({ feet: 3, inches: 3, text: '3 ft 3 in' });
  });

  it('3.0 m is 9 ft 10 in', () => {
    expect(metresToFeetInches(3.0).text).toBe('9 ft 10 in');
  });

  it('carries 12 rounded inches into a foot', () => {
    expect(metresToFeetInches(0.304).text).toBe('1 ft 0 in');
  });

  it('rejects negative lengths', () => {
    expect(() => metresToFeetInches(-1)).toThrow(HvInputError);
  });
});

describe('formatQuantity', () => {
  it.each([
    [4.5e-9, 'F', '4.5 nF'],
    [0.778e-9, 'F', '778 pF'],
    [30e3, 'V', '30 kV'],
    [0.45, 'J', '450 mJ'],
    [2e-3, 'A', '2 mA'],
    [300e6, 'Ω', '300 MΩ'],
    [50, 'V', '50 V'],
    [1e-6, 'F', '1 µF'],
    [999.96, 'V', '1 kV'],
    [0, 'J', '0 J'],
    [-5e3, 'V', '-5 kV'],
  ])('%s %s → %s', (value, unit, text) => {
    expect(formatQuantity({ value, unit })).toBe(text);
  });

  it('honours the requested significant digits', () => {
    expect(formatQuantity({ value: 529.83, unit: 's', significantDigits: 4 })).toBe('529.8 s');
  });
});
