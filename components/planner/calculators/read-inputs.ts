// From what was typed to a checked SI body: parse the text, convert with the chosen unit, validate
// with the shared zod schema the API uses, then run the shared function. Any refusal becomes a
// message under the field that caused it, so the screen never shows NaN or a silent zero.
import type { z } from 'zod';

import { HvInputError } from '@/shared/hv';

import type { CalcState, FieldSpec } from './types';
import { findUnit } from './units';

type Parsed = { kind: 'empty' } | { kind: 'invalid' } | { kind: 'number'; value: number };

// Digits with one decimal point or comma (lab notebooks use both), optional exponent ("4.7e-9").
const NUMBER_PATTERN = /^[+-]?(\d+([.,]\d*)?|[.,]\d+)(e[+-]?\d+)?$/i;

export function parseDecimal(text: string): Parsed {
  const trimmed = text.trim().replace(/\s+/g, '');
  if (trimmed === '') return { kind: 'empty' };
  if (!NUMBER_PATTERN.test(trimmed)) return { kind: 'invalid' };
  const value = Number(trimmed.replace(',', '.'));
  return Number.isFinite(value) ? { kind: 'number', value } : { kind: 'invalid' };
}

export interface ReadResult {
  /** SI values by field key, for the fields that hold a number. */
  si: Record<string, number>;
  errors: Record<string, string>;
  /** Required fields left empty, in the order asked. */
  missing: FieldSpec[];
}

/** Reads `keys` (required) and `optionalKeys` from the state, converting each to SI. */
export function readFields(specs: readonly FieldSpec[], state: CalcState, keys: readonly string[], optionalKeys: readonly string[] = []): ReadResult {
  const result: ReadResult = { si: {}, errors: {}, missing: [] };
  for (const key of [...keys, ...optionalKeys]) {
    const spec = specs.find((s) => s.key === key);
    if (!spec) continue;
    const input = state.fields[key] ?? { text: spec.defaultText ?? '', unit: spec.defaultUnit };
    const parsed = parseDecimal(input.text);
    if (parsed.kind === 'empty') {
      if (keys.includes(key)) result.missing.push(spec);
    } else if (parsed.kind === 'invalid') {
      result.errors[key] = 'Enter a number, e.g. 4.7';
    } else {
      result.si[key] = findUnit(spec.units, input.unit).toSi(parsed.value);
    }
  }
  return result;
}

/** "Enter the capacitance and the voltage to see the stored energy." */
export function waitingFor(missing: readonly FieldSpec[], what: string): string {
  const nouns = missing.map((spec) => spec.noun);
  const list = nouns.length <= 1 ? (nouns[0] ?? '') : `${nouns.slice(0, -1).join(', ')} and ${nouns[nouns.length - 1]}`;
  return `Enter ${list} to see ${what}.`;
}

/** Maps the shared schema's SI field names back to the form's field keys. */
export type FieldMap = Record<string, string>;

export type RunOutcome<T> = { ok: true; value: T } | { ok: false; errors: Record<string, string> };

/**
 * Validates `body` with the shared schema, then runs the shared function on the parsed body. Both
 * kinds of refusal are returned per form field; an error on a field outside `fields` is reported
 * against the first field so it is never lost.
 */
export function runCalculation<S extends z.ZodType, T>(
  schema: S,
  body: Record<string, unknown>,
  fields: FieldMap,
  specs: readonly FieldSpec[],
  calculate: (input: z.output<S>) => T,
): RunOutcome<T> {
  const fallbackKey = Object.values(fields)[0] ?? '';
  const parsed = schema.safeParse(body);
  if (!parsed.success) {
    const errors: Record<string, string> = {};
    for (const issue of parsed.error.issues) {
      const siField = String(issue.path[0] ?? '');
      const key = fields[siField] ?? fallbackKey;
      errors[key] ??= describeIssue(
        issue,
        specs.find((s) => s.key === key),
      );
    }
    return { ok: false, errors };
  }
  try {
    return { ok: true, value: calculate(parsed.data) };
  } catch (error) {
    if (!(error instanceof HvInputError)) throw error;
    const key = fields[error.field] ?? fallbackKey;
    const spec = specs.find((s) => s.key === key);
    return { ok: false, errors: { [key]: describeHvError(error, spec) } };
  }
}

interface IssueLike {
  code: string;
  message: string;
  minimum?: unknown;
  maximum?: unknown;
  inclusive?: boolean;
  expected?: unknown;
}

/** zod's default wording speaks in SI and types; say it in the field's own terms instead. */
export function describeIssue(issue: IssueLike, spec: FieldSpec | undefined): string {
  if (issue.code === 'too_small' && typeof issue.minimum === 'number') {
    if (issue.minimum === 0) return issue.inclusive ? 'Must be 0 or more' : 'Must be more than 0';
    return `Must be ${issue.inclusive ? 'at least' : 'more than'} ${inFieldUnit(issue.minimum, spec)}`;
  }
  if (issue.code === 'too_big' && typeof issue.maximum === 'number') {
    return `Must be ${issue.inclusive ? 'at most' : 'less than'} ${inFieldUnit(issue.maximum, spec)}`;
  }
  if (issue.code === 'invalid_type' && issue.expected === 'int') return 'Enter a whole number';
  // Custom refinements in shared/schemas already speak plainly.
  return issue.message;
}

/** An SI limit in the unit the field shows, e.g. −273 for °C or 50 for stages. */
function inFieldUnit(siValue: number, spec: FieldSpec | undefined): string {
  if (!spec) return String(siValue);
  const unit = findUnit(spec.units, spec.defaultUnit);
  const shown = Number((siValue / unit.toSi(1)).toPrecision(6));
  return unit.symbol ? `${shown} ${unit.symbol}` : String(shown);
}

/** "voltageV is above the highest row …" → "Voltage is above the highest row …". */
export function describeHvError(error: HvInputError, spec: FieldSpec | undefined): string {
  if (spec && error.message.startsWith(error.field)) return `${spec.label}${error.message.slice(error.field.length)}`;
  return error.message;
}
