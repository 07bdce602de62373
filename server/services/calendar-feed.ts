// A person's private calendar feed (RFC 5545, written by ical-generator): their bookings, and
// what their role adds when they ask for it (officers: the approval queue and every lab booking;
// managers: inspections coming due). The feed's address carries a long random token. The database
// keeps its SHA-256 (to find the feed) and a nonce; the token itself is the HMAC of the nonce under
// the server's secret, so the account screen can show the address again while a copy of the table
// alone opens nothing. Rotating picks a new nonce; revoking deletes the row.
import { createHash, createHmac, randomBytes } from 'node:crypto';
import ical, { ICalCalendarMethod, ICalEventStatus } from 'ical-generator';
import type { SessionUser } from '../../shared/schemas/session';
import type { CalendarFeedScopes } from '../../shared/schemas/calendar-feed';
import type { Config } from '../config';
import type { Db } from '../db';
import { ForbiddenError } from '../errors';
import { appendAudit, auditedTransaction } from './audit';
import { addDaysIso, dateColumnToIso, todayIso } from './dates';

type FeedConfig = Pick<Config, 'publicUrl' | 'session'>;

export const TOKEN_PATTERN = /^[A-Za-z0-9_-]{43}$/;

function tokenOf(config: FeedConfig, nonce: string): string {
  return createHmac('sha256', config.session.secret).update(`calendar-feed:${nonce}`).digest('base64url');
}

export function hashToken(token: string): string {
  return createHash('sha256').update(token).digest('hex');
}

const feedUrl = (config: FeedConfig, token: string) => `${config.publicUrl}/cal/${token}.ics`;

interface FeedRow {
  person_id: number;
  token_hash: string;
  nonce: string;
  approvals: number | boolean;
  lab_bookings: number | boolean;
  inspections: number | boolean;
}

const scopesOf = (row: FeedRow): CalendarFeedScopes => ({
  approvals: Boolean(row.approvals),
  labBookings: Boolean(row.lab_bookings),
  inspections: Boolean(row.inspections),
});

export async function describeFeed(db: Db, config: FeedConfig, actor: SessionUser): Promise<{ url: string | null; scopes: CalendarFeedScopes | null }> {
  const row = await db<FeedRow>('calendar_feeds').where({ person_id: actor.id }).first();
  if (!row) return { url: null, scopes: null };
  const token = tokenOf(config, row.nonce);
  // A changed server secret leaves the stored hash unreachable: the feed must be turned on again.
  if (hashToken(token) !== row.token_hash) return { url: null, scopes: null };
  return { url: feedUrl(config, token), scopes: scopesOf(row) };
}

/** Officers may add the approval queue and all lab bookings; managers the inspections due. */
function assertScopesAllowed(actor: SessionUser, scopes: CalendarFeedScopes): void {
  if ((scopes.approvals || scopes.labBookings) && actor.role !== 'officer')
    throw new ForbiddenError('Only safety officers can add the approval queue or all lab bookings to their feed.');
  if (scopes.inspections && actor.role !== 'manager') throw new ForbiddenError('Only lab managers can add inspections due to their feed.');
}

/** Turns the feed on, or gives it a new address (the old one stops working at once). */
export async function createOrRotateFeed(
  db: Db,
  config: FeedConfig,
  actor: SessionUser,
  scopes: CalendarFeedScopes,
): Promise<{ url: string; scopes: CalendarFeedScopes }> {
  assertScopesAllowed(actor, scopes);
  const nonce = randomBytes(16).toString('hex');
  const token = tokenOf(config, nonce);
  await auditedTransaction(db, async (trx) => {
    const existing = await trx('calendar_feeds').where({ person_id: actor.id }).forUpdate().first('person_id');
    const row = {
      token_hash: hashToken(token),
      nonce,
      approvals: scopes.approvals,
      lab_bookings: scopes.labBookings,
      inspections: scopes.inspections,
      created_at: new Date(),
    };
    if (existing) await trx('calendar_feeds').where({ person_id: actor.id }).update(row);
    else await trx('calendar_feeds').insert({ person_id: actor.id, ...row });
    await appendAudit(trx, {
      actorId: actor.id,
      entity: 'person',
      entityId: actor.id,
      action: existing ? 'calendar-feed.rotated' : 'calendar-feed.created',
      after: { scopes },
    });
  });
  return { url: feedUrl(config, token), scopes };
}

export async function revokeFeed(db: Db, actor: SessionUser): Promise<void> {
  await auditedTransaction(db, async (trx) => {
    const removed = await trx('calendar_feeds').where({ person_id: actor.id }).delete();
    if (removed > 0) await appendAudit(trx, { actorId: actor.id, entity: 'person', entityId: actor.id, action: 'calendar-feed.revoked' });
  });
}

const STATUS_WORDS: Record<string, string> = {
  requested: 'booked (no approval needed)',
  'awaiting-approval': 'waiting for a safety officer',
  approved: 'approved',
  refused: 'refused',
  released: 'released (gear out)',
  returned: 'returned',
  cancelled: 'cancelled',
};

function eventStatus(status: string): ICalEventStatus {
  if (status === 'cancelled' || status === 'refused') return ICalEventStatus.CANCELLED;
  // A booking that needs no approval ("requested") holds its gear as firmly as an approved one.
  if (status === 'awaiting-approval') return ICalEventStatus.TENTATIVE;
  return ICalEventStatus.CONFIRMED;
}

/**
 * SEQUENCE must grow whenever the event changes (RFC 5545 3.8.7.4). Every change to a booking
 * moves its updated_at forward, so the seconds from its creation to its last change serve, with
 * no counter of our own to keep in step.
 */
function sequenceOf(createdAt: Date, updatedAt: Date): number {
  return Math.max(0, Math.floor((new Date(updatedAt).getTime() - new Date(createdAt).getTime()) / 1000));
}

interface BookingEventRow {
  id: number;
  person_id: number;
  person_name: string;
  status: string;
  starts_at: Date;
  ends_at: Date;
  location: string;
  purpose: string;
  planned_kv: string | number;
  item_tags: string;
  created_at: Date;
  updated_at: Date;
}

/** How far back the feed reaches; older bookings have left every calendar's view. */
const PAST_DAYS = 90;

/** The feed's text, or null when the token opens no feed (the route answers 404 either way). */
export async function feedText(db: Db, config: FeedConfig, token: string, now = new Date()): Promise<string | null> {
  if (!TOKEN_PATTERN.test(token)) return null;
  const feed = await db('calendar_feeds as f')
    .join('people as p', 'p.id', 'f.person_id')
    .where('f.token_hash', hashToken(token))
    .andWhere('p.active', true)
    .first('f.*', 'p.id as pid', 'p.name', 'p.role');
  if (!feed) return null;
  const role = feed.role as SessionUser['role'];
  // Scopes are honoured only while the role still allows them.
  const approvals = Boolean(feed.approvals) && role === 'officer';
  const labBookings = Boolean(feed.lab_bookings) && role === 'officer';
  const inspections = Boolean(feed.inspections) && role === 'manager';

  const host = new URL(config.publicUrl).host;
  const since = new Date(now.getTime() - PAST_DAYS * 24 * 3600_000);
  const cal = ical({
    name: `Voltcrib — ${feed.name}`,
    prodId: { company: 'Voltcrib', product: 'Voltcrib', language: 'EN' },
    method: ICalCalendarMethod.PUBLISH,
    ttl: 15 * 60,
  });

  const query = db('bookings as b').join('people as p', 'p.id', 'b.person_id').where('b.ends_at', '>', since);
  if (!labBookings) {
    query.andWhere((w) => {
      w.where('b.person_id', feed.pid);
      if (approvals) w.orWhere('b.status', 'awaiting-approval');
    });
  }
  const bookings = (await query
    .orderBy('b.starts_at')
    .limit(2000)
    .select(
      'b.id',
      'b.person_id',
      'p.name as person_name',
      'b.status',
      'b.starts_at',
      'b.ends_at',
      'b.location',
      'b.purpose',
      'b.planned_kv',
      'b.item_tags',
      'b.created_at',
      'b.updated_at',
    )) as BookingEventRow[];

  for (const b of bookings) {
    const tags = JSON.parse(b.item_tags) as string[];
    const kv = Number(b.planned_kv);
    const own = b.person_id === feed.pid;
    const waiting = b.status === 'awaiting-approval' && !own ? 'Approval waiting: ' : '';
    // Someone else's booking names them only in an officer's feed, as the app does.
    const who = own ? '' : ` — ${b.person_name}`;
    cal.createEvent({
      id: `booking-${b.id}@${host}`,
      sequence: sequenceOf(b.created_at, b.updated_at),
      start: new Date(b.starts_at),
      end: new Date(b.ends_at),
      stamp: new Date(b.updated_at),
      summary: `${waiting}${tags.join(', ')} at ${kv} kV${who}`,
      location: b.location,
      description: [
        `Booking #${b.id}: ${b.purpose}`,
        `Planned ${kv} kV`,
        `Status: ${STATUS_WORDS[b.status] ?? b.status}`,
        `${config.publicUrl}/bookings/${b.id}`,
      ].join('\n'),
      url: `${config.publicUrl}/bookings/${b.id}`,
      status: eventStatus(b.status),
    });
  }

  if (inspections) {
    const today = todayIso(now);
    const items = await db('items')
      .whereNot('status', 'retired')
      .whereNotNull('next_inspection_due')
      .andWhere('next_inspection_due', '<=', addDaysIso(today, 12 * 7))
      .andWhere('next_inspection_due', '>=', addDaysIso(today, -PAST_DAYS))
      .orderBy('next_inspection_due')
      .limit(2000)
      .select('id', 'tag', 'name', 'kind', 'next_inspection_due', 'updated_at');
    for (const item of items) {
      const due = dateColumnToIso(item.next_inspection_due)!;
      const start = new Date(`${due}T00:00:00Z`);
      cal.createEvent({
        // The due date is part of the UID: a new inspection makes a new event rather than moving an old one.
        id: `inspection-${item.id}-${due}@${host}`,
        sequence: 0,
        allDay: true,
        start,
        end: new Date(start.getTime() + 24 * 3600_000),
        stamp: new Date(item.updated_at),
        summary: `Inspection due: ${item.tag} ${item.name}`,
        description: `${item.tag} (${item.kind}) must be inspected by this day or it cannot be released.\n${config.publicUrl}/gear/${item.id}`,
        url: `${config.publicUrl}/gear/${item.id}`,
      });
    }
  }
  return cal.toString();
}
