// NFPA 70E shock approach boundaries for one voltage. Imperial values are the table's own printed
// text, never a conversion of the metric ones (1.0 m is printed as 3 ft 6 in).
import { approachBoundaries, NFPA70E_AC_TABLE, NFPA70E_DC_TABLE, type ApproachBoundaries, type VoltageSystem } from '@/shared/hv';
import { boundariesBodySchema } from '@/shared/schemas/calc';

import { boundarySourceWords } from '@/components/assessment/boundary-source';

import { metres } from './format';
import { readFields, runCalculation, waitingFor } from './read-inputs';
import type { CalculatorDef, CalcState, CalcView, FieldSpec, ResultLine, ResultSection } from './types';
import { VOLTAGE_UNITS } from './units';

const FIELDS: readonly FieldSpec[] = [
  {
    key: 'voltage',
    label: 'Voltage',
    noun: 'the voltage',
    units: VOLTAGE_UNITS,
    defaultUnit: 'kV',
    hint: 'DC: the peak (no-load) voltage. AC: nominal phase-to-phase rms, as the AC table uses.',
  },
];

type LengthDisplay = 'metric' | 'imperial';

function distance(b: ApproachBoundaries, cell: 'limitedMovable' | 'limitedFixed' | 'restricted', display: LengthDisplay): string {
  const printed = b[`${cell}Imperial`];
  if (display === 'imperial') return printed;
  const value = b[`${cell}M`];
  // A null distance has no metric value: the table's own words ("Avoid contact") stand for it.
  return value === null ? printed : metres(value);
}

export const boundariesCalculator: CalculatorDef = {
  name: 'boundaries',
  label: 'Boundaries',
  title: 'Approach boundaries',
  intro: 'How close people may come to an exposed live part, from the NFPA 70E shock-protection tables.',
  fields: FIELDS,
  choices: [
    {
      key: 'system',
      label: 'System',
      options: [
        { value: 'dc', label: 'DC' },
        { value: 'ac', label: 'AC' },
      ],
      defaultValue: 'dc',
    },
    {
      key: 'display',
      label: 'Show distances in',
      options: [
        { value: 'metric', label: 'Metres' },
        { value: 'imperial', label: 'Feet and inches' },
      ],
      defaultValue: 'metric',
    },
  ],
  compute(state: CalcState): CalcView {
    const errors: Record<string, string> = {};
    const system: VoltageSystem = state.choices.system === 'ac' ? 'ac' : 'dc';
    const display: LengthDisplay = state.choices.display === 'imperial' ? 'imperial' : 'metric';
    const table = system === 'dc' ? NFPA70E_DC_TABLE : NFPA70E_AC_TABLE;
    const section: ResultSection = {
      key: 'boundaries',
      title: system === 'dc' ? 'DC boundaries' : 'AC boundaries',
      waiting: null,
      lines: [],
      notices: [],
      source: null,
      facts: [],
    };

    const read = readFields(FIELDS, state, ['voltage']);
    Object.assign(errors, read.errors);
    if (Object.keys(read.errors).length > 0) return { errors, sections: [{ ...section, waiting: 'Correct the voltage to see the boundaries.' }] };
    if (read.missing.length > 0) return { errors, sections: [{ ...section, waiting: waitingFor(read.missing, 'the boundaries') }] };

    const outcome = runCalculation(boundariesBodySchema, { voltageV: read.si.voltage, system }, { voltageV: 'voltage' }, FIELDS, approachBoundaries);
    if (!outcome.ok) return { errors: { ...errors, ...outcome.errors }, sections: [{ ...section, waiting: 'Correct the voltage to see the boundaries.' }] };

    const b = outcome.value;
    const lines: ResultLine[] = [
      { key: 'limited-movable', label: 'Limited approach, exposed movable conductor', value: distance(b, 'limitedMovable', display) },
      { key: 'limited-fixed', label: 'Limited approach, exposed fixed circuit part', value: distance(b, 'limitedFixed', display) },
      { key: 'restricted', label: 'Restricted approach', value: distance(b, 'restricted', display) },
      { key: 'row', label: 'Table row', value: b.rowLabel },
    ];
    const notices = [];
    if (b.notSpecified) {
      notices.push({
        key: 'not-specified',
        level: 'info' as const,
        title: 'No boundary in the table',
        text: `The table sets no shock approach boundary in the ${b.rowLabel} row. ${table.editionNote}`,
      });
    }
    if (b.outsideToolScope) {
      notices.push({
        key: 'outside-scope',
        level: 'warning' as const,
        title: 'Beyond what this tool is meant for',
        text: 'This row exists in the table, but the voltage is above the equipment Voltcrib plans for. Have the test designed and approved by a qualified HV engineer.',
      });
    }
    if (!b.notSpecified) {
      notices.push({
        key: 'keep-out',
        level: 'caution' as const,
        title: 'Mark the boundary',
        text: `Before energising, mark the limited approach boundary (${distance(b, 'limitedFixed', display)} from fixed parts, ${distance(b, 'limitedMovable', display)} from movable conductors) with a barrier, and keep unqualified people outside it.`,
      });
    }
    return {
      errors,
      sections: [
        {
          ...section,
          lines,
          notices,
          source: boundarySourceWords(b),
          facts: display === 'imperial' ? ['Feet and inches as the table prints them (not conversions of the metric values).'] : [],
        },
      ],
    };
  },
};
