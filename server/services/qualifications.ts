import type { Qualification, QualificationInput } from '../../shared/schemas/bookings';
import type { SessionUser } from '../../shared/schemas/session';
import type { Db, Trx } from '../db';
import { ForbiddenError, NotFoundError } from '../errors';
import { appendAudit, auditedTransaction } from './audit';
import { dateColumnToIso, timestampToIso } from './dates';

export async function getQualification(db: Db | Trx, personId: number): Promise<Qualification | null> {
  const row = await db('qualifications as q')
    .leftJoin('people as p', 'p.id', 'q.recorded_by')
    .where('q.person_id', personId)
    .first('q.*', 'p.name as recorded_by_name');
  if (!row) return null;
  return {
    personId,
    authorisedKv: Number(row.authorised_kv),
    expiresOn: dateColumnToIso(row.expires_on)!,
    notes: row.notes,
    recordedByName: row.recorded_by_name ?? null,
    updatedAt: timestampToIso(row.updated_at)!,
  };
}

export async function setQualification(db: Db, actor: SessionUser, personId: number, input: QualificationInput): Promise<Qualification> {
  // A qualification decides whether a test needs an officer: nobody decides their own.
  if (personId === actor.id) throw new ForbiddenError('Nobody records or changes their own qualification; ask another officer.');
  await auditedTransaction(db, async (trx) => {
    // No lock on the person's row: the audit entry's foreign key takes a shared lock on its
    // actor's row at commit, under the audit chain's lock, so an exclusive lock here would
    // deadlock against any audited write by that person. The qualification row is the lock.
    const person = await trx('people').where({ id: personId }).first('id');
    if (!person) throw new NotFoundError(`No person with id ${personId}.`);
    const existing = await trx('qualifications').where({ person_id: personId }).forUpdate().first('person_id');
    const before = existing ? await getQualification(trx, personId) : null;
    const record = { authorised_kv: input.authorisedKv, expires_on: input.expiresOn, notes: input.notes ?? '', recorded_by: actor.id, updated_at: new Date() };
    await trx('qualifications')
      .insert({ person_id: personId, ...record })
      .onConflict('person_id')
      .merge(record);
    await appendAudit(trx, {
      actorId: actor.id,
      entity: 'qualification',
      entityId: personId,
      action: 'qualification.set',
      before: before ? { authorisedKv: before.authorisedKv, expiresOn: before.expiresOn } : null,
      after: { authorisedKv: input.authorisedKv, expiresOn: input.expiresOn, notes: input.notes ?? '' },
    });
  });
  return (await getQualification(db, personId))!;
}
