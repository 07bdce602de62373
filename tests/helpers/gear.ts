// Test gear written straight into the database (the registry API has its own tests).
import type { Db } from '../../server/db';
import { addDaysIso, todayIso } from '../../server/services/dates';
import { TERM_SOURCE_COLUMNS, writeItemTerms } from '../../server/services/item-terms';
import { ratedKvOf, type ItemKind, type ItemRatings } from '../../shared/schemas/items';
import { itemBody, uniqueWord } from './test-app';

let serial = 0;

export async function insertItem(
  db: Db,
  kind: ItemKind,
  options: { ratings?: Record<string, unknown>; status?: 'in-service' | 'out-of-service' | 'retired'; nextDue?: string | null } = {},
): Promise<{ id: number; tag: string }> {
  serial += 1;
  const body = itemBody(kind, uniqueWord());
  const ratings = options.ratings ?? (body.ratings as Record<string, unknown>);
  const tag = `T${process.pid.toString(36).toUpperCase()}-${Date.now().toString(36).toUpperCase()}${serial}`.slice(0, 30);
  const nextDue = options.nextDue === undefined ? addDaysIso(todayIso(), 120) : options.nextDue;
  const record = {
    tag,
    kind,
    name: String(body.name),
    location: 'Test bay',
    notes: '',
    ratings: JSON.stringify(ratings),
    rated_kv: ratedKvOf({ kind, ratings } as ItemRatings),
    inspection_interval_days: 180,
    last_inspected_on: nextDue ? addDaysIso(nextDue, -180) : null,
    next_inspection_due: nextDue,
    status: options.status ?? 'in-service',
    status_reason: options.status === 'out-of-service' ? 'Test: tagged out' : null,
  };
  const [id] = (await db('items').insert(record)) as [number];
  // Searchable like gear made through the API.
  await writeItemTerms(db, { id, make: '', model: '', serial: '', ...record });
  return { id, tag };
}

/** Renames test gear in place and rewrites its search words, as an edit through the API would. */
export async function renameItem(db: Db, id: number, name: string): Promise<void> {
  await db('items').where({ id }).update({ name });
  await writeItemTerms(
    db,
    await db('items')
      .where({ id })
      .first(...TERM_SOURCE_COLUMNS),
  );
}

/**
 * A complete 30 kV kit: supply with bleeder, grounding stick, stand, interlock and probe. The
 * supply is negative-only unless told otherwise (the release gate checks it can give the plan's polarity).
 */
export async function insertKit(db: Db, options: { supplyPolarity?: 'positive' | 'negative' | 'reversible' } = {}) {
  const supply = await insertItem(db, 'hv-supply', {
    ratings: { maxKv: 30, maxMa: 2, polarity: options.supplyPolarity ?? 'negative', outputCapacitanceNf: 5, bleederMohm: 300, hasInterlockInput: true },
  });
  const stick = await insertItem(db, 'grounding-stick', { ratings: { ratedKv: 100, hookResistanceMohm: 10, cableLengthM: 3 } });
  const stand = await insertItem(db, 'isolation-stand', { ratings: { withstandKv: 100 } });
  const interlock = await insertItem(db, 'interlock', { ratings: { ratedKv: 60 } });
  const probe = await insertItem(db, 'probe', { ratings: { maxKv: 40, ratio: 1000, inputResistanceMohm: 1000 } });
  return { supply, stick, stand, interlock, probe, all: [supply, stick, stand, interlock, probe] };
}

export async function qualify(db: Db, personId: number, authorisedKv: number, expiresOn = addDaysIso(todayIso(), 365)): Promise<void> {
  await db('qualifications').insert({ person_id: personId, authorised_kv: authorisedKv, expires_on: expiresOn, notes: '' }).onConflict('person_id').merge();
}

export function windowFromNow(startMin = 0, hours = 2) {
  const start = new Date(Date.now() + startMin * 60_000);
  return { startsAt: start.toISOString(), endsAt: new Date(start.getTime() + hours * 3600_000).toISOString() };
}

export function plan(plannedKv: number, extra: Partial<{ maxCurrentMa: number; peoplePresent: number; polarity: string }> = {}) {
  return { plannedKv, polarity: 'negative', maxCurrentMa: 1, peoplePresent: 2, ...extra };
}
