// Loads many generated items (and later bookings) into a database, to check that the lists stay
// fast at a real lab's scale and beyond. Example: `npm run seed:scale -- --items=50000`.
// Uses the dev database unless --instance=bench. Generated rows are invented demo data.
import { loadConfig } from '../server/config';
import { createDb, type Db } from '../server/db';
import { addDaysIso, todayIso } from '../server/services/dates';
import { TERM_SOURCE_COLUMNS, writeItemTerms, type TermSource } from '../server/services/item-terms';
import { DEFAULT_INSPECTION_DAYS, ITEM_KINDS, KIND_TAG_CODES, ratedKvOf, type ItemKind, type ItemRatings } from '../shared/schemas/items';
import { benchInstance, dbEnv, devInstance } from './lib/instances';
import { startInstance } from './lib/mariadb';
import { migrateLatest } from './lib/migrate';

const WORDS = [
  'Corona',
  'Ionic',
  'Spinning',
  'Bench',
  'Teaching',
  'Needle',
  'Drum',
  'Cage',
  'Plasma',
  'Breakdown',
  'Precipitator',
  'Wire',
  'Grid',
  'Thruster',
  'Cascade',
];
const MAKES = ['Orrin Works', 'Halvard Instruments', 'Brightwater HV', 'Tamsin Electric', 'Kestrel Shop (built in-house)'];
const LOCATIONS = ['Bay 1 (interlocked cage)', 'Bay 2 (open bench, barrier posts)', 'HV store, cabinet A', 'Teaching lab, bench 3', 'Annex, bench 7'];

/** Deterministic pseudo-random numbers so two runs load the same data. */
function random(seed: number) {
  let state = seed >>> 0;
  return () => {
    state = (state * 1664525 + 1013904223) >>> 0;
    return state / 2 ** 32;
  };
}

function ratingsFor(kind: ItemKind, r: () => number): Record<string, unknown> {
  const kv = Math.round(10 + r() * 90);
  switch (kind) {
    case 'multiplier':
      return {
        stages: 4 + Math.floor(r() * 7),
        stageCapacitanceNf: 1,
        driveFrequencyHz: 20000,
        maxInputKvPeak: 8,
        maxOutputKv: kv,
        maxMa: 1,
        polarity: 'positive',
      };
    case 'hv-supply':
      return { maxKv: kv, maxMa: 2, polarity: 'negative', outputCapacitanceNf: 2, bleederMohm: 200, hasInterlockInput: r() > 0.5 };
    case 'probe':
      return { maxKv: kv, ratio: 1000, inputResistanceMohm: 1000 };
    case 'isolation-stand':
      return { withstandKv: kv };
    case 'grounding-stick':
      return { ratedKv: kv, hookResistanceMohm: 10, cableLengthM: 3 };
    case 'interlock':
      return { ratedKv: kv };
    default:
      return { maxKv: r() > 0.3 ? kv : null };
  }
}

/** Inserts items and their search terms (what createItem does for one item, for a batch). */
export async function insertSearchable(db: Db, rows: { tag: string }[]): Promise<void> {
  await db.transaction(async (trx) => {
    await trx('items').insert(rows);
    const inserted = (await trx('items')
      .whereIn(
        'tag',
        rows.map((r) => r.tag),
      )
      .select(...TERM_SOURCE_COLUMNS)) as TermSource[];
    await writeItemTerms(trx, inserted);
  });
}

export async function seedItems(db: Db, count: number): Promise<void> {
  const r = random(20261202);
  const start = Date.now();
  const sequences = new Map<string, number>();
  for (const row of await db('tag_sequences').select('code', 'last_value')) sequences.set(row.code, row.last_value);
  const today = todayIso();
  for (let done = 0; done < count;) {
    const batch = [];
    for (let i = 0; i < 1000 && done < count; i += 1, done += 1) {
      const kind = ITEM_KINDS[Math.floor(r() * ITEM_KINDS.length)]!;
      const code = KIND_TAG_CODES[kind];
      const n = (sequences.get(code) ?? 0) + 1;
      sequences.set(code, n);
      const ratings = ratingsFor(kind, r);
      const interval = DEFAULT_INSPECTION_DAYS[kind];
      const last = addDaysIso(today, -Math.floor(r() * 400));
      batch.push({
        tag: `${code}-${String(n).padStart(4, '0')}`,
        kind,
        name: `${WORDS[Math.floor(r() * WORDS.length)]} ${WORDS[Math.floor(r() * WORDS.length)]} ${kind} ${n}`,
        make: MAKES[Math.floor(r() * MAKES.length)]!,
        model: `M-${Math.floor(r() * 900 + 100)}`,
        serial: `GEN-${code}-${n}`,
        location: LOCATIONS[Math.floor(r() * LOCATIONS.length)]!,
        notes: '',
        ratings: JSON.stringify(ratings),
        rated_kv: ratedKvOf({ kind, ratings } as ItemRatings),
        inspection_interval_days: interval,
        last_inspected_on: last,
        next_inspection_due: addDaysIso(last, interval),
        status: r() > 0.97 ? 'out-of-service' : 'in-service',
        status_reason: null,
      });
    }
    await insertSearchable(db, batch);
  }
  for (const [code, last] of sequences) {
    await db.raw('INSERT INTO tag_sequences (code, last_value) VALUES (?, ?) ON DUPLICATE KEY UPDATE last_value = GREATEST(last_value, VALUES(last_value))', [
      code,
      last,
    ]);
  }
  console.log(`[seed] ${count} items in ${((Date.now() - start) / 1000).toFixed(1)} s`);
}

async function main(): Promise<void> {
  const args = new Map(process.argv.slice(2).map((a) => a.replace(/^--/, '').split('=') as [string, string]));
  const options = args.get('instance') === 'bench' ? benchInstance() : devInstance();
  await startInstance(options);
  const db = createDb(loadConfig({ ...process.env, ...dbEnv(options) }));
  try {
    await migrateLatest(db);
    const items = Number(args.get('items') ?? 0);
    if (!Number.isInteger(items) || items < 0) throw new Error('--items must be a whole number');
    if (items > 0) await seedItems(db, items);
  } finally {
    await db.destroy();
  }
}

if (require.main === module) {
  main().catch((error: unknown) => {
    console.error(error instanceof Error ? error.message : error);
    process.exit(1);
  });
}
