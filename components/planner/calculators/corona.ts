// Corona onset on a smooth or rough wire (Peek), optionally inside a coaxial collector: the
// voltage at which an emitter starts to glow and drive ionic wind.
import { AIR, coronaOnset } from '@/shared/hv';
import { coronaBodySchema } from '@/shared/schemas/calc';

import { quantity } from './format';
import { readFields, runCalculation, waitingFor } from './read-inputs';
import type { CalculatorDef, CalcState, CalcView, FieldSpec, ResultLine, ResultSection } from './types';
import { LENGTH_UNITS, SMALL_LENGTH_UNITS, unitless } from './units';

const FIELDS: readonly FieldSpec[] = [
  { key: 'wireRadius', label: 'Wire radius', noun: 'the wire radius', units: SMALL_LENGTH_UNITS, defaultUnit: 'mm', hint: 'Half the diameter.' },
  {
    key: 'pressure',
    label: 'Air pressure',
    noun: 'the air pressure',
    units: unitless('cmHg'),
    defaultUnit: 'one',
    defaultText: '76',
    hint: '76 cmHg is one standard atmosphere (101.3 kPa).',
  },
  { key: 'temperature', label: 'Air temperature', noun: 'the air temperature', units: unitless('°C'), defaultUnit: 'one', defaultText: '25', signed: true },
  {
    key: 'surface',
    label: 'Surface factor (m_v)',
    noun: 'the surface factor',
    units: unitless(''),
    defaultUnit: 'one',
    defaultText: '1',
    hint: '1 smooth polished wire; 0.98–0.93 rough or weathered; 0.87–0.83 stranded.',
  },
  {
    key: 'outerRadius',
    label: 'Collector tube radius (optional)',
    noun: 'the collector radius',
    units: LENGTH_UNITS,
    defaultUnit: 'mm',
    hint: 'For a wire inside a coaxial tube; leave empty for the gradient alone.',
  },
];

const MAP = { wireRadiusM: 'wireRadius', pressureCmHg: 'pressure', temperatureC: 'temperature', surfaceFactor: 'surface', outerRadiusM: 'outerRadius' };

export const coronaCalculator: CalculatorDef = {
  name: 'corona',
  label: 'Corona',
  title: 'Corona onset',
  intro: "Peek's onset gradient on a wire, and the onset voltage inside a coaxial collector.",
  fields: FIELDS,
  choices: [],
  compute(state: CalcState): CalcView {
    const errors: Record<string, string> = {};
    const section: ResultSection = { key: 'corona', title: 'Onset', waiting: null, lines: [], notices: [], source: null, facts: [] };
    const read = readFields(FIELDS, state, ['wireRadius', 'pressure', 'temperature', 'surface'], ['outerRadius']);
    Object.assign(errors, read.errors);
    if (Object.keys(read.errors).length > 0) return { errors, sections: [{ ...section, waiting: 'Correct the marked fields to see the onset.' }] };
    if (read.missing.length > 0) return { errors, sections: [{ ...section, waiting: waitingFor(read.missing, 'the onset') }] };

    const body = {
      wireRadiusM: read.si.wireRadius,
      pressureCmHg: read.si.pressure,
      temperatureC: read.si.temperature,
      surfaceFactor: read.si.surface,
      outerRadiusM: read.si.outerRadius,
    };
    const outcome = runCalculation(coronaBodySchema, body, MAP, FIELDS, coronaOnset);
    if (!outcome.ok) return { errors: { ...errors, ...outcome.errors }, sections: [{ ...section, waiting: 'Correct the marked fields to see the onset.' }] };

    const c = outcome.value;
    const lines: ResultLine[] = [
      { key: 'density-factor', label: 'Air density factor δ', value: c.airDensityFactor.toFixed(3), formula: 'δ = 3.92b / (273 + t)' },
      {
        key: 'onset-gradient',
        label: 'Onset surface gradient (peak)',
        value: `${c.onsetGradientKvPerCm.toFixed(1)} kV/cm`,
        formula: `g_v = g₀δ(1 + c/√(δr)), g₀ = ${AIR.peekG0KvPerCm.value} kV/cm`,
      },
      {
        key: 'onset-voltage',
        label: 'Onset voltage in the tube (peak)',
        value: c.onsetV === undefined ? 'Enter the collector radius' : quantity(c.onsetV, 'V'),
        formula: 'V = m_v·g_v·r·ln(R/r)',
      },
    ];
    return {
      errors,
      sections: [
        {
          ...section,
          lines,
          notices: [
            {
              key: 'onset-not-limit',
              level: 'info',
              title: 'Onset, not a safe limit',
              text: 'Onset is where visible corona starts on a clean wire. Sparkover across the gap comes later but can come suddenly with points, dust or humidity; keep the approach boundaries for the full voltage.',
            },
          ],
          source: c.source,
          facts: [],
        },
      ],
    };
  },
};
