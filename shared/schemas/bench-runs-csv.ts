// CSV in and out of the bench log, shared by the import screen (preview) and the server (which
// checks again and imports all rows or none). Parsing is papaparse's; this module only maps a
// logger's columns onto the run fields and turns each row into a run input or a list of errors.
import Papa from 'papaparse';
import { benchRunInputSchema, CSV_FIELDS, type BenchRunInput, type CsvField } from './bench-runs';

/** Export headers, units in brackets; the importer recognises them, so an export re-imports as is. */
export const CSV_HEADERS: Record<CsvField, string> = {
  appliedKv: 'applied voltage (kV)',
  currentMa: 'current (mA)',
  currentUa: 'current (µA)',
  gapMm: 'gap (mm)',
  polarity: 'polarity',
  stages: 'stages',
  velocityMps: 'velocity (m/s)',
  thrustMn: 'thrust (mN)',
  thrustGf: 'thrust (gf)',
  massG: 'device mass (g)',
  outletAreaCm2: 'outlet area (cm²)',
  temperatureC: 'temperature (°C)',
  pressureKpa: 'pressure (kPa)',
  humidityPct: 'relative humidity (%)',
  notes: 'notes',
};

const NUMERIC = new Set<CsvField>(CSV_FIELDS.filter((f) => f !== 'polarity' && f !== 'notes'));

export interface ParsedCsv {
  headers: string[];
  rows: string[][];
  /** papaparse's complaints (unclosed quotes…), with the file line they came from. */
  problems: string[];
}

export function parseCsv(text: string): ParsedCsv {
  const result = Papa.parse<string[]>(text.replace(/^\uFEFF/, ''), { skipEmptyLines: 'greedy' });
  const [headers = [], ...rows] = result.data;
  return {
    headers: headers.map((h) => h.trim()),
    rows,
    problems: result.errors.map((e) => `Line ${(e.row ?? 0) + 1}: ${e.message}`),
  };
}

const squash = (s: string) =>
  s
    .toLowerCase()
    .replace(/µ/g, 'u')
    .replace(/[^a-z0-9%²]/g, '');

// Words bench loggers commonly use for a column (common practice, no source).
const ALIASES: Partial<Record<CsvField, string[]>> = {
  appliedKv: ['kv', 'voltagekv', 'vkv', 'voltage'],
  currentMa: ['ma', 'currentma', 'ima'],
  currentUa: ['ua', 'currentua', 'iua'],
  gapMm: ['gapmm', 'gap', 'dmm'],
  velocityMps: ['velocity', 'velocityms', 'airspeed', 'ms'],
  thrustMn: ['thrust', 'thrustmn', 'mn'],
  thrustGf: ['thrustg', 'thrustgf', 'gf'],
  massG: ['mass', 'massg', 'devicemassg'],
  outletAreaCm2: ['area', 'outletarea', 'areacm2', 'outletareacm²', 'outletareacm2'],
  temperatureC: ['temperature', 'tempc', 'temperaturec', 't'],
  pressureKpa: ['pressure', 'pressurekpa', 'pkpa'],
  humidityPct: ['humidity', 'rh', 'rh%', 'relativehumidity%', 'humidity%'],
};

/** A first guess at the mapping: the export's own headers, then common logger words. */
export function guessMapping(headers: readonly string[]): Partial<Record<CsvField, string>> {
  const mapping: Partial<Record<CsvField, string>> = {};
  const used = new Set<string>();
  for (const field of CSV_FIELDS) {
    const names = [squash(CSV_HEADERS[field]), squash(field), ...(ALIASES[field] ?? [])];
    const header = headers.find((h) => !used.has(h) && names.includes(squash(h)));
    if (header) {
      mapping[field] = header;
      used.add(header);
    }
  }
  return mapping;
}

export interface CsvRowOutcome {
  /** Line in the file (the header is line 1). */
  line: number;
  input: BenchRunInput | null;
  errors: string[];
}

function cellValue(field: CsvField, raw: string, errors: string[]): unknown {
  const text = raw.trim();
  if (text === '') return undefined;
  if (field === 'polarity') {
    const p = text.toLowerCase();
    if (['+', 'pos', 'positive'].includes(p)) return 'positive';
    if (['-', '−', 'neg', 'negative'].includes(p)) return 'negative';
    errors.push(`${CSV_HEADERS.polarity}: "${text}" is not positive or negative`);
    return undefined;
  }
  if (!NUMERIC.has(field)) return text;
  // A decimal comma would silently read as a thousands separator somewhere else: refuse it.
  if (/^-?\d+,\d+$/.test(text)) {
    errors.push(`${CSV_HEADERS[field]}: "${text}" uses a decimal comma; use a point`);
    return undefined;
  }
  const n = Number(text);
  if (!Number.isFinite(n)) {
    errors.push(`${CSV_HEADERS[field]}: "${text}" is not a number`);
    return undefined;
  }
  return n;
}

/** Each data row as a run input, or the reasons it cannot be one. */
export function csvRowsToRuns(parsed: ParsedCsv, mapping: Partial<Record<CsvField, string>>): CsvRowOutcome[] {
  const columns = Object.entries(mapping).map(([field, header]) => ({ field: field as CsvField, index: parsed.headers.indexOf(header!) }));
  return parsed.rows.map((cells, i) => {
    const errors: string[] = [];
    const body: Record<string, unknown> = {};
    for (const { field, index } of columns) {
      if (index < 0) continue;
      const value = cellValue(field, cells[index] ?? '', errors);
      if (value !== undefined) body[field] = value;
    }
    const result = benchRunInputSchema.safeParse(body);
    if (!result.success) {
      for (const issue of result.error.issues) {
        const field = issue.path[0] as CsvField | undefined;
        errors.push(`${field && field in CSV_HEADERS ? CSV_HEADERS[field] : (field ?? 'row')}: ${issue.message}`);
      }
    }
    return { line: i + 2, input: errors.length === 0 && result.success ? result.data : null, errors };
  });
}

/** Columns the mapping names that the file does not have. */
export function missingColumns(parsed: ParsedCsv, mapping: Partial<Record<CsvField, string>>): string[] {
  return Object.values(mapping).filter((h): h is string => typeof h === 'string' && !parsed.headers.includes(h));
}

/** Spreadsheet programs run a cell that starts with = + - @ as a formula: text cells get a quote. */
export function csvSafeText(value: string): string {
  return /^[=+\-@\t\r]/.test(value) ? `'${value}` : value;
}

export function toCsv(headers: readonly string[], rows: readonly (readonly (string | number | null)[])[]): string {
  return Papa.unparse(
    { fields: [...headers], data: rows.map((r) => r.map((c) => (c === null ? '' : typeof c === 'string' ? csvSafeText(c) : c))) },
    { newline: '\r\n' },
  );
}
