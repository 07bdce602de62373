// Each kind's ratings as people read them: label, unit, and how an empty value reads. The item
// page and the item form both draw from this one table, so a unit can never differ between them.
// Field names match shared/schemas/items.ts, where every name carries its unit.
import type { ItemKind, Polarity } from '@/shared/schemas/items';

export type RatingInput = 'decimal' | 'integer' | 'optional-decimal' | 'polarity' | 'boolean';

export interface RatingField {
  name: string;
  label: string;
  /** Shown in the field's label; never left out for a number. */
  unit: string;
  input: RatingInput;
  /** How the value reads on the item page when it differs from "<n> <unit>" (a ratio, a count). */
  format?: (value: number) => string;
  /** What an empty optional value means, e.g. a solid grounding stick has no hook resistance. */
  emptyText?: string;
  hint?: string;
}

const kvField = (name: string, label: string, hint?: string): RatingField => ({ name, label, unit: 'kV', input: 'decimal', hint });

export const RATING_FIELDS: Record<ItemKind, readonly RatingField[]> = {
  multiplier: [
    kvField('maxOutputKv', 'Max output voltage', 'The no-load peak at the top of the stack'),
    kvField('maxInputKvPeak', 'Max input voltage (peak)'),
    { name: 'stages', label: 'Stages', unit: 'count', input: 'integer', format: (n) => `${n} ${n === 1 ? 'stage' : 'stages'}` },
    { name: 'stageCapacitanceNf', label: 'Stage capacitance', unit: 'nF', input: 'decimal' },
    { name: 'driveFrequencyHz', label: 'Drive frequency', unit: 'Hz', input: 'decimal' },
    { name: 'maxMa', label: 'Max output current', unit: 'mA', input: 'decimal' },
    { name: 'polarity', label: 'Polarity', unit: '', input: 'polarity' },
  ],
  'hv-supply': [
    kvField('maxKv', 'Max output voltage'),
    { name: 'maxMa', label: 'Max output current', unit: 'mA', input: 'decimal' },
    { name: 'polarity', label: 'Polarity', unit: '', input: 'polarity' },
    { name: 'outputCapacitanceNf', label: 'Output capacitance', unit: 'nF', input: 'decimal', hint: '0 if none is stated' },
    {
      name: 'bleederMohm',
      label: 'Bleeder resistance',
      unit: 'MΩ',
      input: 'optional-decimal',
      emptyText: 'No bleeder',
      hint: 'Leave empty if the supply has no bleeder',
    },
    { name: 'hasInterlockInput', label: 'Interlock input', unit: '', input: 'boolean' },
  ],
  probe: [
    kvField('maxKv', 'Max voltage'),
    { name: 'ratio', label: 'Division ratio', unit: 'n : 1', input: 'decimal', format: (n) => `${formatNumber(n)} : 1` },
    { name: 'inputResistanceMohm', label: 'Input resistance', unit: 'MΩ', input: 'decimal' },
  ],
  'isolation-stand': [kvField('withstandKv', 'Withstand voltage')],
  'grounding-stick': [
    kvField('ratedKv', 'Rated voltage'),
    {
      name: 'hookResistanceMohm',
      label: 'Hook resistance',
      unit: 'MΩ',
      input: 'optional-decimal',
      emptyText: 'Solid (no resistor)',
      hint: 'Leave empty for a solid grounding stick',
    },
    { name: 'cableLengthM', label: 'Cable length', unit: 'm', input: 'decimal' },
  ],
  interlock: [kvField('ratedKv', 'Rated voltage')],
  meter: [{ ...kvField('maxKv', 'Max voltage', 'Leave empty if it has no HV rating'), input: 'optional-decimal', emptyText: 'No HV rating' }],
  other: [{ ...kvField('maxKv', 'Max voltage', 'Leave empty if it has no HV rating'), input: 'optional-decimal', emptyText: 'No HV rating' }],
};

export const POLARITY_LABELS: Record<Polarity, string> = {
  positive: 'Positive',
  negative: 'Negative',
  reversible: 'Reversible',
};

const numberFormat = new Intl.NumberFormat(undefined, { maximumFractionDigits: 3 });

export function formatNumber(value: number): string {
  return numberFormat.format(value);
}

/** A rated voltage with its unit, or what its absence means. */
export function formatKv(value: number | null): string {
  return value === null ? 'No kV rating' : `${formatNumber(value)} kV`;
}

/** One rating as the item page shows it, unit always included. */
export function formatRating(field: RatingField, value: unknown): string {
  if (value === null || value === undefined) return field.emptyText ?? 'Not given';
  switch (field.input) {
    case 'polarity':
      return POLARITY_LABELS[value as Polarity] ?? String(value);
    case 'boolean':
      return value ? 'Yes' : 'No';
    default: {
      const n = Number(value);
      return field.format ? field.format(n) : `${formatNumber(n)} ${field.unit}`;
    }
  }
}
