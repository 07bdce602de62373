import { ERROR_CODES } from '../../shared/errors';
import type { LabRules } from '../../shared/schemas/bookings';
import { rulesForPerson, type LabRulesState } from '../../shared/rules/lab-rules';
import type { SessionUser } from '../../shared/schemas/session';
import type { Db, Trx } from '../db';
import { ConflictError, ForbiddenError } from '../errors';
import { appendAudit, auditedTransaction } from './audit';
import { sharedRead } from './shared-read';

const json = <T>(value: unknown): T => (typeof value === 'string' ? JSON.parse(value) : value) as T;

function toLabRules(row: Record<string, unknown>): LabRules {
  return {
    approvalKv: Number(row.approval_kv),
    energyThresholdJ: Number(row.energy_threshold_j),
    ratingMarginPct: Number(row.rating_margin_pct),
    interlockKv: Number(row.interlock_kv),
    safeResidualV: Number(row.safe_residual_v),
    earlyPickupMin: Number(row.early_pickup_min),
    overdueGraceMin: Number(row.overdue_grace_min),
  };
}

function toState(row: Record<string, unknown>): LabRulesState {
  const rules = toLabRules(row);
  return {
    rules,
    confirmed: row.confirmed_rules ? json<LabRules>(row.confirmed_rules) : rules,
    pendingEditors: row.pending_editors ? json<number[]>(row.pending_editors) : [],
  };
}

const labRules = sharedRead(async (db) => Object.freeze(toState(await db('lab_rules').where({ id: 1 }).first())));

/** Inside a transaction, the row itself; otherwise a copy at most a few seconds old (shared-read.ts). */
export async function getLabRules(db: Db | Trx): Promise<LabRules> {
  return (await labRules.read(db)).rules;
}

export function getLabRulesState(db: Db | Trx): Promise<LabRulesState> {
  return labRules.read(db);
}

/** The rules that apply to a person's bookings (shared/rules/lab-rules.ts). */
export async function labRulesFor(db: Db | Trx, personId: number): Promise<LabRules> {
  return rulesForPerson(await labRules.read(db), personId);
}

export async function updateLabRules(db: Db, actor: SessionUser, input: LabRules): Promise<LabRules> {
  const saved = await auditedTransaction(db, async (trx) => {
    const row = await trx('lab_rules').where({ id: 1 }).forUpdate().first();
    const before = toState(row);
    const pendingEditors = before.pendingEditors.includes(actor.id) ? before.pendingEditors : [...before.pendingEditors, actor.id];
    await trx('lab_rules')
      .where({ id: 1 })
      .update({
        approval_kv: input.approvalKv,
        energy_threshold_j: input.energyThresholdJ,
        rating_margin_pct: input.ratingMarginPct,
        interlock_kv: input.interlockKv,
        safe_residual_v: input.safeResidualV,
        early_pickup_min: input.earlyPickupMin,
        overdue_grace_min: input.overdueGraceMin,
        confirmed_rules: JSON.stringify(before.confirmed),
        pending_editors: JSON.stringify(pendingEditors),
        updated_at: new Date(),
        updated_by: actor.id,
      });
    await appendAudit(trx, {
      actorId: actor.id,
      entity: 'lab-rules',
      entityId: 1,
      action: 'lab-rules.updated',
      before: before.rules,
      after: { ...input, pendingEditors },
    });
    return input;
  });
  labRules.forget(db);
  return saved;
}

/** Another officer stands behind the current rules: from now on they apply to everyone. */
export async function confirmLabRules(db: Db, actor: SessionUser): Promise<LabRulesState> {
  const state = await auditedTransaction(db, async (trx) => {
    const before = toState(await trx('lab_rules').where({ id: 1 }).forUpdate().first());
    if (before.pendingEditors.length === 0) throw new ConflictError('The lab rules have no change waiting for confirmation.', ERROR_CODES.nothingToConfirm);
    if (before.pendingEditors.includes(actor.id)) throw new ForbiddenError('You changed these rules; another officer must confirm them.');
    await trx('lab_rules')
      .where({ id: 1 })
      .update({ confirmed_rules: JSON.stringify(before.rules), pending_editors: '[]', updated_at: new Date() });
    await appendAudit(trx, {
      actorId: actor.id,
      entity: 'lab-rules',
      entityId: 1,
      action: 'lab-rules.confirmed',
      before: { confirmed: before.confirmed, pendingEditors: before.pendingEditors },
      after: before.rules,
    });
    return { rules: before.rules, confirmed: before.rules, pendingEditors: [] };
  });
  labRules.forget(db);
  return state;
}
