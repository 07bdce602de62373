import type { LabRules } from '../../shared/schemas/bookings';
import type { SessionUser } from '../../shared/schemas/session';
import type { Db, Trx } from '../db';
import { appendAudit, auditedTransaction } from './audit';
import { sharedRead } from './shared-read';

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

const labRules = sharedRead(async (db) => Object.freeze(toLabRules(await db('lab_rules').where({ id: 1 }).first())));

/** Inside a transaction, the row itself; otherwise a copy at most a few seconds old (shared-read.ts). */
export function getLabRules(db: Db | Trx): Promise<LabRules> {
  return labRules.read(db);
}

export async function updateLabRules(db: Db, actor: SessionUser, input: LabRules): Promise<LabRules> {
  const saved = await auditedTransaction(db, async (trx) => {
    const before = toLabRules(await trx('lab_rules').where({ id: 1 }).forUpdate().first());
    await trx('lab_rules').where({ id: 1 }).update({
      approval_kv: input.approvalKv,
      energy_threshold_j: input.energyThresholdJ,
      rating_margin_pct: input.ratingMarginPct,
      interlock_kv: input.interlockKv,
      safe_residual_v: input.safeResidualV,
      early_pickup_min: input.earlyPickupMin,
      overdue_grace_min: input.overdueGraceMin,
      updated_at: new Date(),
      updated_by: actor.id,
    });
    await appendAudit(trx, { actorId: actor.id, entity: 'lab-rules', entityId: 1, action: 'lab-rules.updated', before, after: input });
    return input;
  });
  labRules.forget(db);
  return saved;
}
