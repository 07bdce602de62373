import type { SourcedValue } from './types';

/**
 * IEC 61010-1 clause 6.3.1, normal condition. A part above the voltage level is hazardous live
 * only if the current level or the capacitance level is also exceeded. The classifier works on
 * DC (peak) values because lab HV supplies are DC and the brief asks for the peak, not the mean.
 */
export const HAZARDOUS_LIVE_LEVELS = {
  voltageDcV: {
    value: 70,
    unit: 'V',
    source: 'IEC 61010-1 6.3.1 a) (33 V rms / 46.7 V peak / 70 V DC triple as quoted in the UL 61010-031 scope)',
    edition: '2nd edition onward; the 1993 1st edition used 60 V DC',
    marker: 'partly-confirmed',
  },
  voltageRmsV: {
    value: 33,
    unit: 'V',
    source: 'IEC 61010-1 6.3.1 a)',
    edition: '2nd edition onward',
    marker: 'partly-confirmed',
  },
  voltagePeakV: {
    value: 46.7,
    unit: 'V',
    source: 'IEC 61010-1 6.3.1 a)',
    edition: '2nd edition onward',
    marker: 'partly-confirmed',
  },
  currentDcA: {
    value: 2e-3,
    unit: 'A',
    source: 'IEC 61010-1 6.3.1 b), measured with the Annex A body network (also quoted from IEC 60335-1)',
    edition: 'edition not recorded',
    marker: 'partly-confirmed',
  },
  currentPeakA: {
    value: 0.7e-3,
    unit: 'A',
    source: 'IEC 61010-1 6.3.1 b)',
    edition: 'edition not recorded',
    marker: 'partly-confirmed',
  },
  currentRmsA: {
    value: 0.5e-3,
    unit: 'A',
    source: 'IEC 61010-1 6.3.1 b)',
    edition: 'edition not recorded',
    marker: 'from-memory',
  },
  chargeLimitC: {
    value: 45e-6,
    unit: 'C',
    source: 'IEC 61010-1 6.3.1 c), Figure 3 line A (voltages up to 15 kV)',
    edition: 'edition current in 2013',
    marker: 'confirmed',
  },
  energyLimitJ: {
    value: 0.35,
    unit: 'J',
    source:
      'IEC 61010-1 6.3.1 c), Figure 3 line B (above 15 kV); the same 45 µC / 350 mJ / 15 kV scheme is confirmed in IEC 60335-1 8.1.4 and the 350 mJ line in the EN 50191 scope',
    edition: 'edition not recorded',
    marker: 'from-memory',
  },
  lineSwitchV: {
    value: 15e3,
    unit: 'V',
    source: 'IEC 61010-1 Figure 3: line A (charge) applies up to 15 kV, line B (energy) above; the same 15 kV switch is confirmed in IEC 60335-1 8.1.4',
    edition: 'edition not recorded',
    marker: 'partly-confirmed',
  },
} as const satisfies Record<string, SourcedValue>;
