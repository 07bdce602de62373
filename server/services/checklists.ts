// Checklist templates and the answers to them. A template line applies to a booking when its
// conditions hold (planned kV at or above a value, an item of a kind in the set).
import type { ChecklistAnswerRecord, ChecklistEntry, ChecklistSubmitInput, ChecklistTemplate, LabRules } from '../../shared/schemas/bookings';
import { checklistTemplateItemSchema, type ChecklistTemplateItemInput } from '../../shared/schemas/bookings';
import type { SessionUser } from '../../shared/schemas/session';
import type { Db, Trx } from '../db';
import { NotFoundError, ValidationError } from '../errors';
import { validate } from '../middleware/validate';
import { appendAudit, auditedTransaction } from './audit';
import { sharedRead } from './shared-read';

export interface TemplateRow {
  id: number;
  phase: 'pre' | 'return';
  kind: 'confirm' | 'reading' | 'photo';
  text: string;
  unit: string | null;
  min_value: number | null;
  max_value: number | null;
  max_from_rule: 'safeResidualV' | null;
  required: boolean;
  applies_from_kv: number | null;
  applies_with_kind: string | null;
  position: number;
  active: boolean;
}

const templates = sharedRead(async (db): Promise<readonly TemplateRow[]> =>
  Object.freeze(
    await db<TemplateRow>('checklist_templates')
      .where({ active: true })
      .orderBy([{ column: 'phase' }, { column: 'position' }, { column: 'id' }]),
  ),
);

/** Inside a transaction, the rows themselves; otherwise a copy at most a few seconds old (shared-read.ts). */
export function activeTemplates(db: Db | Trx): Promise<readonly TemplateRow[]> {
  return templates.read(db);
}

export function applicableEntries(
  templates: readonly TemplateRow[],
  phase: 'pre' | 'return',
  plannedKv: number,
  kinds: string[],
  rules: LabRules,
): ChecklistEntry[] {
  return templates
    .filter((t) => t.phase === phase)
    .filter((t) => t.applies_from_kv === null || plannedKv >= Number(t.applies_from_kv))
    .filter((t) => t.applies_with_kind === null || kinds.includes(t.applies_with_kind))
    .map((t) => {
      const entry: ChecklistEntry = { id: t.id, kind: t.kind, text: t.text, required: Boolean(t.required) };
      if (t.unit) entry.unit = t.unit;
      if (t.min_value !== null) entry.min = Number(t.min_value);
      const max = t.max_from_rule === 'safeResidualV' ? rules.safeResidualV : t.max_value;
      if (max !== null) entry.max = Number(max);
      return entry;
    });
}

export interface EvaluatedRun {
  complete: boolean;
  withinLimits: boolean;
  snapshot: ChecklistAnswerRecord[];
}

/**
 * Checks answers against the entries. Unknown or missing required answers are a 400, and so is a
 * photo that is not in `bookingPhotoIds` (the ids among the answers that are photos of this
 * booking): a made-up id, another booking's photo or an item's file is no evidence for this one.
 */
export function evaluateAnswers(
  entries: ChecklistEntry[],
  answers: ChecklistSubmitInput['answers'],
  bookingPhotoIds: ReadonlySet<number> = new Set(),
): EvaluatedRun {
  const byId = new Map(entries.map((e) => [e.id, e]));
  const fieldErrors: Record<string, string[]> = {};
  const seen = new Set<number>();
  for (const answer of answers) {
    if (!byId.has(answer.itemId)) (fieldErrors[`answers.${answer.itemId}`] ??= []).push('This line is not on the checklist for this booking.');
    if (seen.has(answer.itemId)) (fieldErrors[`answers.${answer.itemId}`] ??= []).push('Answered twice.');
    seen.add(answer.itemId);
  }
  const snapshot: EvaluatedRun['snapshot'] = [];
  let withinLimits = true;
  for (const entry of entries) {
    const answer = answers.find((a) => a.itemId === entry.id);
    const key = `answers.${entry.id}`;
    let inside = true;
    if (entry.kind === 'confirm') {
      if (entry.required && answer?.confirmed !== true) (fieldErrors[key] ??= []).push(`Confirm: ${entry.text}`);
    } else if (entry.kind === 'reading') {
      if (answer?.value === undefined) {
        if (entry.required) (fieldErrors[key] ??= []).push(`Enter the reading: ${entry.text}`);
      } else {
        inside = (entry.min === undefined || answer.value >= entry.min) && (entry.max === undefined || answer.value <= entry.max);
        if (!inside) withinLimits = false;
      }
    } else if (answer?.fileId === undefined) {
      if (entry.required) (fieldErrors[key] ??= []).push(`Attach the photo: ${entry.text}`);
    } else if (!bookingPhotoIds.has(answer.fileId)) {
      (fieldErrors[key] ??= []).push('That photo was not taken for this booking: attach the photo again.');
    }
    if (entry.kind !== 'photo' && answer?.fileId !== undefined) (fieldErrors[key] ??= []).push('This line takes no photo.');
    snapshot.push({
      id: entry.id,
      text: entry.text,
      kind: entry.kind,
      unit: entry.unit,
      min: entry.min,
      max: entry.max,
      required: entry.required,
      confirmed: answer?.confirmed,
      value: answer?.value,
      fileId: answer?.fileId,
      withinLimits: inside,
    });
  }
  if (Object.keys(fieldErrors).length > 0) throw new ValidationError('The checklist is not complete.', fieldErrors);
  return { complete: true, withinLimits, snapshot };
}

function toTemplate(row: TemplateRow): ChecklistTemplate {
  return {
    id: row.id,
    phase: row.phase,
    kind: row.kind,
    text: row.text,
    unit: row.unit,
    min: row.min_value === null ? null : Number(row.min_value),
    max: row.max_value === null ? null : Number(row.max_value),
    maxFromRule: row.max_from_rule,
    required: Boolean(row.required),
    appliesFromKv: row.applies_from_kv === null ? null : Number(row.applies_from_kv),
    appliesWithKind: row.applies_with_kind,
    position: row.position,
  };
}

export async function listTemplates(db: Db) {
  return (await activeTemplates(db)).map(toTemplate);
}

function toColumns(input: ReturnType<typeof checklistTemplateItemSchema.parse>) {
  return {
    phase: input.phase,
    kind: input.kind,
    text: input.text,
    unit: input.unit,
    min_value: input.min,
    max_value: input.max,
    max_from_rule: input.maxFromRule,
    required: input.required,
    applies_from_kv: input.appliesFromKv,
    applies_with_kind: input.appliesWithKind,
    position: input.position,
  };
}

export async function createTemplate(db: Db, actor: SessionUser, body: ChecklistTemplateItemInput | unknown) {
  const input = validate(checklistTemplateItemSchema, body, 'checklist line');
  const created = await auditedTransaction(db, async (trx) => {
    const [id] = (await trx('checklist_templates').insert(toColumns(input))) as [number];
    await appendAudit(trx, { actorId: actor.id, entity: 'checklist-template', entityId: id, action: 'checklist-template.created', after: input });
    return toTemplate((await trx<TemplateRow>('checklist_templates').where({ id }).first())!);
  });
  templates.forget(db);
  return created;
}

export async function replaceTemplate(db: Db, actor: SessionUser, id: number, body: unknown) {
  const input = validate(checklistTemplateItemSchema, body, 'checklist line');
  const replaced = await auditedTransaction(db, async (trx) => {
    const before = await trx<TemplateRow>('checklist_templates').where({ id, active: true }).forUpdate().first();
    if (!before) throw new NotFoundError(`No checklist line with id ${id}.`);
    await trx('checklist_templates')
      .where({ id })
      .update({ ...toColumns(input), updated_at: new Date() });
    await appendAudit(trx, {
      actorId: actor.id,
      entity: 'checklist-template',
      entityId: id,
      action: 'checklist-template.updated',
      before: toTemplate(before),
      after: input,
    });
    return toTemplate((await trx<TemplateRow>('checklist_templates').where({ id }).first())!);
  });
  templates.forget(db);
  return replaced;
}

/** Lines are retired, not deleted: past checklist runs keep pointing at them. */
export async function retireTemplate(db: Db, actor: SessionUser, id: number): Promise<void> {
  await auditedTransaction(db, async (trx) => {
    const before = await trx<TemplateRow>('checklist_templates').where({ id, active: true }).forUpdate().first();
    if (!before) throw new NotFoundError(`No checklist line with id ${id}.`);
    await trx('checklist_templates').where({ id }).update({ active: false, updated_at: new Date() });
    await appendAudit(trx, { actorId: actor.id, entity: 'checklist-template', entityId: id, action: 'checklist-template.retired', before: toTemplate(before) });
  });
  templates.forget(db);
}
