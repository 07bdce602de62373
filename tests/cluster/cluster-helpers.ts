// The cluster suite's shared steps: a running test cluster (scripts/lib/cluster-run.ts) with a
// fresh database of the file's own, people signed in through the proxy or one app process, and
// the counter's whole loop (book, scan, checklist, release, make-safe, return).
import { expect } from '@jest/globals';
import type { Express } from 'express';
import type { Db } from '../../server/db';
import { testCluster, type ClusterLayout } from '../../scripts/lib/galera';
import { runCluster, type RunningCluster } from '../../scripts/lib/cluster-run';
import { verifyAuditChain } from '../../server/services/audit';
import { answersFor, post } from '../helpers/booking-flow';
import { insertKit, plan, qualify } from '../helpers/gear';
import { createPerson, signedInAgent } from '../helpers/test-app';
import type { Role } from '../../shared/schemas/session';

export interface ClusterContext {
  cluster: RunningCluster;
  layout: ClusterLayout;
  /** Straight to node1 (test set-up and checks). */
  db: Db;
  close(): Promise<void>;
}

/** The cluster with both app processes on a database named for this file, emptied and migrated. */
export async function startTestCluster(database: string, appEnv: Record<string, string> = {}): Promise<ClusterContext> {
  const layout = { ...testCluster(), database };
  const cluster = await runCluster(layout, {
    fresh: true,
    log: () => {},
    appEnv: { LOG_LEVEL: 'warn', LOGIN_RATE_LIMIT: '1000', LOGIN_RATE_LIMIT_PER_ADDRESS: '1000000', DB_POOL_MAX: '20', ...appEnv },
  });
  const db = cluster.connect(0);
  return {
    cluster,
    layout,
    db,
    async close() {
      await db.destroy();
      await cluster.stop();
    },
  };
}

/** supertest takes a base URL where the API tests give it an Express app. */
export const target = (url: string) => url as unknown as Express;

export const appUrl = (ctx: ClusterContext, index: number) => `http://127.0.0.1:${ctx.layout.apps[index]}`;

export async function personSignedIn(ctx: ClusterContext, role: Role, url = ctx.cluster.url) {
  const person = await createPerson(ctx.db, { role });
  const session = await signedInAgent(target(url), person);
  return { person, ...session };
}

export type Who = Awaited<ReturnType<typeof personSignedIn>>;

export async function qualifiedMember(ctx: ClusterContext, url?: string): Promise<Who> {
  const who = await personSignedIn(ctx, 'member', url);
  await qualify(ctx.db, who.person.id, 30);
  return who;
}

export async function kitIds(ctx: ClusterContext) {
  const kit = await insertKit(ctx.db);
  return { ids: kit.all.map((i) => i.id), tags: kit.all.map((i) => i.tag) };
}

/** The last 5xx answer's text, for the failure messages of the load tests. */
export let lastFailure = '';

/**
 * One counter loop on a kit: 10 kV (under the approval threshold) so a qualified member goes
 * through alone. Returns each step's status; stops at the first refusal.
 */
export async function counterLoop(who: Who, kit: { ids: number[]; tags: string[] }, options: { returnIt?: boolean } = {}) {
  const statuses: number[] = [];
  const startsAt = new Date(Date.now() - 60_000).toISOString();
  const endsAt = new Date(Date.now() + 3600_000).toISOString();
  const created = await post(who as never, '/api/bookings', { itemIds: kit.ids, startsAt, endsAt, location: 'Bay 2', purpose: 'Cluster loop', plan: plan(10) });
  statuses.push(created.status);
  if (created.status >= 500) lastFailure = `${created.status} ${created.text.slice(0, 300)}`;
  if (created.status !== 201) return { statuses, bookingId: null as number | null, released: false, returned: false };
  const booking = created.body.booking as { id: number; checklist: { pre: never[]; return: never[] } };
  const step = async (path: string, body: unknown) => {
    const res = await post(who as never, path, body);
    statuses.push(res.status);
    if (res.status >= 500) lastFailure = `${res.status} ${path} ${res.text.slice(0, 300)}`;
    return res.status === 200;
  };
  for (const tag of kit.tags)
    if (!(await step(`/api/bookings/${booking.id}/scans`, { tag }))) return { statuses, bookingId: booking.id, released: false, returned: false };
  if (!(await step(`/api/bookings/${booking.id}/checklist`, { phase: 'pre', answers: answersFor(booking.checklist.pre) })))
    return { statuses, bookingId: booking.id, released: false, returned: false };
  const released = await step(`/api/bookings/${booking.id}/release`, {});
  if (!released || options.returnIt === false) return { statuses, bookingId: booking.id, released, returned: false };
  if (!(await step(`/api/bookings/${booking.id}/checklist`, { phase: 'return', answers: answersFor(booking.checklist.return) })))
    return { statuses, bookingId: booking.id, released, returned: false };
  const returned = await step(`/api/bookings/${booking.id}/return`, {});
  return { statuses, bookingId: booking.id, released, returned };
}

/** Nothing half-written: every booking has its items, its tag copy and its creation in the audit trail; the chain verifies. */
export async function expectConsistent(db: Db): Promise<void> {
  const bookings = await db('bookings').select('id', 'item_tags', 'status');
  const items = await db('booking_items').select('booking_id', 'item_id');
  const audited = new Set((await db('audit_events').where({ entity: 'booking', action: 'booking.created' }).pluck('entity_id')).map(String));
  for (const b of bookings) {
    const mine = items.filter((i) => i.booking_id === b.id);
    expect({ id: b.id, items: mine.length }).toEqual({ id: b.id, items: (JSON.parse(b.item_tags) as string[]).length });
    expect({ id: b.id, audited: audited.has(String(b.id)) }).toEqual({ id: b.id, audited: true });
  }
  // No item is in two overlapping live bookings.
  const [overlaps] = (await db.raw(
    'SELECT COUNT(*) AS n FROM booking_items a JOIN booking_items b ON a.item_id = b.item_id AND a.booking_id < b.booking_id AND a.live AND b.live AND a.starts_at < b.ends_at AND b.starts_at < a.ends_at',
  )) as [{ n: number }[]];
  expect(Number(overlaps[0]!.n)).toBe(0);
  expect(await verifyAuditChain(db)).toEqual(expect.objectContaining({ ok: true, brokenAtId: null }));
}

/** A node's global status counter. */
export async function statusOf(db: Db, name: string): Promise<number> {
  const [rows] = (await db.raw('SHOW GLOBAL STATUS LIKE ?', [name])) as [{ Value: string }[]];
  return Number(rows[0]?.Value ?? 0);
}

export interface LoopRecord {
  worker: number;
  startedAt: number;
  endedAt: number;
  statuses: number[];
  bookingId: number | null;
  released: boolean;
  returned: boolean;
}

/**
 * Counter traffic until `stop()` is called: each worker runs whole loops on its kit, and moves to
 * a spare kit when a loop broke off half-way (that booking keeps its items until someone cleans up).
 */
export function counterLoad(workers: { who: Who; kits: { ids: number[]; tags: string[] }[] }[]) {
  const records: LoopRecord[] = [];
  let running = true;
  const done = Promise.all(
    workers.map(async (w, worker) => {
      let kit = 0;
      while (running && kit < w.kits.length) {
        const startedAt = Date.now();
        const loop = await counterLoop(w.who, w.kits[kit]!).catch(() => ({ statuses: [0], bookingId: null, released: false, returned: false }));
        records.push({ worker, startedAt, endedAt: Date.now(), ...loop });
        // A booking left half-way keeps its kit; a refused one leaves the kit free.
        if (loop.bookingId !== null && !loop.returned) kit += 1;
        if (!loop.returned) await sleep(200);
      }
    }),
  );
  return {
    records,
    async stop() {
      running = false;
      await done;
    },
  };
}

/** Every write the load was told succeeded is there on the given node. */
export async function expectAcknowledgedWrites(db: Db, records: LoopRecord[]): Promise<void> {
  const ids = records.filter((r) => r.bookingId !== null).map((r) => r.bookingId!);
  const rows = await db('bookings').whereIn('id', ids).select('id', 'status');
  const status = new Map(rows.map((r) => [r.id as number, r.status as string]));
  for (const r of records) {
    if (r.bookingId === null) continue;
    const s = status.get(r.bookingId);
    expect({ booking: r.bookingId, exists: s !== undefined }).toEqual({ booking: r.bookingId, exists: true });
    if (r.returned) expect({ booking: r.bookingId, status: s }).toEqual({ booking: r.bookingId, status: 'returned' });
    else if (r.released) expect({ booking: r.bookingId, released: s === 'released' || s === 'returned' }).toEqual({ booking: r.bookingId, released: true });
  }
}

export const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));
