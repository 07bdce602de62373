// One error map for every zod schema, in the app's forms and on the server: plain words, and the
// unit wherever the field has one. Field names carry their unit (shared/ convention: plannedKv,
// bleederMohm, overdueGraceMin), so the unit is read from the last part of the issue's path.
// A schema's own message ("Say what the test is for") still wins: this map only fills in for
// zod's stock wording ("Too small: expected string to have >=3 characters").
import { z } from 'zod';

/** Name endings and the unit they mean, longest first so "Mohm" is not read as "M". */
const UNIT_SUFFIXES: readonly (readonly [suffix: string, unit: string])[] = [
  ['Mohm', 'MΩ'],
  ['Days', 'days'],
  ['Pct', '%'],
  ['Min', 'minutes'],
  ['Kv', 'kV'],
  ['Ma', 'mA'],
  ['Nf', 'nF'],
  ['Pf', 'pF'],
  ['Hz', 'Hz'],
  ['Mm', 'mm'],
  ['J', 'J'],
  ['V', 'V'],
  ['C', '°C'],
  ['M', 'm'],
];

/** The unit a field's name ends in ("plannedKv" → "kV"), or '' when it has none. */
export function unitOfField(name: string | number | symbol | undefined): string {
  if (typeof name !== 'string') return '';
  for (const [suffix, unit] of UNIT_SUFFIXES) {
    // A suffix counts only after a lower-case letter or digit: "approvalKv", not "Kv" alone.
    if (name.length > suffix.length && name.endsWith(suffix) && /[a-z0-9]/.test(name[name.length - suffix.length - 1]!)) return unit;
  }
  return '';
}

function formatLimit(value: number | bigint): string {
  return typeof value === 'bigint' ? value.toString() : String(Number(value.toPrecision(12)));
}

function withUnit(value: number | bigint, unit: string): string {
  if (!unit) return formatLimit(value);
  return unit === '%' || unit === '°C' ? `${formatLimit(value)}${unit === '%' ? ' %' : ' °C'}` : `${formatLimit(value)} ${unit}`;
}

const FORMAT_WORDS: Record<string, string> = {
  date: 'Enter a date as YYYY-MM-DD, e.g. 2026-12-03',
  datetime: 'Enter a date and time',
  email: 'Enter an e-mail address, e.g. name@lab.example',
  url: 'Enter a web address starting with http:// or https://',
  regex: 'Use only the characters this field allows',
};

type Issue = z.core.$ZodRawIssue;

function sizeWords(
  issue: Issue & { minimum?: number | bigint; maximum?: number | bigint; inclusive?: boolean; origin?: string },
  unit: string,
): string | undefined {
  const small = issue.code === 'too_small';
  const limit = small ? issue.minimum : issue.maximum;
  if (limit === undefined) return undefined;
  const inclusive = issue.inclusive !== false;
  switch (issue.origin) {
    case 'string': {
      const n = Number(limit);
      if (small && n === 1) return 'Fill this in';
      return `${small ? 'Use at least' : 'Use at most'} ${n} character${n === 1 ? '' : 's'}`;
    }
    case 'array':
    case 'set': {
      const n = Number(limit);
      if (small && n === 1) return 'Choose at least one';
      return `${small ? 'Choose at least' : 'Choose at most'} ${n}`;
    }
    case 'number':
    case 'int':
    case 'bigint': {
      if (small) return inclusive ? `At least ${withUnit(limit, unit)}` : `More than ${withUnit(limit, unit)}`;
      return inclusive ? `At most ${withUnit(limit, unit)}` : `Less than ${withUnit(limit, unit)}`;
    }
    case 'date':
      return small ? 'Too early' : 'Too late';
    default:
      return undefined;
  }
}

/** zod 4's `customError`: a message for zod's stock issues, undefined to keep a schema's own. */
export function voltcribErrorMap(issue: Issue): string | undefined {
  const unit = unitOfField(issue.path?.[issue.path.length - 1]);
  switch (issue.code) {
    case 'invalid_type': {
      if (issue.input === undefined || issue.input === null) return 'Fill this in';
      const expected = (issue as { expected?: string }).expected;
      if (expected === 'number' || expected === 'int') return expected === 'int' ? 'Enter a whole number' : `Enter a number${unit ? ` in ${unit}` : ''}`;
      if (expected === 'boolean') return 'Choose yes or no';
      if (expected === 'string') return 'Enter text';
      if (expected === 'array') return 'Choose from the list';
      return 'This is not the right kind of value';
    }
    case 'too_small':
    case 'too_big':
      return sizeWords(issue as never, unit);
    case 'invalid_format':
      return FORMAT_WORDS[(issue as { format?: string }).format ?? ''] ?? 'This is not in the expected format';
    case 'invalid_value':
      return 'Choose one of the options';
    case 'not_multiple_of':
      return `Use steps of ${withUnit((issue as { divisor: number }).divisor, unit)}`;
    case 'unrecognized_keys':
      return `Not a field here: ${(issue as { keys: string[] }).keys.join(', ')}`;
    case 'invalid_union':
      return 'This is not one of the accepted forms';
    default:
      return undefined;
  }
}

z.config({ customError: voltcribErrorMap });
