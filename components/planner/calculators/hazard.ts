// Hazardous live or not, by IEC 61010-1 6.3.1: above the DC voltage level AND either above the
// current level or above the Figure 3 capacitance level. The deciding criterion is shown with it.
import { classifyHazardousLive, HAZARDOUS_LIVE_LEVELS, type HazardCriterion } from '@/shared/hv';
import { hazardBodySchema } from '@/shared/schemas/calc';

import { MARKER_LABELS, quantity } from './format';
import { readFields, runCalculation, waitingFor } from './read-inputs';
import type { CalculatorDef, CalcState, CalcView, FieldSpec, ResultSection } from './types';
import { CAPACITANCE_UNITS, CURRENT_UNITS, VOLTAGE_UNITS } from './units';

const L = HAZARDOUS_LIVE_LEVELS;

const FIELDS: readonly FieldSpec[] = [
  {
    key: 'voltage',
    label: 'Voltage (DC peak)',
    noun: 'the voltage',
    units: VOLTAGE_UNITS,
    defaultUnit: 'kV',
    hint: 'For a supply or multiplier, its no-load maximum.',
  },
  {
    key: 'current',
    label: 'Current available',
    noun: 'the available current',
    units: CURRENT_UNITS,
    defaultUnit: 'mA',
    hint: 'What the source can drive into a person (short-circuit); 0 once switched off.',
  },
  { key: 'capacitance', label: 'Capacitance to ground', noun: 'the capacitance', units: CAPACITANCE_UNITS, defaultUnit: 'nF' },
];

const CRITERION_LABELS: Record<HazardCriterion, string> = {
  'voltage-below-limit': `At or below ${quantity(L.voltageDcV.value, 'V')} DC`,
  'current-above-limit': `Current above ${quantity(L.currentDcA.value, 'A')} DC`,
  'charge-above-45uC': `Charge above ${quantity(L.chargeLimitC.value, 'C')} (Figure 3 line A)`,
  'energy-above-350mJ': `Energy above ${quantity(L.energyLimitJ.value, 'J')} (Figure 3 line B)`,
  'capacitance-above-15kV-junction': `Capacitance above the limit held from ${quantity(L.lineSwitchV.value, 'V')}`,
  'below-current-and-capacitance-limits': 'Within the current and capacitance limits',
};

export const hazardCalculator: CalculatorDef = {
  name: 'hazard',
  label: 'Hazardous live',
  title: 'Hazardous live?',
  intro: 'Whether a DC node counts as hazardous live under IEC 61010-1 6.3.1, and which limit decides it.',
  fields: FIELDS,
  choices: [],
  compute(state: CalcState): CalcView {
    const errors: Record<string, string> = {};
    const section: ResultSection = { key: 'hazard', title: 'Classification', waiting: null, lines: [], notices: [], source: null, facts: [] };
    const read = readFields(FIELDS, state, ['voltage', 'current', 'capacitance']);
    Object.assign(errors, read.errors);
    if (Object.keys(read.errors).length > 0) return { errors, sections: [{ ...section, waiting: 'Correct the marked fields to classify the node.' }] };
    if (read.missing.length > 0) return { errors, sections: [{ ...section, waiting: waitingFor(read.missing, 'whether it is hazardous live') }] };

    const outcome = runCalculation(
      hazardBodySchema,
      { voltageV: read.si.voltage, currentA: read.si.current, capacitanceF: read.si.capacitance },
      { voltageV: 'voltage', currentA: 'current', capacitanceF: 'capacitance' },
      FIELDS,
      classifyHazardousLive,
    );
    if (!outcome.ok)
      return { errors: { ...errors, ...outcome.errors }, sections: [{ ...section, waiting: 'Correct the marked fields to classify the node.' }] };

    const c = outcome.value;
    const aboveVoltageLevel = read.si.voltage! > L.voltageDcV.value;
    return {
      errors,
      sections: [
        {
          ...section,
          lines: [
            { key: 'hazardous', label: 'Result', value: c.hazardous ? 'Hazardous live' : 'Not hazardous live' },
            { key: 'criterion', label: 'Deciding criterion', value: CRITERION_LABELS[c.criterion] },
            { key: 'charge', label: 'Stored charge', value: quantity(c.chargeC, 'C'), formula: 'Q = CV' },
            { key: 'energy', label: 'Stored energy', value: quantity(c.energyJ, 'J'), formula: 'E = ½CV²' },
            {
              key: 'max-capacitance',
              label: 'Largest capacitance not hazardous here',
              value:
                c.maxNonHazardousCapacitanceF === null
                  ? `No limit at or below ${quantity(L.voltageDcV.value, 'V')}`
                  : quantity(c.maxNonHazardousCapacitanceF, 'F'),
              formula: `${quantity(L.chargeLimitC.value, 'C')}/V up to ${quantity(L.lineSwitchV.value, 'V')}; 2·${quantity(L.energyLimitJ.value, 'J')}/V² above`,
            },
          ],
          notices: [
            {
              key: 'classification',
              // Not hazardous live by the standard still means a shock or a startle above the
              // voltage level, so that case stays a caution rather than a safe condition.
              level: c.hazardous ? 'danger' : aboveVoltageLevel ? 'caution' : 'safe',
              title: c.hazardous ? 'Hazardous live' : 'Not hazardous live',
              text: c.explanation,
            },
          ],
          source: c.source,
          facts: [`Deciding value: ${MARKER_LABELS[c.marker]}.`],
        },
      ],
    };
  },
};
