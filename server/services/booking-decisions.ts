// What officers and members decided about a booking (its latest approval and checklist runs),
// read as JSON columns of the booking's own query.
import type { ApprovalBasis } from '../../shared/rules/approval-basis';
import type { ApprovalRecord, CompletedChecklist } from '../../shared/rules/release';
import type { ChecklistAnswerRecord } from '../../shared/schemas/bookings';
import type { Trx } from '../db';
import { json } from './booking-rows';

/** A completed checklist run as the gate reads it. */
export interface StoredRun extends CompletedChecklist {
  withinLimits: boolean;
  completedAt: string;
}

/** What officers and members decided about a booking: its latest approval and checklist runs. */
export interface Decisions {
  approval: (ApprovalRecord & { officerName: string; conditions: string | null; reason: string | null; decidedAt: string }) | null;
  /** The latest run of each phase for the booking's current plan. */
  runs: { pre: StoredRun | null; return: StoredRun | null };
}

// The latest approval and the current plan's latest checklist run of each phase, as JSON columns
// of a query on `bookings AS b`: each is one key lookup, and the booking's answer needs no query
// of its own for them. JSON_EXTRACT(…, '$') embeds a stored JSON document as JSON rather than as
// a string. Times go out as epoch milliseconds (UNIX_TIMESTAMP of a TIMESTAMP ignores the
// session's time zone).
const runSql = (phase: 'pre' | 'return') => `
  (SELECT JSON_OBJECT('planVersion', r.plan_version, 'withinLimits', r.within_limits,
      'completedAtMs', UNIX_TIMESTAMP(r.completed_at) * 1000, 'answers', JSON_EXTRACT(r.answers, '$'))
    FROM checklist_runs AS r WHERE r.booking_id = b.id AND r.phase = '${phase}' AND r.plan_version = b.plan_version
    ORDER BY r.id DESC LIMIT 1) AS ${phase}_run_json`;
export const DECISIONS_SQL = `
  (SELECT JSON_OBJECT('decision', a.decision, 'officerName', o.name, 'conditions', a.conditions, 'reason', a.reason,
      'decidedAtMs', UNIX_TIMESTAMP(a.decided_at) * 1000, 'voided', a.voided_at IS NOT NULL, 'planVersion', a.plan_version,
      'basis', JSON_EXTRACT(a.basis, '$'))
    FROM approvals AS a JOIN people AS o ON o.id = a.officer_id WHERE a.booking_id = b.id ORDER BY a.id DESC LIMIT 1) AS approval_json,
  ${runSql('pre')},
  ${runSql('return')}`;

export interface DecisionColumns {
  approval_json: unknown;
  pre_run_json: unknown;
  return_run_json: unknown;
}

export function decisionsOf(row: DecisionColumns): Decisions {
  type Stored = {
    decision: 'approve' | 'refuse';
    officerName: string;
    conditions: string | null;
    reason: string | null;
    decidedAtMs: number;
    voided: number | boolean;
    planVersion: number;
    basis: ApprovalBasis | null;
  };
  type Run = { planVersion: number; withinLimits: number | boolean; completedAtMs: number; answers: ChecklistAnswerRecord[] | string };
  const a = row.approval_json === null ? null : json<Stored>(row.approval_json);
  const run = (value: unknown): StoredRun | null => {
    if (value === null || value === undefined) return null;
    const r = json<Run>(value);
    return {
      planVersion: r.planVersion,
      withinLimits: Boolean(r.withinLimits),
      completedAt: new Date(Number(r.completedAtMs)).toISOString(),
      answers: json<ChecklistAnswerRecord[]>(r.answers),
    };
  };
  return {
    approval: a && {
      decision: a.decision,
      planVersion: a.planVersion,
      voided: Boolean(a.voided),
      basis: a.basis === null ? null : json<ApprovalBasis>(a.basis),
      officerName: a.officerName,
      conditions: a.conditions,
      reason: a.reason,
      decidedAt: new Date(Number(a.decidedAtMs)).toISOString(),
    },
    runs: { pre: run(row.pre_run_json), return: run(row.return_run_json) },
  };
}

/** The decisions about a booking locked in this transaction: one query. */
export async function decisionsInTransaction(trx: Trx, id: number): Promise<Decisions> {
  const columns = (await trx('bookings as b').where('b.id', id).first(trx.raw(DECISIONS_SQL))) as DecisionColumns;
  return decisionsOf(columns);
}

/** An approval counts for the view while it is an approval of the current plan version that nothing voided. */
export const approvalHolds = (approval: Decisions['approval'], planVersion: number) =>
  Boolean(approval && approval.decision === 'approve' && !approval.voided && approval.planVersion === planVersion);
