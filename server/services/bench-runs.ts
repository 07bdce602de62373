// Writing the bench log. Every write runs in one auditedTransaction: the booking row is locked
// first (lockBooking), then the run; the audit entries are chained at the end. A run beyond the
// approved plan is stored like any other (never refused, never hidden), flagged, audited, and
// the officers get one e-mail per booking through the outbox.
import { benchRunFlags, BEYOND_PLAN_FLAGS, deriveBenchRun, gramsForceToNewtons, type BenchFlag } from '../../shared/hv';
import { CSV_FIELDS, type BenchRun, type BenchRunEdit, type BenchRunImport, type BenchRunInput } from '../../shared/schemas/bench-runs';
import { csvRowsToRuns, missingColumns, parseCsv } from '../../shared/schemas/bench-runs-csv';
import { ERROR_CODES } from '../../shared/errors';
import type { SessionUser } from '../../shared/schemas/session';
import type { Db, Trx } from '../db';
import { AppError, ConflictError, NotFoundError, ValidationError } from '../errors';
import { messages } from '../mail/messages';
import { enqueueMail } from '../mail/enqueue';
import { appendAudit, auditedTransaction } from './audit';
import { assertCounterAccess, lockBooking } from './booking-access';
import { bookingPhotoIdsAmong } from './booking-photos';
import { planOf, type BookingRow } from './booking-rows';
import { timestampToIso } from './dates';
import { benchLogOpen, BENCH_LOG_GRACE_HOURS, runRows, type BenchRunRow } from './bench-runs-read';

export interface BenchMailContext {
  publicUrl: string;
}

/** Readings carried over from the previous run when a run leaves them out: a sweep changes one knob. */
const CARRIED_OVER = ['temperature_c', 'pressure_kpa', 'humidity_pct', 'wire_radius_mm', 'collector_radius_mm', 'surface_factor'] as const;

function assertOpen(row: BookingRow): void {
  if (benchLogOpen(row)) return;
  const why =
    row.status === 'returned' ? `it was returned more than ${BENCH_LOG_GRACE_HOURS} h ago` : `it is ${row.status}; runs are recorded once the gear is released`;
  throw new ConflictError(`Runs cannot be added to this booking: ${why}.`, ERROR_CODES.benchLogClosed);
}

async function suppliesOf(trx: Trx, bookingId: number) {
  const rows = await trx('booking_items as bi')
    .join('items as i', 'i.id', 'bi.item_id')
    .where('bi.booking_id', bookingId)
    .whereIn('i.kind', ['hv-supply', 'multiplier'])
    .orderBy('i.tag')
    .select('i.tag', 'i.kind', 'i.ratings');
  return rows.map((r) => {
    const ratings = (typeof r.ratings === 'string' ? JSON.parse(r.ratings) : r.ratings) as { maxKv?: number; maxOutputKv?: number; maxMa: number };
    return { tag: r.tag as string, maxKv: Number(r.kind === 'multiplier' ? ratings.maxOutputKv : ratings.maxKv), maxMa: Number(ratings.maxMa) };
  });
}

type RunColumns = Omit<
  BenchRunRow,
  'id' | 'booking_id' | 'number' | 'revision' | 'recorded_by' | 'recorded_at' | 'updated_at' | 'deleted_at' | 'deleted_by' | 'flags'
>;

/** The input in stored units (mA, mN), with the polarity and carried-over readings filled in. */
function columnsOf(input: BenchRunInput, booking: BookingRow, previous: Partial<BenchRunRow> | undefined, field = ''): RunColumns {
  const plan = planOf(booking);
  const polarity = input.polarity ?? (plan.polarity === 'reversible' ? null : plan.polarity);
  if (!polarity)
    throw new ValidationError('The plan allows either polarity: say which one this run used.', { [`${field}polarity`]: ['Positive or negative?'] });
  const columns: RunColumns = {
    applied_kv: input.appliedKv,
    polarity,
    // µA → mA without binary noise (183.6 µA is 0.1836 mA, not 0.18359999999999999).
    current_ma: input.currentMa ?? Number((input.currentUa! / 1000).toPrecision(12)),
    current_unit: input.currentUa !== undefined ? 'uA' : 'mA',
    gap_mm: input.gapMm,
    stages: input.stages ?? null,
    velocity_mps: input.velocityMps ?? null,
    // Grams-force to millinewtons through standard gravity (units.ts).
    thrust_mn: input.thrustGf !== undefined ? gramsForceToNewtons(input.thrustGf) * 1000 : (input.thrustMn ?? null),
    thrust_unit: input.thrustGf !== undefined ? 'gf' : 'mN',
    mass_g: input.massG ?? null,
    outlet_area_cm2: input.outletAreaCm2 ?? null,
    temperature_c: input.temperatureC ?? null,
    pressure_kpa: input.pressureKpa ?? null,
    humidity_pct: input.humidityPct ?? null,
    notes: input.notes ?? '',
    photo_file_id: input.photoFileId ?? null,
    wire_radius_mm: input.wireRadiusMm ?? null,
    collector_radius_mm: input.collectorRadiusMm ?? null,
    surface_factor: input.surfaceFactor ?? null,
  };
  for (const key of CARRIED_OVER) {
    if (columns[key] === null && previous?.[key] !== undefined && previous[key] !== null) columns[key] = Number(previous[key]);
  }
  if (columns.collector_radius_mm !== null && columns.wire_radius_mm !== null && columns.collector_radius_mm <= columns.wire_radius_mm) {
    throw new ValidationError('The collector radius must be larger than the wire radius.', { [`${field}collectorRadiusMm`]: ['Larger than the wire radius'] });
  }
  return columns;
}

function flagsFor(columns: RunColumns, booking: BookingRow, supplies: Awaited<ReturnType<typeof suppliesOf>>): BenchFlag[] {
  const plan = planOf(booking);
  const readings = {
    appliedKv: columns.applied_kv,
    currentMa: columns.current_ma,
    gapMm: columns.gap_mm,
    velocityMps: columns.velocity_mps,
    thrustMn: columns.thrust_mn,
    massG: columns.mass_g,
    outletAreaCm2: columns.outlet_area_cm2,
    temperatureC: columns.temperature_c,
    pressureKpa: columns.pressure_kpa,
    humidityPct: columns.humidity_pct,
  };
  return benchRunFlags(readings, deriveBenchRun(readings), { plannedKv: plan.plannedKv, maxCurrentMa: plan.maxCurrentMa, supplies });
}

async function assertPhoto(trx: Trx, bookingId: number, fileId: number | null): Promise<void> {
  if (fileId === null) return;
  const ok = await bookingPhotoIdsAmong(trx, bookingId, [fileId]);
  if (!ok.has(fileId))
    throw new ValidationError('That photo is not one of this booking’s photos.', { photoFileId: ['Upload the photo to this booking first'] });
}

/** Officers hear of a run beyond the plan once per booking (the dedupe key), however many follow. */
async function tellOfficers(trx: Trx, booking: BookingRow, number: number, columns: RunColumns, flags: BenchFlag[], mail: BenchMailContext): Promise<void> {
  const beyond = flags.filter((f) => BEYOND_PLAN_FLAGS.includes(f.code));
  if (beyond.length === 0) return;
  const b = await trx('bookings as b')
    .join('people as p', 'p.id', 'b.person_id')
    .where('b.id', booking.id)
    .first('b.id', 'b.ends_at', 'b.planned_kv', 'b.purpose', 'b.item_tags', 'p.name');
  const facts = {
    id: b.id,
    personName: b.name,
    plannedKv: Number(b.planned_kv),
    purpose: b.purpose,
    endsAt: timestampToIso(b.ends_at)!,
    itemTags: JSON.parse(b.item_tags) as string[],
  };
  const content = messages.benchRunBeyondPlan(
    mail.publicUrl,
    facts,
    { number, appliedKv: columns.applied_kv, currentMa: columns.current_ma },
    beyond.map((f) => f.message),
  );
  const officers = await trx('people').where({ role: 'officer', active: true }).select('id', 'email');
  for (const officer of officers) {
    await enqueueMail(trx, { kind: 'bench-run-beyond-plan', to: officer.email, dedupeKey: `bench-run-beyond-plan:${booking.id}:${officer.id}`, ...content });
  }
}

async function lastRun(trx: Trx, bookingId: number): Promise<BenchRunRow | undefined> {
  return trx<BenchRunRow>('bench_runs').where({ booking_id: bookingId }).whereNull('deleted_at').orderBy('number', 'desc').first();
}

async function nextNumber(trx: Trx, bookingId: number): Promise<number> {
  const row = await trx('bench_runs').where({ booking_id: bookingId }).max<{ n: number | null }>('number as n').first();
  return Number(row?.n ?? 0) + 1;
}

/** Inserts one run under the booking's lock; returns its id. */
async function insertRun(
  trx: Trx,
  actor: SessionUser,
  booking: BookingRow,
  input: BenchRunInput,
  supplies: Awaited<ReturnType<typeof suppliesOf>>,
  mail: BenchMailContext,
  field = '',
): Promise<number> {
  const columns = columnsOf(input, booking, await lastRun(trx, booking.id), field);
  await assertPhoto(trx, booking.id, columns.photo_file_id);
  const flags = flagsFor(columns, booking, supplies);
  const number = await nextNumber(trx, booking.id);
  const now = new Date();
  const [id] = (await trx('bench_runs').insert({
    ...columns,
    booking_id: booking.id,
    number,
    recorded_by: actor.id,
    recorded_at: now,
    updated_at: now,
    flags: JSON.stringify(flags),
  })) as [number];
  await appendAudit(trx, {
    actorId: actor.id,
    entity: 'booking',
    entityId: booking.id,
    action: 'bench-run.recorded',
    after: { runId: id, number, ...columns, flags: flags.map((f) => f.code) },
  });
  if (flags.some((f) => BEYOND_PLAN_FLAGS.includes(f.code))) {
    await appendAudit(trx, {
      actorId: actor.id,
      entity: 'booking',
      entityId: booking.id,
      action: 'bench-run.beyond-plan',
      after: {
        runId: id,
        number,
        appliedKv: columns.applied_kv,
        currentMa: columns.current_ma,
        plan: planOf(booking),
        flags: flags.filter((f) => BEYOND_PLAN_FLAGS.includes(f.code)),
      },
    });
  }
  await tellOfficers(trx, booking, number, columns, flags, mail);
  return id;
}

async function runById(db: Db, bookingId: number, runId: number): Promise<BenchRun> {
  const run = (await runRows(db, bookingId)).find((r) => r.id === runId);
  if (!run) throw new NotFoundError(`No run ${runId} on booking ${bookingId}.`);
  return run;
}

async function openBookingForWrite(trx: Trx, actor: SessionUser, bookingId: number): Promise<BookingRow> {
  const booking = await lockBooking(trx, bookingId);
  assertCounterAccess(actor, booking);
  assertOpen(booking);
  return booking;
}

export async function recordBenchRun(db: Db, actor: SessionUser, bookingId: number, input: BenchRunInput, mail: BenchMailContext): Promise<BenchRun> {
  const id = await auditedTransaction(db, async (trx) => {
    const booking = await openBookingForWrite(trx, actor, bookingId);
    return insertRun(trx, actor, booking, input, await suppliesOf(trx, bookingId), mail);
  });
  return runById(db, bookingId, id);
}

async function lockRun(trx: Trx, bookingId: number, runId: number): Promise<BenchRunRow> {
  const run = await trx<BenchRunRow>('bench_runs').where({ id: runId, booking_id: bookingId }).whereNull('deleted_at').forUpdate().first();
  if (!run) throw new NotFoundError(`No run ${runId} on booking ${bookingId}.`);
  return run;
}

function snapshot(run: BenchRunRow): Record<string, unknown> {
  const { id: _id, booking_id: _b, deleted_at: _d, deleted_by: _db, ...rest } = run;
  return { ...rest, flags: typeof rest.flags === 'string' ? JSON.parse(rest.flags) : rest.flags };
}

/** A correction: the run as it was goes to bench_run_revisions, the row takes the new readings. */
export async function editBenchRun(
  db: Db,
  actor: SessionUser,
  bookingId: number,
  runId: number,
  edit: BenchRunEdit,
  mail: BenchMailContext,
): Promise<BenchRun> {
  await auditedTransaction(db, async (trx) => {
    const booking = await openBookingForWrite(trx, actor, bookingId);
    const run = await lockRun(trx, bookingId, runId);
    const { reason, ...input } = edit;
    // Readings left out of a correction keep the run's own values, not the previous run's.
    const columns = columnsOf(input, booking, run);
    await assertPhoto(trx, bookingId, columns.photo_file_id);
    const flags = flagsFor(columns, booking, await suppliesOf(trx, bookingId));
    const now = new Date();
    await trx('bench_run_revisions').insert({
      run_id: runId,
      revision: run.revision,
      action: 'edited',
      before: JSON.stringify(snapshot(run)),
      reason,
      edited_by: actor.id,
      edited_at: now,
    });
    await trx('bench_runs')
      .where({ id: runId })
      .update({ ...columns, revision: run.revision + 1, updated_at: now, flags: JSON.stringify(flags) });
    await appendAudit(trx, {
      actorId: actor.id,
      entity: 'booking',
      entityId: bookingId,
      action: 'bench-run.edited',
      before: snapshot(run),
      after: { runId, number: run.number, revision: run.revision + 1, reason, ...columns, flags: flags.map((f) => f.code) },
    });
    if (flags.some((f) => BEYOND_PLAN_FLAGS.includes(f.code))) await tellOfficers(trx, booking, run.number, columns, flags, mail);
  });
  return runById(db, bookingId, runId);
}

/** Staff only (the route checks the role). The row stays, marked deleted, with its last revision kept. */
export async function deleteBenchRun(db: Db, actor: SessionUser, bookingId: number, runId: number, reason: string): Promise<void> {
  await auditedTransaction(db, async (trx) => {
    const booking = await lockBooking(trx, bookingId);
    assertCounterAccess(actor, booking);
    const run = await lockRun(trx, bookingId, runId);
    const now = new Date();
    await trx('bench_run_revisions').insert({
      run_id: runId,
      revision: run.revision,
      action: 'deleted',
      before: JSON.stringify(snapshot(run)),
      reason,
      edited_by: actor.id,
      edited_at: now,
    });
    await trx('bench_runs').where({ id: runId }).update({ deleted_at: now, deleted_by: actor.id, updated_at: now });
    await appendAudit(trx, {
      actorId: actor.id,
      entity: 'booking',
      entityId: bookingId,
      action: 'bench-run.deleted',
      before: snapshot(run),
      after: { runId, number: run.number, reason },
    });
  });
}

/**
 * A logger's CSV: every row is checked first, and one refused row refuses the file (nothing is
 * imported). The rows go in, in file order, in one transaction.
 */
export async function importBenchRuns(db: Db, actor: SessionUser, bookingId: number, body: BenchRunImport, mail: BenchMailContext): Promise<BenchRun[]> {
  const parsed = parseCsv(body.csv);
  const fieldErrors: Record<string, string[]> = {};
  if (parsed.problems.length > 0) fieldErrors.csv = parsed.problems;
  const missing = missingColumns(parsed, body.mapping);
  if (missing.length > 0) fieldErrors.mapping = [`The file has no column ${missing.map((m) => `"${m}"`).join(', ')}`];
  if (!body.mapping.appliedKv || !body.mapping.gapMm || !(body.mapping.currentMa || body.mapping.currentUa)) {
    (fieldErrors.mapping ??= []).push('Map at least the voltage, the current and the gap');
  }
  if (parsed.rows.length === 0) (fieldErrors.csv ??= []).push('The file has a header but no rows');
  if (parsed.rows.length > 500) (fieldErrors.csv ??= []).push('At most 500 rows per file');
  if (Object.keys(fieldErrors).length > 0) throw new ValidationError(`Import refused: ${Object.values(fieldErrors).flat()[0]}.`, fieldErrors);

  const outcomes = csvRowsToRuns(parsed, body.mapping);
  const refused = outcomes.filter((o) => o.input === null);
  if (refused.length > 0) {
    const failures = refused.flatMap((o) => o.errors.map((message) => ({ rule: `line-${o.line}`, message: `Line ${o.line}: ${message}` })));
    throw new AppError(
      400,
      ERROR_CODES.validation,
      `Import refused: ${refused.length} row${refused.length === 1 ? '' : 's'} cannot be read; nothing was imported.`,
      {
        failures,
        fieldErrors: Object.fromEntries(refused.map((o) => [`line ${o.line}`, o.errors])),
      },
    );
  }
  const ids = await auditedTransaction(db, async (trx) => {
    const booking = await openBookingForWrite(trx, actor, bookingId);
    const supplies = await suppliesOf(trx, bookingId);
    const created: number[] = [];
    for (const outcome of outcomes) created.push(await insertRun(trx, actor, booking, outcome.input!, supplies, mail, `line ${outcome.line}.`));
    await appendAudit(trx, {
      actorId: actor.id,
      entity: 'booking',
      entityId: bookingId,
      action: 'bench-run.imported',
      after: { runIds: created, rows: created.length, mapping: body.mapping, fields: CSV_FIELDS.filter((f) => body.mapping[f]) },
    });
    return created;
  });
  const runs = await runRows(db, bookingId);
  return runs.filter((r) => ids.includes(r.id));
}
