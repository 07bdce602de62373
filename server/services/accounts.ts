// Invitations, password resets and people management. Tokens are random, sent once by e-mail,
// and stored only as SHA-256 hashes; each works once and expires.
import { ERROR_CODES } from '../../shared/errors';
import { createHash, randomBytes } from 'node:crypto';
import type { InvitationInput, PersonUpdateInput } from '../../shared/schemas/accounts';
import type { SessionUser } from '../../shared/schemas/session';
import { hashPassword } from '../auth/passwords';
import { isDuplicateKey, isUnknownReference, type Db, type Trx } from '../db';
import { AppError, ConflictError, ForbiddenError, NotFoundError, ValidationError } from '../errors';
import { enqueueDeferred, enqueueMail } from '../mail/enqueue';
import { messages, type MailContent } from '../mail/messages';
import { appendAudit, auditedTransaction } from './audit';
import { cancelOpenBookingsOf, lockOpenBookingsOf } from './booking-cascades';
import type { MailContext } from './booking-rows';
import { endSessionsOf } from './people';

const INVITATION_HOURS = 7 * 24;
const RESET_MINUTES = 60;

const sha256 = (token: string) => createHash('sha256').update(token).digest('hex');

async function issueToken(trx: Trx, personId: number, purpose: 'invitation' | 'password-reset', lifetimeMs: number, options: { newPerson?: boolean } = {}) {
  const token = randomBytes(32).toString('base64url');
  const expiresAt = new Date(Date.now() + lifetimeMs);
  // A new link replaces any earlier unused one of the same purpose. A person created in this
  // transaction has none, and the UPDATE would only take a gap lock at the end of the index that
  // every concurrent invitation then needs for its INSERT: a deadlock between any two of them.
  if (!options.newPerson) await trx('person_tokens').where({ person_id: personId, purpose }).whereNull('used_at').update({ used_at: new Date() });
  await trx('person_tokens').insert({ person_id: personId, purpose, token_hash: sha256(token), expires_at: expiresAt });
  return { token, expiresAt };
}

export async function invitePerson(db: Db, actor: SessionUser, input: InvitationInput, publicUrl: string) {
  return auditedTransaction(db, async (trx) => {
    let personId: number;
    try {
      [personId] = (await trx('people').insert({
        email: input.email,
        name: input.name,
        role: input.role,
        group_id: input.groupId ?? null,
        password_hash: null,
        active: true,
      })) as [number];
    } catch (error) {
      if (isDuplicateKey(error)) throw new ConflictError('Someone with that e-mail is already in Voltcrib.', ERROR_CODES.emailTaken);
      // people.group_id references groups: the only parent an invitation names.
      if (isUnknownReference(error)) throw new ValidationError(`No group with id ${input.groupId}.`, { groupId: ['Pick one of the lab’s groups'] });
      throw error;
    }
    const { token, expiresAt } = await issueToken(trx, personId, 'invitation', INVITATION_HOURS * 3600_000, { newPerson: true });
    await enqueueMail(trx, { kind: 'invitation', to: input.email, ...messages.invitation(publicUrl, input.name, actor.name, token, expiresAt.toISOString()) });
    await appendAudit(trx, {
      actorId: actor.id,
      entity: 'person',
      entityId: personId,
      action: 'person.invited',
      after: { email: input.email, name: input.name, role: input.role },
    });
    return { id: personId, email: input.email, name: input.name, role: input.role };
  });
}

/** Uses a token once: sets the password, marks the token used, ends the person's other sessions. */
async function redeem(db: Db, token: string, purpose: 'invitation' | 'password-reset', password: string): Promise<void> {
  const hash = await hashPassword(password);
  const personId = await auditedTransaction(db, async (trx) => {
    const row = await trx('person_tokens')
      .where({ token_hash: sha256(token), purpose })
      .forUpdate()
      .first();
    if (!row || row.used_at !== null)
      throw new AppError(410, ERROR_CODES.linkUsedOrInvalid, 'This link is not valid or has already been used. Ask for a new one.');
    if (new Date(row.expires_at).getTime() < Date.now()) throw new AppError(410, ERROR_CODES.linkExpired, 'This link has expired. Ask for a new one.');
    const person = await trx('people').where({ id: row.person_id }).forUpdate().first('id', 'active');
    if (!person?.active) throw new AppError(410, ERROR_CODES.linkUsedOrInvalid, 'This link is not valid or has already been used. Ask for a new one.');
    await trx('person_tokens').where({ id: row.id }).update({ used_at: new Date() });
    await trx('people').where({ id: row.person_id }).update({ password_hash: hash, updated_at: new Date() });
    await appendAudit(trx, {
      actorId: row.person_id,
      entity: 'person',
      entityId: row.person_id,
      action: purpose === 'invitation' ? 'person.invitation-accepted' : 'person.password-reset',
    });
    return row.person_id as number;
  });
  // Whoever held a session with the old password is signed out.
  await endSessionsOf(db, personId);
}

export const acceptInvitation = (db: Db, token: string, password: string) => redeem(db, token, 'invitation', password);
export const completePasswordReset = (db: Db, token: string, password: string) => redeem(db, token, 'password-reset', password);

/** The outbox kind of a password-reset request waiting for the worker (preparePasswordReset). */
export const PASSWORD_RESET_REQUEST = 'password-reset-request';

/**
 * Always succeeds from the caller's view, and costs the same whether or not the e-mail belongs to
 * someone: one outbox row, nothing else. The worker looks the person up afterwards.
 */
export async function requestPasswordReset(db: Db, email: string, publicUrl: string): Promise<void> {
  await enqueueDeferred(db, PASSWORD_RESET_REQUEST, email.trim().toLowerCase(), { publicUrl });
}

/** Run by the outbox worker inside its transaction: the reset link's message, or null (no such account). */
export async function preparePasswordReset(trx: Trx, email: string, facts: Record<string, unknown>): Promise<{ kind: string; content: MailContent } | null> {
  const person = await trx('people').where({ email, active: true }).whereNotNull('password_hash').forUpdate().first('id', 'name', 'email');
  if (!person) return null;
  const { token, expiresAt } = await issueToken(trx, person.id, 'password-reset', RESET_MINUTES * 60_000);
  await appendAudit(trx, { actorId: null, entity: 'person', entityId: person.id, action: 'person.password-reset-requested' });
  return { kind: 'password-reset', content: messages.passwordReset(String(facts.publicUrl), person.name, token, expiresAt.toISOString()) };
}

export async function updatePerson(db: Db, actor: SessionUser, personId: number, input: PersonUpdateInput, mail: MailContext) {
  if (personId === actor.id && (input.active === false || (input.role && input.role !== actor.role))) {
    throw new ForbiddenError('You cannot deactivate yourself or change your own role; ask another manager.');
  }
  const result = await auditedTransaction(db, async (trx) => {
    if (input.active === false) await lockOpenBookingsOf(trx, personId);
    const before = await trx('people').where({ id: personId }).forUpdate().first('id', 'email', 'name', 'role', 'active', 'group_id');
    if (!before) throw new NotFoundError(`No person with id ${personId}.`);
    if (input.groupId) {
      const group = await trx('groups').where({ id: input.groupId }).first('id');
      if (!group) throw new NotFoundError(`No group with id ${input.groupId}.`);
    }
    const changes = {
      ...(input.role !== undefined ? { role: input.role } : {}),
      ...(input.active !== undefined ? { active: input.active } : {}),
      ...(input.groupId !== undefined ? { group_id: input.groupId } : {}),
      ...(input.name !== undefined ? { name: input.name } : {}),
      updated_at: new Date(),
    };
    await trx('people').where({ id: personId }).update(changes);
    // A deactivated person's bookings not yet released are cancelled in the same transaction.
    if (before.active && input.active === false) await cancelOpenBookingsOf(trx, actor, personId, mail);
    const after = await trx('people').where({ id: personId }).first('id', 'email', 'name', 'role', 'active', 'group_id');
    await appendAudit(trx, {
      actorId: actor.id,
      entity: 'person',
      entityId: personId,
      action: input.active === false ? 'person.deactivated' : input.active === true && !before.active ? 'person.reactivated' : 'person.updated',
      before: { role: before.role, active: Boolean(before.active), groupId: before.group_id, name: before.name },
      after: { role: after.role, active: Boolean(after.active), groupId: after.group_id, name: after.name },
    });
    return { before, after };
  });
  // Sessions hold a snapshot of the person: a new role or a deactivation must end them at once.
  if (result.after.role !== result.before.role || (result.before.active && !result.after.active) || result.after.name !== result.before.name) {
    await endSessionsOf(db, personId);
  }
  return {
    id: personId,
    email: result.after.email,
    name: result.after.name,
    role: result.after.role,
    active: Boolean(result.after.active),
    groupId: result.after.group_id,
  };
}
