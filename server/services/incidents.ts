// Incidents and near misses: reported by anyone signed in, reviewed by a safety officer
// (open → under review → closed, closing only with a cause and corrective actions). Items a
// report takes out of service are tagged out by the item-status rules (item-rows.ts) in the
// report's own transaction; officers (and, for a shock or burn, lab managers) are e-mailed once
// through the outbox.
import {
  type CorrectiveAction,
  type Incident,
  type IncidentCreateInput,
  type IncidentKind,
  type IncidentListQuery,
  type IncidentSeverity,
  type IncidentStatus,
  type IncidentSummary,
  type IncidentUpdateInput,
} from '../../shared/schemas/incidents';
import type { SessionUser } from '../../shared/schemas/session';
import type { Db, Trx } from '../db';
import { ConflictError, ForbiddenError, NotFoundError, ValidationError } from '../errors';
import { enqueueMail } from '../mail/enqueue';
import { incidentReported } from '../mail/incident-messages';
import { appendAudit, auditedTransaction } from './audit';
import { canSeeBooking, STAFF } from './booking-access';
import { dateColumnToIso, timestampToIso, todayIso } from './dates';
import { lockItem, tagOutInTransaction } from './item-rows';

export interface IncidentMail {
  publicUrl: string;
}

interface IncidentRow {
  id: number;
  kind: IncidentKind;
  severity: IncidentSeverity;
  status: IncidentStatus;
  occurred_at: Date;
  location: string;
  description: string;
  tag_out: number | boolean;
  booking_id: number | null;
  reported_by: number;
  reporter_name: string;
  cause: string | null;
  closed_at: Date | null;
  created_at: Date;
  updated_at: Date;
}

/** Reports may be a little ahead of the server's clock (a phone's clock), never hours ahead. */
const FUTURE_SLACK_MS = 10 * 60_000;

const isStaff = (actor: SessionUser) => STAFF.includes(actor.role);

/**
 * Limits a query on `incidents as i` to what the person may see: staff see every report; a member
 * their own, those on their bookings or on gear they have booked, and those naming them as the
 * owner of a corrective action.
 */
function visibleTo<Q extends { where: (...args: never[]) => Q }>(db: Db | Trx, query: Q, actor: SessionUser): Q {
  if (isStaff(actor)) return query;
  const me = actor.id;
  const raw = db.raw(
    `(i.reported_by = ?
      OR EXISTS (SELECT 1 FROM bookings b WHERE b.id = i.booking_id AND b.person_id = ?)
      OR EXISTS (SELECT 1 FROM incident_items ii JOIN booking_items bi ON bi.item_id = ii.item_id JOIN bookings b ON b.id = bi.booking_id
                 WHERE ii.incident_id = i.id AND b.person_id = ?)
      OR EXISTS (SELECT 1 FROM incident_actions a WHERE a.incident_id = i.id AND a.owner_id = ?))`,
    [me, me, me, me],
  );
  return (query as unknown as { whereRaw: (sql: unknown) => Q }).whereRaw(raw);
}

function baseQuery(db: Db | Trx) {
  return db('incidents as i').join('people as p', 'p.id', 'i.reported_by').select('i.*', 'p.name as reporter_name');
}

async function itemsOf(db: Db | Trx, incidentIds: number[]): Promise<Map<number, Incident['items']>> {
  const map = new Map<number, Incident['items']>();
  if (incidentIds.length === 0) return map;
  const rows = await db('incident_items as ii')
    .join('items as it', 'it.id', 'ii.item_id')
    .whereIn('ii.incident_id', incidentIds)
    .orderBy('it.tag')
    .select('ii.incident_id', 'it.id', 'it.tag', 'it.name', 'it.status');
  for (const r of rows) {
    const list = map.get(r.incident_id) ?? [];
    list.push({ id: r.id, tag: r.tag, name: r.name, status: r.status });
    map.set(r.incident_id, list);
  }
  return map;
}

function toActions(rows: Record<string, unknown>[], today = todayIso()): CorrectiveAction[] {
  return rows.map((r) => {
    const dueOn = dateColumnToIso(r.due_on as string)!;
    const doneAt = timestampToIso(r.done_at as Date | null);
    return {
      id: Number(r.id),
      incidentId: Number(r.incident_id),
      action: String(r.action),
      ownerId: Number(r.owner_id),
      ownerName: String(r.owner_name),
      dueOn,
      doneAt,
      pastDue: doneAt === null && dueOn < today,
    };
  });
}

function actionsQuery(db: Db | Trx) {
  return db('incident_actions as a').join('people as o', 'o.id', 'a.owner_id').select('a.*', 'o.name as owner_name');
}

function toSummary(row: IncidentRow, items: Incident['items'], openActions: number): IncidentSummary {
  return {
    id: row.id,
    kind: row.kind,
    severity: row.severity,
    status: row.status,
    occurredAt: timestampToIso(row.occurred_at)!,
    location: row.location,
    description: row.description,
    tagOut: Boolean(row.tag_out),
    bookingId: row.booking_id,
    reportedBy: { id: row.reported_by, name: row.reporter_name },
    items,
    closedAt: timestampToIso(row.closed_at),
    createdAt: timestampToIso(row.created_at)!,
    updatedAt: timestampToIso(row.updated_at)!,
    openActions,
  };
}

export async function listIncidents(db: Db, actor: SessionUser, filter: IncidentListQuery): Promise<IncidentSummary[]> {
  let query = baseQuery(db);
  if (filter.status) query = query.where('i.status', filter.status);
  if (filter.kind) query = query.where('i.kind', filter.kind);
  if (filter.bookingId) query = query.where('i.booking_id', filter.bookingId);
  if (filter.itemId)
    query = query.whereExists(db('incident_items as f').whereRaw('f.incident_id = i.id').andWhere('f.item_id', filter.itemId).select(db.raw('1')));
  query = visibleTo(db, query, actor);
  const rows = (await query.orderBy('i.id', 'desc').limit(500)) as IncidentRow[];
  const ids = rows.map((r) => r.id);
  const [items, open] = await Promise.all([
    itemsOf(db, ids),
    ids.length === 0
      ? []
      : db('incident_actions').whereIn('incident_id', ids).whereNull('done_at').groupBy('incident_id').select('incident_id', db.raw('COUNT(*) AS n')),
  ]);
  const openBy = new Map((open as { incident_id: number; n: number }[]).map((r) => [r.incident_id, Number(r.n)]));
  return rows.map((r) => toSummary(r, items.get(r.id) ?? [], openBy.get(r.id) ?? 0));
}

export async function getIncident(db: Db | Trx, actor: SessionUser, id: number): Promise<Incident> {
  const row = (await visibleTo(db, baseQuery(db).where('i.id', id), actor).first()) as IncidentRow | undefined;
  if (!row) throw new NotFoundError(`No incident with id ${id}.`);
  const [items, actions, photos] = await Promise.all([
    itemsOf(db, [id]),
    actionsQuery(db).where('a.incident_id', id).orderBy('a.id'),
    db('item_files').where({ incident_id: id }).orderBy('id').select('id', 'file_name', 'content_type', 'size_bytes', 'created_at'),
  ]);
  const { openActions: _open, ...summary } = toSummary(row, items.get(id) ?? [], 0);
  return {
    ...summary,
    cause: row.cause,
    correctiveActions: toActions(actions),
    photos: photos.map((p: Record<string, unknown>) => ({
      id: Number(p.id),
      fileName: String(p.file_name),
      contentType: String(p.content_type),
      sizeBytes: Number(p.size_bytes),
      uploadedAt: timestampToIso(p.created_at as Date)!,
    })),
  };
}

/** Whether the person may see the incident (for its photos). */
export async function canSeeIncident(db: Db, actor: SessionUser, id: number): Promise<boolean> {
  return Boolean(await visibleTo(db, db('incidents as i').where('i.id', id).select('i.id'), actor).first());
}

async function notifyOfIncident(trx: Trx, facts: Parameters<typeof incidentReported>[1], reporterId: number, mail: IncidentMail): Promise<void> {
  // A shock or a burn hurt someone: the lab manager hears of it as well as the officers.
  const roles = facts.kind === 'shock' || facts.kind === 'burn' ? ['officer', 'manager'] : ['officer'];
  const people = await trx('people').whereIn('role', roles).andWhere({ active: true }).whereNot('id', reporterId).orderBy('id').select('id', 'email');
  const content = incidentReported(mail.publicUrl, facts);
  for (const person of people) {
    await enqueueMail(trx, { kind: 'incident-reported', to: person.email, dedupeKey: `incident-reported:${facts.id}:${person.id}`, ...content });
  }
}

export interface RecordIncidentOptions {
  /** The audit action of each tag-out (the return path keeps its own). */
  tagOutAction?: string;
  /** Why each item was tagged out, as its status reason. */
  tagOutReason?: string;
}

/**
 * Writes the report, its items, the tag-outs and the mail inside the caller's transaction. The
 * caller holds the booking's lock (if any); items are locked here in id order, after it.
 */
export async function recordIncidentInTransaction(
  trx: Trx,
  actor: SessionUser,
  input: IncidentCreateInput,
  mail: IncidentMail,
  options: RecordIncidentOptions = {},
): Promise<number> {
  const itemIds = [...new Set(input.itemIds)].sort((a, b) => a - b);
  const items = [];
  for (const itemId of itemIds) {
    const item = await trx('items').where({ id: itemId }).first('id', 'tag', 'status');
    if (!item) throw new ValidationError(`No item with id ${itemId}.`, { itemIds: [`No item with id ${itemId}`] });
    items.push(item as { id: number; tag: string; status: string });
  }
  const [id] = (await trx('incidents').insert({
    kind: input.kind,
    severity: input.severity,
    status: 'open',
    occurred_at: new Date(input.occurredAt),
    location: input.location,
    description: input.description,
    tag_out: input.tagOut,
    booking_id: input.bookingId ?? null,
    reported_by: actor.id,
  })) as [number];
  if (itemIds.length > 0) await trx('incident_items').insert(itemIds.map((itemId) => ({ incident_id: id, item_id: itemId })));

  const taggedOut: string[] = [];
  if (input.tagOut) {
    for (const item of items) {
      const locked = await lockItem(trx, item.id);
      if (locked.status === 'retired') continue;
      await tagOutInTransaction(
        trx,
        actor.id,
        item.id,
        options.tagOutReason ?? `Incident #${id} (${input.kind}): ${input.description}`,
        options.tagOutAction ?? 'item.tagged-out-for-incident',
      );
      taggedOut.push(item.tag);
    }
  }
  await appendAudit(trx, {
    actorId: actor.id,
    entity: 'incident',
    entityId: id,
    action: 'incident.reported',
    after: {
      kind: input.kind,
      severity: input.severity,
      occurredAt: input.occurredAt,
      location: input.location,
      description: input.description,
      itemIds,
      bookingId: input.bookingId ?? null,
      tagOut: input.tagOut,
      taggedOut,
    },
  });
  await notifyOfIncident(
    trx,
    {
      id,
      kind: input.kind,
      severity: input.severity,
      occurredAt: input.occurredAt,
      location: input.location,
      description: input.description,
      reporterName: actor.name,
      itemTags: items.map((i) => i.tag),
      taggedOutTags: taggedOut,
      bookingId: input.bookingId ?? null,
    },
    actor.id,
    mail,
  );
  return id;
}

export async function reportIncident(db: Db, actor: SessionUser, input: IncidentCreateInput, mail: IncidentMail, now = new Date()): Promise<Incident> {
  if (new Date(input.occurredAt).getTime() > now.getTime() + FUTURE_SLACK_MS) {
    throw new ValidationError('An incident cannot have happened in the future.', { occurredAt: ['Pick the time it happened, now or earlier'] });
  }
  const id = await auditedTransaction(db, async (trx) => {
    if (input.bookingId) {
      // The booking's row first (the lock order: bookings, then items).
      const booking = await trx('bookings').where({ id: input.bookingId }).forUpdate().first('id', 'person_id');
      if (!booking || !canSeeBooking(actor, booking))
        throw new ValidationError(`No booking of yours with id ${input.bookingId}.`, { bookingId: ['Pick one of your bookings, or none'] });
    }
    return recordIncidentInTransaction(trx, actor, input, mail);
  });
  return getIncident(db, actor, id);
}

/** The moves an officer may make; a closed report stays closed (a new finding is a new report). */
const NEXT: Record<IncidentStatus, IncidentStatus[]> = {
  open: ['open', 'under-review', 'closed'],
  'under-review': ['open', 'under-review', 'closed'],
  closed: ['closed'],
};

export async function reviewIncident(db: Db, actor: SessionUser, id: number, input: IncidentUpdateInput): Promise<Incident> {
  if (actor.role !== 'officer') throw new ForbiddenError('Only safety officers review incidents.');
  await auditedTransaction(db, async (trx) => {
    const row = await trx('incidents').where({ id }).forUpdate().first();
    if (!row) throw new NotFoundError(`No incident with id ${id}.`);
    if (row.status === 'closed') throw new ConflictError('This incident is closed; report a new one for anything found since.', 'INCIDENT_CLOSED');
    if (!NEXT[row.status as IncidentStatus].includes(input.status))
      throw new ConflictError(`An incident that is ${row.status} cannot become ${input.status}.`, 'INCIDENT_STATUS');

    const cause = input.cause !== undefined ? input.cause || null : (row.cause as string | null);
    const existing = await trx('incident_actions').where({ incident_id: id }).count({ n: '*' }).first();
    const actionCount = input.correctiveActions !== undefined ? input.correctiveActions.length : Number(existing?.n ?? 0);
    if (input.status === 'closed') {
      const fieldErrors: Record<string, string[]> = {};
      if (!cause) fieldErrors.cause = ['Say what caused it before closing'];
      if (actionCount === 0) fieldErrors.correctiveActions = ['Add at least one corrective action (what, who, by when) before closing'];
      if (Object.keys(fieldErrors).length > 0) throw new ValidationError('Closing an incident needs a cause and at least one corrective action.', fieldErrors);
    }
    if (input.correctiveActions !== undefined) {
      const ownerIds = [...new Set(input.correctiveActions.map((a) => a.ownerId))];
      const owners = ownerIds.length === 0 ? [] : await trx('people').whereIn('id', ownerIds).andWhere({ active: true }).pluck('id');
      const missing = ownerIds.filter((o) => !owners.map(Number).includes(o));
      if (missing.length > 0)
        throw new ValidationError(`No active person with id ${missing.join(', ')}.`, {
          correctiveActions: ['Each action needs an active person as its owner'],
        });
      // The list is replaced as a whole; actions already done keep their done time if kept alike.
      const before = await trx('incident_actions').where({ incident_id: id }).select('action', 'owner_id', 'due_on', 'done_at');
      await trx('incident_actions').where({ incident_id: id }).delete();
      for (const a of input.correctiveActions) {
        const kept = before.find((b) => b.action === a.action && b.owner_id === a.ownerId && dateColumnToIso(b.due_on) === a.dueOn);
        await trx('incident_actions').insert({ incident_id: id, action: a.action, owner_id: a.ownerId, due_on: a.dueOn, done_at: kept?.done_at ?? null });
      }
    }
    const now = new Date();
    await trx('incidents')
      .where({ id })
      .update({ status: input.status, cause, updated_at: now, ...(input.status === 'closed' ? { closed_at: now, closed_by: actor.id } : {}) });
    const action =
      input.status === 'closed'
        ? 'incident.closed'
        : input.status === 'under-review' && row.status !== 'under-review'
          ? 'incident.under-review'
          : input.status === 'open' && row.status !== 'open'
            ? 'incident.reopened'
            : 'incident.updated';
    await appendAudit(trx, {
      actorId: actor.id,
      entity: 'incident',
      entityId: id,
      action,
      before: { status: row.status, cause: row.cause },
      after: { status: input.status, cause, correctiveActions: input.correctiveActions ?? null },
    });
  });
  return getIncident(db, actor, id);
}

/** The owner of an action or an officer marks it done (or not done after all). */
export async function setActionDone(db: Db, actor: SessionUser, actionId: number, done: boolean): Promise<Incident> {
  const incidentId = await auditedTransaction(db, async (trx) => {
    const action = await trx('incident_actions').where({ id: actionId }).forUpdate().first();
    if (!action) throw new NotFoundError(`No corrective action with id ${actionId}.`);
    if (action.owner_id !== actor.id && actor.role !== 'officer') throw new ForbiddenError('Only the action’s owner or a safety officer can mark it done.');
    await trx('incident_actions')
      .where({ id: actionId })
      .update({ done_at: done ? new Date() : null });
    await appendAudit(trx, {
      actorId: actor.id,
      entity: 'incident',
      entityId: action.incident_id,
      action: done ? 'incident.action-done' : 'incident.action-reopened',
      before: { done: action.done_at !== null },
      after: { actionId, action: action.action, done },
    });
    return Number(action.incident_id);
  });
  return getIncident(db, actor, incidentId);
}

/**
 * Corrective actions not done by their due date: a person's own, or (for an officer) everyone's.
 * Today shows them; the inspection digest lists all of them.
 */
export async function pastDueActions(db: Db, actor: SessionUser | null, today = todayIso()): Promise<CorrectiveAction[]> {
  let query = actionsQuery(db).whereNull('a.done_at').andWhere('a.due_on', '<', today);
  if (actor && actor.role !== 'officer') query = query.where('a.owner_id', actor.id);
  return toActions(await query.orderBy([{ column: 'a.due_on' }, { column: 'a.id' }]).limit(200), today);
}
