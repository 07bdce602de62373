// Loads the bench database at the scale the bench asks for: 50,000 items, 300 people and
// 200,000 bookings over two years, plus dedicated, inspected kits for the release loop.
// Everything here is generated demo data for the invented lab.
import bcrypt from 'bcrypt';
import type { Db } from '../../server/db';
import { bookingItemTags } from '../../server/services/booking-rows';
import { addDaysIso, todayIso } from '../../server/services/dates';
import { insertSearchable, seedItems } from '../seed-scale';

export const BENCH_PASSWORD = 'voltcrib-bench';
export const KITS = 60;

export async function seedBench(db: Db, scale = { items: 50_000, people: 300, bookings: 200_000 }): Promise<void> {
  const started = Date.now();
  const hash = await bcrypt.hash(BENCH_PASSWORD, 10);
  const groupNames = ['Ion Wind Group', 'Corona & Plasma Group', 'Electrospinning Group', 'Teaching Lab', 'Breakdown Studies', 'Precipitator Project'];
  await db('groups').insert(groupNames.map((name) => ({ name })));
  const groups = await db('groups').pluck('id');
  const people = Array.from({ length: scale.people }, (_, i) => ({
    email: `bench-${i}@voltcrib.example`,
    name: `Bench Person ${i}`,
    role: i === 0 ? 'manager' : i < 6 ? 'officer' : 'member',
    group_id: groups[i % groups.length],
    password_hash: hash,
  }));
  await db('people').insert(people);
  const personIds = await db('people').orderBy('id').pluck('id');
  await db('qualifications').insert(personIds.map((id) => ({ person_id: id, authorised_kv: 40, expires_on: addDaysIso(todayIso(), 365), notes: '' })));

  await seedItems(db, scale.items);
  const maxItem = Number((await db('items').max({ m: 'id' }).first())?.m);
  const tagOf = new Map((await db('items').select('id', 'tag')).map((r: { id: number; tag: string }) => [r.id, r.tag]));

  // Kits the release loop books, scans, releases and returns over and over.
  const next = addDaysIso(todayIso(), 200);
  for (let k = 0; k < KITS; k += 1) {
    const kit = [
      {
        kind: 'hv-supply',
        ratings: { maxKv: 30, maxMa: 2, polarity: 'negative', outputCapacitanceNf: 5, bleederMohm: 300, hasInterlockInput: true },
        rated: 30,
      },
      { kind: 'grounding-stick', ratings: { ratedKv: 100, hookResistanceMohm: 10, cableLengthM: 3 }, rated: 100 },
      { kind: 'isolation-stand', ratings: { withstandKv: 100 }, rated: 100 },
      { kind: 'interlock', ratings: { ratedKv: 60 }, rated: 60 },
      { kind: 'probe', ratings: { maxKv: 40, ratio: 1000, inputResistanceMohm: 1000 }, rated: 40 },
    ];
    await insertSearchable(
      db,
      kit.map((p, j) => ({
        tag: `BK-${String(k).padStart(3, '0')}-${j}`,
        kind: p.kind,
        name: `Bench kit ${k} ${p.kind}`,
        location: 'Bench bay',
        notes: '',
        ratings: JSON.stringify(p.ratings),
        rated_kv: p.rated,
        inspection_interval_days: 365,
        last_inspected_on: addDaysIso(next, -365),
        next_inspection_due: next,
      })),
    );
  }

  // Two years of finished bookings (returned or cancelled), so they hold no items now.
  const now = Date.now();
  const span = 2 * 365 * 24 * 3600_000;
  let rng = 7;
  const rand = () => (rng = (rng * 1103515245 + 12345) % 2 ** 31) / 2 ** 31;
  for (let done = 0; done < scale.bookings;) {
    const batch = [];
    const itemsOf: number[][] = [];
    for (let i = 0; i < 5000 && done < scale.bookings; i += 1, done += 1) {
      const start = new Date(now - span + Math.floor(rand() * (span - 7 * 24 * 3600_000)));
      const end = new Date(start.getTime() + (1 + Math.floor(rand() * 8)) * 3600_000);
      const n = 1 + Math.floor(rand() * 3);
      const ids = new Set<number>();
      while (ids.size < n) ids.add(1 + Math.floor(rand() * maxItem));
      itemsOf.push([...ids]);
      batch.push({
        person_id: personIds[Math.floor(rand() * personIds.length)],
        status: rand() < 0.9 ? 'returned' : 'cancelled',
        starts_at: start,
        ends_at: end,
        location: 'Bay 2',
        purpose: 'Generated bench booking',
        planned_kv: Math.round(5 + rand() * 35),
        polarity: 'negative',
        max_current_ma: 1,
        people_present: 2,
        assessment: '{}',
        approval_required: false,
        released_at: start,
        returned_at: end,
        item_tags: bookingItemTags([...ids].map((id) => ({ tag: tagOf.get(id)! }))),
      });
    }
    const [firstId] = (await db('bookings').insert(batch)) as [number];
    const links = batch.flatMap((b, i) =>
      itemsOf[i]!.map((itemId) => ({ booking_id: firstId + i, item_id: itemId, starts_at: b.starts_at, ends_at: b.ends_at, live: false })),
    );
    await db('booking_items').insert(links);
  }
  await db.raw('ANALYZE TABLE items, item_terms, bookings, booking_items, people');
  console.log(`[bench] seeded ${scale.items} items, ${scale.people} people, ${scale.bookings} bookings in ${((Date.now() - started) / 1000).toFixed(0)} s`);
}
