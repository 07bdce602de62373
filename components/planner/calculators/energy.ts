// Stored energy and bleed-down: E = ½CV², Q = CV, and the real wait t = RC·ln(V₀/V_safe), which
// the "wait five time constants" habit underestimates above about 7.4 kV for a 50 V target.
import { bleederPowerW, capacitorEnergy, dischargePlan, FIVE_TIME_CONSTANTS, SAFE_RESIDUAL_VOLTAGE } from '@/shared/hv';
import { dischargeBodySchema, energyBodySchema } from '@/shared/schemas/calc';

import { duration, MARKER_LABELS, quantity } from './format';
import { readFields, runCalculation, waitingFor } from './read-inputs';
import type { CalculatorDef, CalcState, CalcView, FieldSpec, ResultSection } from './types';
import { CAPACITANCE_UNITS, RESISTANCE_UNITS, unitless, VOLTAGE_UNITS } from './units';

const SAFE = SAFE_RESIDUAL_VOLTAGE.default;
const ALT = SAFE_RESIDUAL_VOLTAGE.alternative;

const FIELDS: readonly FieldSpec[] = [
  { key: 'capacitance', label: 'Capacitance', noun: 'the capacitance', units: CAPACITANCE_UNITS, defaultUnit: 'nF' },
  {
    key: 'voltage',
    label: 'Charged to',
    noun: 'the voltage',
    units: VOLTAGE_UNITS,
    defaultUnit: 'kV',
    hint: 'The peak (no-load) voltage, whatever the polarity.',
  },
  { key: 'bleeder', label: 'Bleeder resistance', noun: 'the bleeder resistance', units: RESISTANCE_UNITS, defaultUnit: 'Mohm' },
  {
    key: 'safe',
    label: 'Safe to touch at',
    noun: 'the safe voltage',
    units: unitless('V'),
    defaultUnit: 'one',
    defaultText: String(SAFE.value),
    hint: `${SAFE.value} V by default, the more protective published figure; some labs use ${ALT.value} V.`,
  },
];

function storedEnergySection(state: CalcState, errors: Record<string, string>): ResultSection {
  const section: ResultSection = { key: 'stored', title: 'Stored energy', waiting: null, lines: [], notices: [], source: null, facts: [] };
  const read = readFields(FIELDS, state, ['capacitance', 'voltage']);
  Object.assign(errors, read.errors);
  if (Object.keys(read.errors).length > 0) return { ...section, waiting: 'Correct the marked fields to see the stored energy.' };
  if (read.missing.length > 0) return { ...section, waiting: waitingFor(read.missing, 'the stored energy') };

  const outcome = runCalculation(
    energyBodySchema,
    { capacitanceF: read.si.capacitance, voltageV: read.si.voltage },
    { capacitanceF: 'capacitance', voltageV: 'voltage' },
    FIELDS,
    capacitorEnergy,
  );
  if (!outcome.ok) {
    Object.assign(errors, outcome.errors);
    return { ...section, waiting: 'Correct the marked fields to see the stored energy.' };
  }
  return {
    ...section,
    lines: [
      { key: 'energy', label: 'Stored energy', value: quantity(outcome.value.energyJ, 'J'), formula: 'E = ½CV²' },
      { key: 'charge', label: 'Stored charge', value: quantity(outcome.value.chargeC, 'C'), formula: 'Q = CV' },
    ],
    source: outcome.value.source,
  };
}

function dischargeSection(state: CalcState, errors: Record<string, string>): ResultSection {
  const section: ResultSection = { key: 'discharge', title: 'Bleed-down to a safe voltage', waiting: null, lines: [], notices: [], source: null, facts: [] };
  const read = readFields(FIELDS, state, ['capacitance', 'voltage', 'bleeder', 'safe']);
  // The energy section already reports the capacitance and voltage fields.
  for (const key of ['bleeder', 'safe']) if (read.errors[key]) errors[key] = read.errors[key];
  if (Object.keys(read.errors).length > 0) return { ...section, waiting: 'Correct the marked fields to plan the bleed-down.' };
  if (read.missing.length > 0) return { ...section, waiting: waitingFor(read.missing, 'how long the bleeder takes') };

  const body = { resistanceOhm: read.si.bleeder, capacitanceF: read.si.capacitance, initialV: read.si.voltage, safeV: read.si.safe };
  const map = { resistanceOhm: 'bleeder', capacitanceF: 'capacitance', initialV: 'voltage', safeV: 'safe' };
  const outcome = runCalculation(dischargeBodySchema, body, map, FIELDS, (input) => ({
    plan: dischargePlan(input),
    bleederW: bleederPowerW({ voltageV: input.initialV, resistanceOhm: input.resistanceOhm }),
  }));
  if (!outcome.ok) {
    for (const [key, message] of Object.entries(outcome.errors)) errors[key] ??= message;
    return { ...section, waiting: 'Correct the marked fields to plan the bleed-down.' };
  }
  const { plan, bleederW } = outcome.value;
  const safeText = quantity(body.safeV!, 'V');
  const fiveTau = FIVE_TIME_CONSTANTS.value;
  return {
    ...section,
    lines: [
      { key: 'time-to-safe', label: `Bleed-down time to ${safeText}`, value: duration(plan.timeS), formula: 't = RC·ln(V₀/V_safe)' },
      { key: 'time-constants', label: 'Time constants needed', value: `${plan.timeConstants.toFixed(2)} τ`, formula: 'N = ln(V₀/V_safe)' },
      { key: 'tau', label: 'Time constant', value: duration(plan.tauS), formula: 'τ = RC' },
      { key: 'residual-5tau', label: `Left after ${fiveTau}τ`, value: quantity(plan.residualAfter5TauV, 'V'), formula: `V₀·e^−${fiveTau}` },
      {
        key: 'five-tau-limit',
        label: `${fiveTau}τ reaches ${safeText} only from up to`,
        value: quantity(plan.fiveTauLimitV, 'V'),
        formula: `V_safe·e^${fiveTau}`,
      },
      { key: 'bleeder-power', label: 'Bleeder dissipation while charged', value: quantity(bleederW, 'W'), formula: 'P = V²/R' },
    ],
    notices: [
      plan.fiveTauIsEnough
        ? {
            key: 'five-tau',
            level: 'info',
            title: `${fiveTau}τ would also do here`,
            text: `${quantity(body.initialV!, 'V')} is below ${quantity(plan.fiveTauLimitV, 'V')}, so ${fiveTau} time constants, ${duration(fiveTau * plan.tauS)}, leave ${quantity(plan.residualAfter5TauV, 'V')}.`,
          }
        : {
            key: 'five-tau',
            level: 'warning',
            title: `${fiveTau}τ is not enough`,
            text: `After ${fiveTau} time constants, ${duration(fiveTau * plan.tauS)}, the node still holds ${quantity(plan.residualAfter5TauV, 'V')}, above ${safeText}: "wait ${fiveTau}τ" only works from up to ${quantity(plan.fiveTauLimitV, 'V')}. Wait the full ${duration(plan.timeS)}.`,
          },
      {
        key: 'then-ground',
        level: 'caution',
        title: 'Then ground it',
        text: `After the wait: discharge stick on (ground clamp first), then the solid ground hook, left on while anyone works. Check with a meter rated for ${quantity(body.initialV!, 'V')} that the node is at or below ${safeText}.`,
      },
    ],
    source: plan.source,
    facts: [`Safe level ${SAFE.value} V: ${SAFE.source} (${MARKER_LABELS[SAFE.marker]}). "${fiveTau}τ": ${FIVE_TIME_CONSTANTS.source}.`],
  };
}

export const energyCalculator: CalculatorDef = {
  name: 'energy',
  label: 'Energy',
  title: 'Stored energy and discharge',
  intro: 'What a charged capacitance holds, and how long its bleeder takes to bring it down to a safe voltage.',
  fields: FIELDS,
  choices: [],
  compute(state: CalcState): CalcView {
    const errors: Record<string, string> = {};
    const sections = [storedEnergySection(state, errors), dischargeSection(state, errors)];
    return { errors, sections };
  },
};
