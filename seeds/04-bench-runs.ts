// Demo data only: Noor's ionic-wind thrust sweep in Kestrel Hall's bay 2, released now, with its
// bench log — a wire-to-mesh emitter swept at three gaps (20, 30, 40 mm) up to the planned 12 kV.
// The readings are invented but shaped like a real single-stage thruster: corona current
// I = C·V·(V − V₀) with a few per cent of meter scatter, thrust about 45 % of the one-dimensional
// bound I·d/μ. One reading (30 mm, 10 kV) is a mis-zeroed balance that the thrust bound flags.
import type { Knex } from 'knex';
import type { BenchRunInput } from '../shared/schemas/bench-runs';
import type { ChecklistEntry } from '../shared/schemas/bookings';
import type { SessionUser } from '../shared/schemas/session';
import { recordBenchRun } from '../server/services/bench-runs';
import { createBooking } from '../server/services/booking-plans';
import { recordScan, submitChecklist } from '../server/services/booking-counter';
import { releaseBooking } from '../server/services/booking-release';

const MAIL = { publicUrl: process.env.PUBLIC_URL ?? 'http://127.0.0.1:8080' };
const HOUR = 3600_000;
const MOBILITY_M2_PER_VS = 2e-4;

// Per gap: onset V₀ (kV) and C (mA/kV²); a longer gap starts later and draws less current.
const GAPS = [
  { gapMm: 20, onsetKv: 5.0, cMaPerKv2: 0.005 },
  { gapMm: 30, onsetKv: 6.2, cMaPerKv2: 0.003 },
  { gapMm: 40, onsetKv: 7.3, cMaPerKv2: 0.0019 },
];
const SCATTER = [1.03, 0.98, 1.01, 0.97, 1.02, 0.99, 1.0];
const OUTLET_AREA_CM2 = 150;
const MASS_G = 14;

const round = (value: number, digits: number) => Number(value.toFixed(digits));

function sweep(): BenchRunInput[] {
  const runs: BenchRunInput[] = [];
  let k = 0;
  for (const { gapMm, onsetKv, cMaPerKv2 } of GAPS) {
    for (let kv = Math.ceil(onsetKv); kv <= 12; kv += 1) {
      const scatter = SCATTER[k++ % SCATTER.length]!;
      const currentMa = cMaPerKv2 * kv * (kv - onsetKv) * scatter;
      const boundMn = ((currentMa * 1e-3 * gapMm * 1e-3) / MOBILITY_M2_PER_VS) * 1e3;
      const thrustMn = 0.45 * boundMn * (2 - scatter);
      const velocityMps = 0.9 * Math.sqrt((thrustMn * 1e-3) / (1.19 * OUTLET_AREA_CM2 * 1e-4));
      runs.push({
        appliedKv: kv,
        currentUa: round(currentMa * 1000, 1),
        gapMm,
        stages: 1,
        thrustMn: round(thrustMn, 2),
        velocityMps: round(velocityMps, 2),
        massG: MASS_G,
        outletAreaCm2: OUTLET_AREA_CM2,
      });
    }
  }
  // Ambient once, at the start; later runs carry it over.
  runs[0] = {
    ...runs[0]!,
    temperatureC: 21.5,
    pressureKpa: 100.8,
    humidityPct: 42,
    notes: 'Wire-to-mesh, 0.2 mm tungsten emitter; ambient from the bay 2 logger.',
  };
  // The slip: a balance that drifted off zero between points reads more than physics allows.
  const slip = runs.findIndex((r) => r.gapMm === 30 && r.appliedKv === 10);
  runs[slip] = { ...runs[slip]!, thrustMn: 24.5, velocityMps: undefined, notes: 'Balance reading looked high; re-zero before the next point.' };
  return runs;
}

/** Answers every required line the way a careful member would: confirmed, readings in limits. */
function carefulAnswers(entries: ChecklistEntry[]) {
  return entries
    .filter((e) => e.required)
    .map((e) => (e.kind === 'reading' ? { itemId: e.id, value: e.min ?? e.max ?? 0 } : { itemId: e.id, confirmed: true }));
}

export async function seed(knex: Knex): Promise<void> {
  const noor: SessionUser = await knex('people').where({ email: 'member@voltcrib.example' }).first('id', 'email', 'name', 'role');
  const models = ['KS-FB15', 'HI-GS60', 'KS-PT100', 'KS-IL2', 'HP-40'];
  const rows = await knex('items').whereIn('model', models).orderBy('id').select('id', 'model');
  const itemIds = models.map((m) => rows.find((r) => r.model === m)!.id as number);
  const startsAt = new Date();
  let booking = await createBooking(
    knex,
    noor,
    {
      itemIds,
      startsAt: startsAt.toISOString(),
      endsAt: new Date(startsAt.getTime() + 3 * HOUR).toISOString(),
      location: 'Kestrel Hall, bay 2',
      purpose: 'Ionic-wind thrust sweep, wire-to-mesh at 20, 30 and 40 mm',
      plan: { plannedKv: 12, polarity: 'positive', maxCurrentMa: 0.5, peoplePresent: 2 },
    },
    MAIL,
  );
  // Twelve kilovolts with a 0.5 nF flyback needs no approval; if an officer raised the bar, the
  // demo booking waits in the queue instead.
  if (booking.status !== 'requested' && booking.status !== 'approved') return;
  for (const item of booking.items) booking = await recordScan(knex, noor, booking.id, item.tag);
  if (booking.checklist.pre.some((e) => e.required && e.kind === 'photo')) return;
  booking = await submitChecklist(knex, noor, booking.id, { phase: 'pre', answers: carefulAnswers(booking.checklist.pre) });
  await releaseBooking(knex, noor, booking.id);
  for (const run of sweep()) await recordBenchRun(knex, noor, booking.id, run, MAIL);
}
