// Cockcroft–Walton (half-wave cascade) output under load, in Kuffel's convention, with the energy
// the stack holds: the output alone is not the whole story once the output is grounded.
import { classifyHazardousLive, multiplierOutput } from '@/shared/hv';
import { multiplierBodySchema } from '@/shared/schemas/calc';

import { quantity } from './format';
import { readFields, runCalculation, waitingFor } from './read-inputs';
import type { CalculatorDef, CalcState, CalcView, FieldSpec, Notice, ResultSection } from './types';
import { CAPACITANCE_UNITS, CURRENT_UNITS, FREQUENCY_UNITS, unitless, VOLTAGE_UNITS } from './units';

const FIELDS: readonly FieldSpec[] = [
  {
    key: 'stages',
    label: 'Stages (n)',
    noun: 'the number of stages',
    units: unitless(''),
    defaultUnit: 'one',
    hint: 'Each stage: two capacitors and two diodes.',
  },
  {
    key: 'peakInput',
    label: 'Peak input voltage',
    noun: 'the peak input voltage',
    units: VOLTAGE_UNITS,
    defaultUnit: 'kV',
    hint: 'Peak, not rms, of the transformer or driver.',
  },
  { key: 'frequency', label: 'Drive frequency', noun: 'the drive frequency', units: FREQUENCY_UNITS, defaultUnit: 'kHz' },
  {
    key: 'stageCapacitance',
    label: 'Stage capacitance',
    noun: 'the stage capacitance',
    units: CAPACITANCE_UNITS,
    defaultUnit: 'nF',
    hint: 'Each stage capacitor, all assumed equal.',
  },
  { key: 'load', label: 'Load current', noun: 'the load current', units: CURRENT_UNITS, defaultUnit: 'mA', hint: '0 for no load.' },
];

const MAP = { stages: 'stages', peakInputV: 'peakInput', frequencyHz: 'frequency', stageCapacitanceF: 'stageCapacitance', loadCurrentA: 'load' };

export const multiplierCalculator: CalculatorDef = {
  name: 'multiplier',
  label: 'Multiplier',
  title: 'Multiplier output',
  intro: 'No-load and loaded output of a Cockcroft–Walton cascade, its ripple, and the energy the stack stores.',
  fields: FIELDS,
  choices: [],
  compute(state: CalcState): CalcView {
    const errors: Record<string, string> = {};
    const section: ResultSection = { key: 'multiplier', title: 'Output', waiting: null, lines: [], notices: [], source: null, facts: [] };
    const read = readFields(FIELDS, state, ['stages', 'peakInput', 'frequency', 'stageCapacitance', 'load']);
    Object.assign(errors, read.errors);
    if (Object.keys(read.errors).length > 0) return { errors, sections: [{ ...section, waiting: 'Correct the marked fields to see the output.' }] };
    if (read.missing.length > 0) return { errors, sections: [{ ...section, waiting: waitingFor(read.missing, 'the output') }] };

    const body = {
      stages: read.si.stages,
      peakInputV: read.si.peakInput,
      frequencyHz: read.si.frequency,
      stageCapacitanceF: read.si.stageCapacitance,
      loadCurrentA: read.si.load,
    };
    const outcome = runCalculation(multiplierBodySchema, body, MAP, FIELDS, (input) => {
      const output = multiplierOutput(input);
      // After switch-off the source drives nothing: the output node is judged on its charge alone.
      const afterSwitchOff = classifyHazardousLive({ voltageV: output.noLoadV, currentA: 0, capacitanceF: output.outputCapacitanceF });
      return { output, afterSwitchOff };
    });
    if (!outcome.ok) return { errors: { ...errors, ...outcome.errors }, sections: [{ ...section, waiting: 'Correct the marked fields to see the output.' }] };

    const { output: o, afterSwitchOff } = outcome.value;
    const notices: Notice[] = [];
    if (o.overloaded) {
      notices.push({
        key: 'overloaded',
        level: 'warning',
        title: 'Overloaded',
        text: 'The drop reaches the no-load voltage: the cascade cannot deliver this current, and the formulas no longer describe it. Use fewer stages, larger capacitors, a higher frequency or less load.',
      });
    }
    notices.push({
      key: 'peak',
      level: 'info',
      title: `Plan with ${quantity(o.noLoadV, 'V')}`,
      text: `Ratings, boundaries and the hazard class follow the no-load peak ${quantity(o.noLoadV, 'V')}, not the loaded output.`,
    });
    notices.push({
      key: 'stack',
      level: afterSwitchOff.hazardous ? 'danger' : 'caution',
      title: afterSwitchOff.hazardous ? 'Output stays hazardous after switch-off' : 'Ground every stage',
      text: `${afterSwitchOff.explanation} The stack holds ${quantity(o.stackEnergyJ, 'J')} in all: ground every stage node, not only the output, because the oscillating column keeps its charge when the output is grounded.`,
    });

    return {
      errors,
      sections: [
        {
          ...section,
          lines: [
            { key: 'no-load', label: 'No-load output (peak)', value: quantity(o.noLoadV, 'V'), formula: 'V₀ = 2nV_max' },
            { key: 'drop', label: 'Drop under load', value: quantity(o.dropV, 'V'), formula: 'ΔV = (I/fC)(2n³/3 + n²/2 − n/6)' },
            { key: 'ripple', label: 'Ripple (peak-to-peak)', value: quantity(o.rippleV, 'V'), formula: 'δV = (I/fC)·n(n+1)/2' },
            { key: 'loaded', label: 'Loaded output (mean)', value: quantity(o.loadedV, 'V'), formula: 'V = V₀ − ΔV' },
            {
              key: 'optimum-stages',
              label: 'Optimum number of stages',
              value: o.optimumStages === null ? 'None at no load' : o.optimumStages.toFixed(1),
              formula: 'n_opt = √(V_max·f·C / I)',
            },
            { key: 'output-capacitance', label: 'Output capacitance', value: quantity(o.outputCapacitanceF, 'F'), formula: 'C_eq = C/n' },
            { key: 'output-energy', label: 'Energy at the output', value: quantity(o.outputEnergyJ, 'J'), formula: 'E_out = 2nCV_max²' },
            { key: 'stack-energy', label: 'Energy in the whole stack', value: quantity(o.stackEnergyJ, 'J'), formula: 'E_stack = (4n − 1.5)CV_max²' },
          ],
          notices,
          source: o.source,
          facts: [`Hazard after switch-off: ${afterSwitchOff.source}.`],
        },
      ],
    };
  },
};
