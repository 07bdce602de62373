import type { PersonSummary } from '../../shared/schemas/accounts';
import type { Role, SessionUser } from '../../shared/schemas/session';
import type { Db } from '../db';
import { sessionCacheOf } from '../auth/session-cache';

export interface PersonRow {
  id: number;
  email: string;
  name: string;
  role: Role;
  group_id: number | null;
  password_hash: string | null;
  active: boolean;
  last_sign_in_at: Date | null;
}

export function toSessionUser(person: Pick<PersonRow, 'id' | 'email' | 'name' | 'role'>): SessionUser {
  return { id: person.id, email: person.email, name: person.name, role: person.role };
}

export async function findPersonByEmail(db: Db, email: string): Promise<PersonRow | undefined> {
  return db<PersonRow>('people').where({ email: email.trim().toLowerCase() }).first();
}

export async function recordSignIn(db: Db, personId: number): Promise<void> {
  await db('people').where({ id: personId }).update({ last_sign_in_at: new Date() });
}

export async function listPeople(db: Db): Promise<PersonSummary[]> {
  const rows = await db('people as p')
    .leftJoin('groups as g', 'g.id', 'p.group_id')
    .leftJoin('qualifications as q', 'q.person_id', 'p.id')
    .select('p.id', 'p.email', 'p.name', 'p.role', 'p.active', 'p.last_sign_in_at', 'g.name as group_name', 'q.authorised_kv', 'q.expires_on')
    .orderBy('p.name');
  return rows.map((r) => ({
    id: r.id,
    email: r.email,
    name: r.name,
    role: r.role,
    groupName: r.group_name ?? null,
    active: Boolean(r.active),
    lastSignInAt: r.last_sign_in_at ? new Date(r.last_sign_in_at).toISOString() : null,
    qualification: r.authorised_kv === null ? null : { authorisedKv: Number(r.authorised_kv), expiresOn: String(r.expires_on) },
  }));
}

/** Ends every open session of a person at once (deactivation, role change). */
export async function endSessionsOf(db: Db, personId: number): Promise<number> {
  const ended = await db('sessions').where({ person_id: personId }).delete();
  sessionCacheOf(db).forgetPerson(personId);
  return ended;
}
