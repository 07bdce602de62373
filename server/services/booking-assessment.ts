// The setup assessment of a booking's plan and gear (shared/rules/assessment.ts decides; this
// gathers the rows it reads), the approval basis an officer's decision records, and the
// checklist lines that apply to a booking.
import { approvalBasisOf, type ApprovalBasis } from '../../shared/rules/approval-basis';
import { assessSetup } from '../../shared/rules/assessment';
import type { AssessedItem, Assessment } from '../../shared/schemas/assessment';
import type { BookingStatus, LabRules, TestPlan } from '../../shared/schemas/bookings';
import type { ItemKind } from '../../shared/schemas/items';
import type { Db, Trx } from '../db';
import { ValidationError } from '../errors';
import { json, planOf, type BookingRow } from './booking-rows';
import { applicableEntries, type TemplateRow } from './checklists';
import { todayIso } from './dates';
import { inspectionStateOf, type ItemRow } from './item-rows';
import { labRulesFor } from './lab-rules';
import { getQualification } from './qualifications';

function toAssessedItem(row: ItemRow): AssessedItem {
  return {
    id: row.id,
    tag: row.tag,
    name: row.name,
    kind: row.kind,
    ratedKv: row.rated_kv === null ? null : Number(row.rated_kv),
    ratings: json<Record<string, unknown>>(row.ratings),
    status: row.status,
    inspectionState: inspectionStateOf(row.next_inspection_due),
  };
}

export async function loadItems(db: Db | Trx, itemIds: number[]): Promise<ItemRow[]> {
  const rows = (await db<ItemRow>('items').whereIn('id', itemIds).orderBy('id')) as ItemRow[];
  const missing = itemIds.filter((id) => !rows.some((r) => r.id === id));
  if (missing.length > 0) throw new ValidationError(`No item with id ${missing.join(', ')}.`, { itemIds: [`Unknown item ${missing.join(', ')}`] });
  return rows;
}

/** The assessment of a plan with these items for this person, under the lab rules that apply to them. */
export async function assess(db: Db | Trx, items: ItemRow[], plan: TestPlan, personId: number, rules?: LabRules): Promise<Assessment> {
  const [labRules, qualification] = await Promise.all([rules ?? labRulesFor(db, personId), getQualification(db, personId)]);
  return assessSetup({ items: items.map(toAssessedItem), plan, rules: labRules, qualification, today: todayIso() });
}

export async function assessPlan(db: Db, itemIds: number[], plan: TestPlan, personId: number): Promise<Assessment> {
  return assess(db, await loadItems(db, itemIds), plan, personId);
}

/** The booking as an approval records it, from its row (or a change to it) and its items now. */
export function basisOf(
  booking: { plan: TestPlan; startsAt: Date; endsAt: Date; location: string; purpose: string },
  items: ItemRow[],
  assessment: Assessment,
): ApprovalBasis {
  return approvalBasisOf(
    {
      plan: booking.plan,
      startsAt: booking.startsAt.toISOString(),
      endsAt: booking.endsAt.toISOString(),
      location: booking.location,
      purpose: booking.purpose,
    },
    items.map(toAssessedItem),
    assessment,
  );
}

export const rowBasisInput = (row: BookingRow) => ({
  plan: planOf(row),
  startsAt: new Date(row.starts_at),
  endsAt: new Date(row.ends_at),
  location: row.location,
  purpose: row.purpose,
});

/** A plan that needs an officer waits for one; any other is simply requested. */
export function statusFor(assessment: Assessment): BookingStatus {
  return assessment.approvalRequired ? 'awaiting-approval' : 'requested';
}

/** The lines of a phase that apply to a booking now, from its plan and the kinds of its items. */
export function entriesFor(templates: readonly TemplateRow[], phase: 'pre' | 'return', row: BookingRow, items: readonly { kind: ItemKind }[], rules: LabRules) {
  return applicableEntries(templates, phase, Number(row.planned_kv), [...new Set(items.map((i) => i.kind))], rules);
}
