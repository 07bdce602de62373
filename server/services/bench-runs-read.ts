// Reading the bench log: a booking's runs with their derived figures (recomputed from the
// readings) and stored flags, the corona-onset fits per gap and polarity, and the CSV export.
import { BENCH_FLAG_CODES, coronaOnset, deriveBenchRun, fitCoronaCurrent, kpaToCmHg, type BenchFlag } from '../../shared/hv';
import type { BenchRun, BenchRunRevision, BenchRunsResponse, CoronaFitSummary, RunPolarity } from '../../shared/schemas/bench-runs';
import { CSV_HEADERS, toCsv } from '../../shared/schemas/bench-runs-csv';
import type { SessionUser } from '../../shared/schemas/session';
import type { Db, Trx } from '../db';
import { NotFoundError } from '../errors';
import { canSeeBooking } from './booking-access';
import type { BookingRow } from './booking-rows';
import { timestampToIso } from './dates';

/** Runs may still be typed up this long after the gear came back. */
export const BENCH_LOG_GRACE_HOURS = 24;

export interface BenchRunRow {
  id: number;
  booking_id: number;
  number: number;
  revision: number;
  recorded_by: number;
  recorded_at: Date;
  updated_at: Date;
  applied_kv: number;
  polarity: RunPolarity;
  current_ma: number;
  current_unit: 'mA' | 'uA';
  gap_mm: number;
  stages: number | null;
  velocity_mps: number | null;
  thrust_mn: number | null;
  thrust_unit: 'mN' | 'gf';
  mass_g: number | null;
  outlet_area_cm2: number | null;
  temperature_c: number | null;
  pressure_kpa: number | null;
  humidity_pct: number | null;
  notes: string;
  photo_file_id: number | null;
  wire_radius_mm: number | null;
  collector_radius_mm: number | null;
  surface_factor: number | null;
  flags: unknown;
  deleted_at: Date | null;
  deleted_by: number | null;
}

const num = (v: unknown): number | null => (v === null || v === undefined ? null : Number(v));

function flagsOf(value: unknown): BenchFlag[] {
  // mysql2 may hand a JSON column back as text.
  const parsed = typeof value === 'string' ? (JSON.parse(value) as unknown) : value;
  if (!Array.isArray(parsed)) return [];
  return parsed.filter((f): f is BenchFlag => typeof f === 'object' && f !== null && (BENCH_FLAG_CODES as readonly string[]).includes((f as BenchFlag).code));
}

export function toBenchRun(row: BenchRunRow & { recorded_by_name: string }): BenchRun {
  const readings = {
    appliedKv: Number(row.applied_kv),
    currentMa: Number(row.current_ma),
    gapMm: Number(row.gap_mm),
    velocityMps: num(row.velocity_mps),
    thrustMn: num(row.thrust_mn),
    massG: num(row.mass_g),
    outletAreaCm2: num(row.outlet_area_cm2),
    temperatureC: num(row.temperature_c),
    pressureKpa: num(row.pressure_kpa),
    humidityPct: num(row.humidity_pct),
  };
  return {
    id: row.id,
    bookingId: row.booking_id,
    number: row.number,
    revision: row.revision,
    recordedAt: timestampToIso(row.recorded_at)!,
    recordedBy: { id: row.recorded_by, name: row.recorded_by_name },
    ...readings,
    polarity: row.polarity,
    currentUnit: row.current_unit === 'uA' ? 'µA' : 'mA',
    stages: row.stages,
    thrustUnit: row.thrust_unit,
    notes: row.notes,
    photoFileId: row.photo_file_id,
    wireRadiusMm: num(row.wire_radius_mm),
    collectorRadiusMm: num(row.collector_radius_mm),
    surfaceFactor: num(row.surface_factor),
    derived: deriveBenchRun(readings),
    flags: flagsOf(row.flags),
  };
}

/** Released, or returned within the grace: the only times runs may be added or corrected. */
export function benchLogOpen(row: Pick<BookingRow, 'status' | 'returned_at'>, now = new Date()): boolean {
  if (row.status === 'released') return true;
  if (row.status !== 'returned' || !row.returned_at) return false;
  return now.getTime() - new Date(row.returned_at).getTime() <= BENCH_LOG_GRACE_HOURS * 3600_000;
}

export async function runRows(q: Db | Trx, bookingId: number): Promise<BenchRun[]> {
  const rows = await q('bench_runs as r')
    .join('people as p', 'p.id', 'r.recorded_by')
    .where('r.booking_id', bookingId)
    .whereNull('r.deleted_at')
    .orderBy('r.number')
    .select<(BenchRunRow & { recorded_by_name: string })[]>('r.*', 'p.name as recorded_by_name');
  return rows.map(toBenchRun);
}

function peekOnsetKv(runs: readonly BenchRun[]): number | null {
  const withGeometry = [...runs].reverse().find((r) => r.wireRadiusMm !== null && r.collectorRadiusMm !== null);
  if (!withGeometry) return null;
  // Peek's own reference conditions (76 cmHg, 25 °C, δ = 1) when the run has no ambient readings.
  const onset = coronaOnset({
    wireRadiusM: withGeometry.wireRadiusMm! * 1e-3,
    outerRadiusM: withGeometry.collectorRadiusMm! * 1e-3,
    pressureCmHg: withGeometry.pressureKpa === null ? 76 : kpaToCmHg(withGeometry.pressureKpa),
    temperatureC: withGeometry.temperatureC ?? 25,
    surfaceFactor: withGeometry.surfaceFactor ?? 1,
  });
  return onset.onsetV === undefined ? null : onset.onsetV / 1e3;
}

/** One fit per gap and polarity that has at least four runs above onset. */
export function coronaFits(runs: readonly BenchRun[]): CoronaFitSummary[] {
  const groups = new Map<string, BenchRun[]>();
  for (const run of runs) {
    const key = `${run.gapMm}|${run.polarity}`;
    groups.set(key, [...(groups.get(key) ?? []), run]);
  }
  const fits: CoronaFitSummary[] = [];
  for (const group of groups.values()) {
    const fit = fitCoronaCurrent(group.map((r) => ({ voltageV: r.appliedKv * 1e3, currentA: r.currentMa * 1e-3 })));
    if (!fit) continue;
    fits.push({
      gapMm: group[0]!.gapMm,
      polarity: group[0]!.polarity,
      n: fit.n,
      onsetKv: fit.onsetV / 1e3,
      onsetKvStdErr: fit.onsetVStdErr / 1e3,
      // A/V² → mA/kV²: × 1e3 (mA per A) × 1e6 (V² per kV²).
      c: fit.cAPerV2 * 1e9,
      cStdErr: fit.cAPerV2StdErr * 1e9,
      r2: fit.rSquared,
      peekOnsetKv: peekOnsetKv(group),
      source: fit.source,
    });
  }
  return fits.sort((a, b) => a.gapMm - b.gapMm || a.polarity.localeCompare(b.polarity));
}

async function visibleBooking(db: Db, actor: SessionUser, bookingId: number): Promise<BookingRow> {
  const row = await db<BookingRow>('bookings').where({ id: bookingId }).first();
  if (!row || !canSeeBooking(actor, row)) throw new NotFoundError(`No booking with id ${bookingId}.`);
  return row;
}

export async function listBenchRuns(db: Db, actor: SessionUser, bookingId: number): Promise<BenchRunsResponse> {
  const booking = await visibleBooking(db, actor, bookingId);
  const runs = await runRows(db, bookingId);
  const fits = coronaFits(runs);
  const last = runs[runs.length - 1];
  const fit = last ? (fits.find((f) => f.gapMm === last.gapMm && f.polarity === last.polarity) ?? null) : null;
  return { runs, fit, fits, open: benchLogOpen(booking), graceHours: BENCH_LOG_GRACE_HOURS };
}

export async function listRunRevisions(db: Db, actor: SessionUser, bookingId: number, runId: number): Promise<BenchRunRevision[]> {
  await visibleBooking(db, actor, bookingId);
  const run = await db('bench_runs').where({ id: runId, booking_id: bookingId }).first('id');
  if (!run) throw new NotFoundError(`No run ${runId} on booking ${bookingId}.`);
  const rows = await db('bench_run_revisions as v')
    .join('people as p', 'p.id', 'v.edited_by')
    .where('v.run_id', runId)
    .orderBy('v.revision')
    .select('v.*', 'p.name as editor');
  return rows.map((r) => ({
    revision: r.revision,
    action: r.action,
    editedAt: timestampToIso(r.edited_at)!,
    editedBy: r.editor,
    reason: r.reason,
    before: (typeof r.before === 'string' ? JSON.parse(r.before) : r.before) as Record<string, unknown>,
  }));
}

const EXPORT_HEADERS = [
  'run',
  'recorded at (UTC)',
  'recorded by',
  CSV_HEADERS.appliedKv,
  CSV_HEADERS.polarity,
  CSV_HEADERS.currentMa,
  CSV_HEADERS.gapMm,
  CSV_HEADERS.stages,
  CSV_HEADERS.velocityMps,
  CSV_HEADERS.thrustMn,
  CSV_HEADERS.massG,
  CSV_HEADERS.outletAreaCm2,
  CSV_HEADERS.temperatureC,
  CSV_HEADERS.pressureKpa,
  CSV_HEADERS.humidityPct,
  'power (W)',
  'thrust per power (mN/W)',
  'thrust-to-weight (%)',
  'power per thrust (W/gf)',
  'air density (kg/m³)',
  '1-D thrust bound (mN)',
  'momentum-flux velocity (m/s)',
  'flags',
  CSV_HEADERS.notes,
];

const round = (v: number | null, digits = 6) => (v === null ? null : Number(v.toPrecision(digits)));

export async function benchRunsCsv(db: Db, actor: SessionUser, bookingId: number): Promise<string> {
  await visibleBooking(db, actor, bookingId);
  const runs = await runRows(db, bookingId);
  return toCsv(
    EXPORT_HEADERS,
    runs.map((r) => [
      r.number,
      r.recordedAt,
      r.recordedBy.name,
      r.appliedKv,
      r.polarity,
      r.currentMa,
      r.gapMm,
      r.stages,
      r.velocityMps,
      r.thrustMn,
      r.massG,
      r.outletAreaCm2,
      r.temperatureC,
      r.pressureKpa,
      r.humidityPct,
      round(r.derived.powerW),
      round(r.derived.thrustPerPowerMnPerW),
      round(r.derived.thrustToWeightPct),
      round(r.derived.wattsPerGramForce),
      round(r.derived.airDensityKgM3),
      round(r.derived.ehdThrustBoundMn),
      round(r.derived.momentumVelocityMps),
      r.flags.map((f) => f.code).join(' '),
      r.notes,
    ]),
  );
}
