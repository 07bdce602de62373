// The API's route table for the security suites (tests/api/security): every `METHOD /api/path`
// with the roles it admits and a fixture that builds a request the caller may make successfully.
// role-matrix.test.ts checks this table against the routes Express actually has, so a new route
// cannot ship without an entry; fuzz.test.ts mutates the same valid requests into hostile ones.
//
// A fixture acts on a resource the caller may act on (their own booking, a booking awaiting
// approval made by someone else, a throwaway person…), so an allowed role gets exactly the
// success status and a refused role is refused by its role alone, never by the resource.
// Fixtures touch no shared state other tests rely on: checklist lines they create apply to no
// item kind, lab rules are written back unchanged, people and gear are created fresh.
import { createHash, randomBytes } from 'node:crypto';
import type { Express } from 'express';
import { PNG } from 'pngjs';
import { createApp } from '../../server/app';
import { createDb, type Db } from '../../server/db';
import { createLogger } from '../../server/logger';
import { addDaysIso, todayIso } from '../../server/services/dates';
import type { Role } from '../../shared/schemas/session';
import { answersFor } from './booking-flow';
import { insertItem, insertKit, plan, qualify, windowFromNow } from './gear';
import { anonymousAgent, createPerson, itemBody, signedInAgent, testConfig, uniqueEmail, uniqueWord, type Agent, type TestContext } from './test-app';

export type Method = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';
export type Identity = 'signed-out' | Role;
export const IDENTITIES: readonly Identity[] = ['signed-out', 'member', 'officer', 'manager'];
export type Access = 'public' | 'signed-in' | readonly Role[];

export interface Person {
  id: number;
  email: string;
  password: string;
  role: Role;
}

export interface Caller {
  identity: Identity;
  agent: Agent;
  csrf(): string;
  /** Null when signed out. */
  person: Person | null;
}

export interface RouteRequest {
  /** Values for the `:name` segments of the route. */
  params?: Record<string, string | number>;
  query?: Record<string, string>;
  /** JSON body (write routes). */
  body?: unknown;
  /** Multipart upload instead of a JSON body. */
  upload?: { fileName: string; bytes: Buffer; fields?: Record<string, string> };
  /** Send from this caller instead (session routes must not sign the shared agent in or out). */
  as?: Caller;
  /** The status an allowed caller gets. */
  status: number;
}

export interface RouteFixture {
  access: Access;
  build(world: World, caller: Caller): Promise<RouteRequest>;
}

// ---------------------------------------------------------------------------------------------
// The context: the real app on the test database, with an (empty) local mailbox so
// GET /api/mailbox answers as it does in development instead of 404.

export function createSecurityContext(overrides: Record<string, string> = {}): TestContext {
  const config = testConfig(overrides);
  const db = createDb(config);
  const app = createApp({ db, config, logger: createLogger(config.logLevel), mailbox: { list: () => [] } });
  return { db, app, config, close: () => db.destroy() };
}

// ---------------------------------------------------------------------------------------------
// The routes Express has, read from the app itself (Express 5 / router 2 layers).

interface RouterLayer {
  rawPath?: unknown;
  slash?: boolean;
  route?: { path: unknown; methods: Record<string, boolean> };
  handle?: { stack?: RouterLayer[] };
}

function joinPath(prefix: string, path: string): string {
  const joined = `${prefix}/${path}`.replace(/\/+/g, '/');
  return joined.length > 1 ? joined.replace(/\/$/, '') : joined;
}

/** Every `METHOD /path` under /api, e.g. `GET /api/items/:id`. The web app's catch-all is not API. */
export function listApiRoutes(app: Express): string[] {
  const found: string[] = [];
  const walk = (stack: RouterLayer[], prefix: string) => {
    for (const layer of stack) {
      if (layer.route) {
        if (typeof layer.route.path !== 'string') continue; // the web app's RegExp catch-all
        const full = joinPath(prefix, layer.route.path);
        for (const [method, on] of Object.entries(layer.route.methods)) {
          if (on && method !== '_all') found.push(`${method.toUpperCase()} ${full}`);
        }
      } else if (layer.handle?.stack) {
        const mount = layer.slash || typeof layer.rawPath !== 'string' ? '' : layer.rawPath;
        walk(layer.handle.stack, joinPath(prefix, mount));
      }
    }
  };
  walk((app as unknown as { router: { stack: RouterLayer[] } }).router.stack, '');
  return [...new Set(found.filter((r) => / \/api(\/|$)/.test(r)))].sort();
}

export function splitRoute(key: string): { method: Method; pattern: string } {
  const [method, pattern] = key.split(' ') as [Method, string];
  return { method, pattern };
}

export function isWrite(method: Method): boolean {
  return method !== 'GET';
}

export function paramNames(pattern: string): string[] {
  return [...pattern.matchAll(/:(\w+)/g)].map((m) => m[1]!);
}

/** Fills `:name` segments; values are sent as given (callers encode hostile ones themselves). */
export function fillPath(pattern: string, params: Record<string, string | number> = {}): string {
  return pattern.replace(/:(\w+)/g, (_m, name: string) => {
    if (!(name in params)) throw new Error(`No value for :${name} in ${pattern}`);
    return String(params[name]);
  });
}

export function allows(access: Access, identity: Identity): boolean {
  if (access === 'public') return true;
  if (identity === 'signed-out') return false;
  return access === 'signed-in' || access.includes(identity);
}

/** What an identity must get: the fixture's success status, 401 signed out, 403 wrong role. */
export function expectedStatus(access: Access, identity: Identity, success: number): number {
  if (allows(access, identity)) return success;
  return identity === 'signed-out' ? 401 : 403;
}

/** Sends a fixture's request as built (CSRF token on every write). */
export function send(caller: Caller, key: string, req: RouteRequest) {
  const { method, pattern } = splitRoute(key);
  const who = req.as ?? caller;
  const query = req.query ? `?${new URLSearchParams(req.query).toString()}` : '';
  const url = fillPath(pattern, encodeParams(req.params)) + query;
  let test = who.agent[method.toLowerCase() as 'get' | 'post' | 'put' | 'patch' | 'delete'](url);
  if (isWrite(method)) test = test.set('x-csrf-token', who.csrf());
  if (req.upload) {
    for (const [name, value] of Object.entries(req.upload.fields ?? {})) test = test.field(name, value);
    // `filepath` makes the multipart encoder send the name exactly as given.
    return test.attach('file', req.upload.bytes, { filepath: req.upload.fileName } as unknown as string);
  }
  return req.body === undefined ? test : test.send(req.body as object);
}

function encodeParams(params: Record<string, string | number> = {}): Record<string, string> {
  return Object.fromEntries(Object.entries(params).map(([k, v]) => [k, encodeURIComponent(String(v))]));
}

export function pngBytes(): Buffer {
  const png = new PNG({ width: 4, height: 4 });
  png.data.fill(180);
  return PNG.sync.write(png);
}

const sha256 = (value: string) => createHash('sha256').update(value).digest('hex');

// ---------------------------------------------------------------------------------------------
// The world the fixtures build in. It remembers every person, item and checklist line it made,
// so the fuzz suite can watch exactly those rows.

type BookingView = { id: number; status: string; planVersion: number; items: { id: number; tag: string }[]; checklist: { pre: Entry[]; return: Entry[] } };
type Entry = { id: number; kind: string; unit?: string; min?: number; max?: number; required: boolean };

export class World {
  readonly people = new Set<number>();
  readonly emails = new Set<string>();
  readonly items = new Set<number>();
  readonly templates = new Set<number>();
  /** In the text of every checklist line this world makes, so it can retire exactly those. */
  readonly word = uniqueWord();
  private fileId: number | null = null;

  /** A qualified member who owns the resources signed-out callers aim at. */
  owner!: Caller;
  /** An officer who is none of the callers: uploads the shared file. */
  staff!: Caller;

  private constructor(readonly ctx: TestContext) {}

  static async create(ctx: TestContext): Promise<World> {
    const world = new World(ctx);
    world.owner = await world.caller('member');
    world.staff = await world.caller('officer');
    return world;
  }

  get db(): Db {
    return this.ctx.db;
  }

  async person(role: Role = 'member'): Promise<Person> {
    const person = await createPerson(this.db, { role });
    this.people.add(person.id);
    this.emails.add(person.email);
    return person;
  }

  /** A new agent in the given state: signed out, or signed in as a fresh, qualified person. */
  async caller(identity: Identity): Promise<Caller> {
    if (identity === 'signed-out') {
      const session = await anonymousAgent(this.ctx.app);
      return { identity, agent: session.agent, csrf: session.csrf, person: null };
    }
    const person = await this.person(identity);
    await qualify(this.db, person.id, 40);
    const session = await signedInAgent(this.ctx.app, person);
    return { identity, agent: session.agent, csrf: session.csrf, person };
  }

  /** The caller itself when signed in; the owner otherwise (someone must own the resource). */
  actor(caller: Caller): Caller {
    return caller.person ? caller : this.owner;
  }

  async item(kind: Parameters<typeof insertItem>[1] = 'probe'): Promise<{ id: number; tag: string }> {
    const item = await insertItem(this.db, kind);
    this.items.add(item.id);
    return item;
  }

  async kit() {
    const kit = await insertKit(this.db);
    for (const item of kit.all) this.items.add(item.id);
    return kit;
  }

  async bookingBody(plannedKv = 10) {
    const kit = await this.kit();
    return { itemIds: kit.all.map((i) => i.id), ...windowFromNow(), location: 'Bay 3', purpose: 'Security suite booking', plan: plan(plannedKv) };
  }

  private async post(who: Caller, path: string, body: unknown = {}) {
    const res = await who.agent
      .post(path)
      .set('x-csrf-token', who.csrf())
      .send(body as object);
    if (res.status >= 300) throw new Error(`fixture step POST ${path} failed: ${res.status} ${JSON.stringify(res.body)}`);
    return res.body as { booking: BookingView };
  }

  /** A booking by `who` (10 kV: no approval needed, so it can be released at once). */
  async booking(who: Caller, plannedKv = 10): Promise<BookingView> {
    return (await this.post(this.actor(who), '/api/bookings', await this.bookingBody(plannedKv))).booking;
  }

  /** An incident reported by `who` (the owner when signed out): a near miss, nothing tagged out. */
  async incident(who: Caller): Promise<number> {
    const actor = this.actor(who);
    const res = await actor.agent.post('/api/incidents').set('x-csrf-token', actor.csrf()).send(SECURITY_INCIDENT);
    if (res.status !== 201) throw new Error(`fixture step POST /api/incidents failed: ${res.status} ${JSON.stringify(res.body)}`);
    return res.body.incident.id as number;
  }

  /** A corrective action owned by `who` (the owner when signed out), on an incident an officer closed. */
  async incidentAction(who: Caller): Promise<number> {
    const actor = this.actor(who);
    const id = await this.incident(actor);
    const review = {
      status: 'closed',
      cause: 'Security suite cause',
      correctiveActions: [{ action: 'Security suite action', ownerId: actor.person!.id, dueOn: addDaysIso(todayIso(), 7) }],
    };
    const res = await this.staff.agent.patch(`/api/incidents/${id}`).set('x-csrf-token', this.staff.csrf()).send(review);
    if (res.status !== 200) throw new Error(`fixture step PATCH /api/incidents/${id} failed: ${res.status} ${JSON.stringify(res.body)}`);
    return res.body.incident.correctiveActions[0].id as number;
  }

  /** Every item scanned and the pre-energize checklist done: release will pass. */
  async readyBooking(who: Caller): Promise<BookingView> {
    const actor = this.actor(who);
    const booking = await this.booking(actor);
    for (const item of booking.items) await this.post(actor, `/api/bookings/${booking.id}/scans`, { tag: item.tag });
    return (await this.post(actor, `/api/bookings/${booking.id}/checklist`, { phase: 'pre', answers: answersFor(booking.checklist.pre) })).booking;
  }

  async releasedBooking(who: Caller): Promise<BookingView> {
    const booking = await this.readyBooking(who);
    return (await this.post(this.actor(who), `/api/bookings/${booking.id}/release`)).booking;
  }

  /** Released, with the make-safe checklist done (residual voltage well below the limit). */
  async returnableBooking(who: Caller): Promise<BookingView> {
    const booking = await this.releasedBooking(who);
    const residual = booking.checklist.return.find((e) => e.unit === 'V');
    const answers = answersFor(booking.checklist.return, residual ? { [residual.id]: 3 } : {});
    return (await this.post(this.actor(who), `/api/bookings/${booking.id}/checklist`, { phase: 'return', answers })).booking;
  }

  /** A released booking of `who` with one bench run on it (tests/api/bench-runs). */
  async benchRun(who: Caller): Promise<{ bookingId: number; runId: number }> {
    const booking = await this.releasedBooking(who);
    const res = await this.actor(who).agent.post(`/api/bookings/${booking.id}/runs`).set('x-csrf-token', this.actor(who).csrf()).send(BENCH_RUN);
    if (res.status !== 201) throw new Error(`fixture step POST runs failed: ${res.status} ${JSON.stringify(res.body)}`);
    return { bookingId: booking.id, runId: res.body.run.id as number };
  }

  /** 25 kV is above the lab's approval voltage: the owner's booking waits for an officer. */
  async awaitingApproval(): Promise<BookingView> {
    const booking = await this.booking(this.owner, 25);
    if (booking.status !== 'awaiting-approval') throw new Error(`expected awaiting-approval, got ${booking.status}`);
    return booking;
  }

  /** One stored photo, uploaded once by the staff officer. */
  async storedFileId(): Promise<number> {
    if (this.fileId !== null) return this.fileId;
    const item = await this.item('probe');
    const res = await send(this.staff, 'POST /api/items/:id/files', {
      params: { id: item.id },
      upload: { fileName: 'security-photo.png', bytes: pngBytes() },
      status: 201,
    });
    if (res.status !== 201) throw new Error(`fixture upload failed: ${res.status} ${JSON.stringify(res.body)}`);
    this.fileId = res.body.file.id as number;
    return this.fileId;
  }

  /** A one-time link for a fresh person, as the invitation and reset mails carry it. */
  async token(purpose: 'invitation' | 'password-reset'): Promise<string> {
    const person = await this.person('member');
    if (purpose === 'invitation') await this.db('people').where({ id: person.id }).update({ password_hash: null });
    const token = randomBytes(32).toString('base64url');
    await this.db('person_tokens').insert({ person_id: person.id, purpose, token_hash: sha256(token), expires_at: new Date(Date.now() + 3600_000) });
    return token;
  }

  /** A checklist line that applies to no booking (its item kind does not exist). */
  async inertTemplate(): Promise<number> {
    const [id] = (await this.db('checklist_templates').insert({ ...INERT_TEMPLATE_COLUMNS, text: this.inertText() })) as [number];
    this.templates.add(id);
    return id;
  }

  inertText(): string {
    return `Inert security line ${this.word} ${uniqueWord()}`;
  }

  /**
   * Leaves nothing behind that other suites trip over: retires the inert checklist lines this
   * world made (directly or through the API) and deactivates its people and the people they
   * invited, so later approval requests are not mailed to a crowd of test officers.
   */
  async close(): Promise<void> {
    await this.db('checklist_templates').where('text', 'like', `%${this.word}%`).update({ active: false });
    if (this.people.size === 0) return;
    const ids = [...this.people];
    const invited = this.db('audit_events').where({ action: 'person.invited' }).whereIn('actor_id', ids).select(this.db.raw('CAST(entity_id AS UNSIGNED)'));
    await this.db('people').whereIn('id', ids).orWhereIn('id', invited).update({ active: false });
  }
}

export const INERT_TEMPLATE = { phase: 'pre', kind: 'confirm', required: false, appliesWithKind: 'no-such-kind' } as const;
const INERT_TEMPLATE_COLUMNS = { phase: 'pre', kind: 'confirm', required: false, applies_with_kind: 'no-such-kind', position: 999 };

/** A plausible bench run for the kit's 10 kV plan (tests/api/bench-runs). */
const BENCH_RUN = { appliedKv: 8, currentMa: 0.1, gapMm: 30 };
/** A near miss with no gear named, so a fixture's report tags nothing out. */
const SECURITY_INCIDENT = {
  kind: 'near-miss',
  severity: 'low',
  occurredAt: new Date(Date.now() - 3600_000).toISOString(),
  location: 'Bay 3',
  description: 'Security suite near miss',
  itemIds: [],
  tagOut: false,
};
const MANAGER: readonly Role[] = ['manager'];
const OFFICER: readonly Role[] = ['officer'];
const STAFF: readonly Role[] = ['officer', 'manager'];

const ok =
  (status = 200) =>
  async (): Promise<RouteRequest> => ({ status });
const calc = (body: Record<string, unknown>): RouteFixture => ({ access: 'signed-in', build: async () => ({ body, status: 200 }) });
const onItem = (access: Access, extra: Partial<RouteRequest> = {}): RouteFixture => ({
  access,
  build: async (world) => ({ params: { id: (await world.item('probe')).id }, status: 200, ...extra }),
});
const period = () => ({ from: new Date(Date.now() - 7 * 24 * 3600_000).toISOString(), to: new Date().toISOString() });

// ---------------------------------------------------------------------------------------------
// The table. Keys are exactly `METHOD /api/path` as Express has them.

export const ROUTES: Record<string, RouteFixture> = {
  'GET /api/health': { access: 'public', build: ok() },

  'GET /api/session': { access: 'public', build: ok() },
  'POST /api/session': {
    access: 'public',
    build: async (world, caller) => {
      const person = await world.person('member');
      return { as: await world.caller(caller.identity), body: { email: person.email, password: person.password }, status: 200 };
    },
  },
  'DELETE /api/session': { access: 'public', build: async (world, caller) => ({ as: await world.caller(caller.identity), status: 204 }) },

  'GET /api/people': { access: MANAGER, build: ok() },
  'PATCH /api/people/:id': {
    access: MANAGER,
    build: async (world) => ({ params: { id: (await world.person('member')).id }, body: { name: 'Renamed by security suite' }, status: 200 }),
  },
  'GET /api/people/:id/qualification': {
    access: 'signed-in',
    // Members read their own; staff read anyone's. Everyone here reads their own.
    build: async (world, caller) => ({ params: { id: world.actor(caller).person!.id }, status: 200 }),
  },
  'PUT /api/people/:id/qualification': {
    access: OFFICER,
    build: async (world) => ({
      params: { id: (await world.person('member')).id },
      body: { authorisedKv: 20, expiresOn: addDaysIso(todayIso(), 365), notes: 'Security suite' },
      status: 200,
    }),
  },

  'GET /api/groups': { access: 'signed-in', build: ok() },
  'GET /api/qualifications': { access: STAFF, build: ok() },

  'POST /api/calc/energy': calc({ capacitanceF: 1e-9, voltageV: 10_000 }),
  'POST /api/calc/discharge': calc({ resistanceOhm: 1e8, capacitanceF: 1e-9, initialV: 30_000, safeV: 50 }),
  'POST /api/calc/hazard': calc({ voltageV: 1000, currentA: 0.001, capacitanceF: 1e-9 }),
  'POST /api/calc/boundaries': calc({ voltageV: 30_000, system: 'dc' }),
  'POST /api/calc/multiplier': calc({ stages: 4, peakInputV: 10_000, frequencyHz: 20_000, stageCapacitanceF: 2e-9, loadCurrentA: 1e-4 }),
  'POST /api/calc/corona': calc({ wireRadiusM: 0.001, pressureCmHg: 76, temperatureC: 20, surfaceFactor: 0.9 }),

  'GET /api/items': { access: 'signed-in', build: async () => ({ query: { q: 'security', sort: 'name', limit: '10' }, status: 200 }) },
  'POST /api/items': { access: MANAGER, build: async () => ({ body: itemBody('probe', uniqueWord()), status: 201 }) },
  'GET /api/items/by-tag/:tag': { access: 'signed-in', build: async (world) => ({ params: { tag: (await world.item('meter')).tag }, status: 200 }) },
  'GET /api/items/:id': onItem('signed-in'),
  'PATCH /api/items/:id': onItem(MANAGER, { body: { notes: 'Checked by the security suite' } }),
  'GET /api/items/:id/history': onItem('signed-in'),
  'GET /api/items/:id/clearance': onItem('signed-in'),
  'GET /api/items/:id/availability': onItem('signed-in', {
    query: { from: new Date().toISOString(), to: new Date(Date.now() + 7 * 24 * 3600_000).toISOString() },
  }),
  'GET /api/items/:id/bookings': onItem('signed-in'),
  'GET /api/items/:id/inspections': onItem('signed-in'),
  'POST /api/items/:id/inspections': onItem(STAFF, { body: { result: 'pass', notes: 'Security suite inspection' }, status: 201 }),
  'GET /api/items/:id/files': onItem('signed-in'),
  'POST /api/items/:id/files': onItem(STAFF, { upload: { fileName: 'bench.png', bytes: pngBytes(), fields: { kind: 'photo' } }, status: 201 }),
  'GET /api/items/:id/label.svg': onItem('signed-in'),
  'GET /api/items/:id/label.pdf': onItem(STAFF),

  'GET /api/files/:id': { access: 'signed-in', build: async (world) => ({ params: { id: await world.storedFileId() }, status: 200 }) },
  'GET /api/labels.pdf': {
    access: STAFF,
    build: async (world) => ({ query: { items: `${(await world.item()).id},${(await world.item()).id}` }, status: 200 }),
  },

  'POST /api/assessments': {
    access: 'signed-in',
    build: async (world) => {
      const { itemIds, plan: p } = await world.bookingBody(10);
      return { body: { itemIds, plan: p }, status: 200 };
    },
  },

  'GET /api/bookings': { access: 'signed-in', build: async () => ({ query: { status: 'live', limit: '10' }, status: 200 }) },
  'POST /api/bookings': { access: 'signed-in', build: async (world) => ({ body: await world.bookingBody(10), status: 201 }) },
  'GET /api/bookings/:id': { access: 'signed-in', build: async (world, caller) => ({ params: { id: (await world.booking(caller)).id }, status: 200 }) },
  'PATCH /api/bookings/:id': {
    access: 'signed-in',
    build: async (world, caller) => ({ params: { id: (await world.booking(caller)).id }, body: { purpose: 'Changed by the security suite' }, status: 200 }),
  },
  'GET /api/bookings/:id/release-check': {
    access: 'signed-in',
    build: async (world, caller) => ({ params: { id: (await world.booking(caller)).id }, status: 200 }),
  },
  'POST /api/bookings/:id/cancel': { access: 'signed-in', build: async (world, caller) => ({ params: { id: (await world.booking(caller)).id }, status: 200 }) },
  'POST /api/bookings/:id/approval': {
    access: OFFICER,
    // Nobody decides on their own booking: the officer decides on the owner's.
    build: async (world) => {
      const booking = await world.awaitingApproval();
      return { params: { id: booking.id }, body: { decision: 'approve', planVersion: booking.planVersion, conditions: 'Barrier at 3 m' }, status: 200 };
    },
  },
  'POST /api/bookings/:id/scans': {
    access: 'signed-in',
    build: async (world, caller) => {
      const booking = await world.booking(caller);
      return { params: { id: booking.id }, body: { tag: booking.items[0]!.tag }, status: 200 };
    },
  },
  'POST /api/bookings/:id/photos': {
    access: 'signed-in',
    // Whoever may work the booking's counter: its booker, or staff (here each caller's own booking).
    build: async (world, caller) => ({ params: { id: (await world.booking(caller)).id }, upload: { fileName: 'barrier.png', bytes: pngBytes() }, status: 201 }),
  },
  'POST /api/bookings/:id/checklist': {
    access: 'signed-in',
    build: async (world, caller) => {
      const booking = await world.booking(caller);
      return { params: { id: booking.id }, body: { phase: 'pre', answers: answersFor(booking.checklist.pre) }, status: 200 };
    },
  },
  'GET /api/bookings/:id/checklist-runs': {
    access: 'signed-in',
    build: async (world, caller) => ({ params: { id: (await world.booking(caller)).id }, status: 200 }),
  },
  'POST /api/bookings/:id/release': {
    access: 'signed-in',
    build: async (world, caller) => ({ params: { id: (await world.readyBooking(caller)).id }, status: 200 }),
  },
  'POST /api/bookings/:id/return': {
    access: 'signed-in',
    build: async (world, caller) => ({ params: { id: (await world.returnableBooking(caller)).id }, body: {}, status: 200 }),
  },

  'GET /api/bookings/:id/runs': {
    access: 'signed-in',
    build: async (world, caller) => ({ params: { id: (await world.benchRun(caller)).bookingId }, status: 200 }),
  },
  'GET /api/bookings/:id/runs.csv': {
    access: 'signed-in',
    build: async (world, caller) => ({ params: { id: (await world.benchRun(caller)).bookingId }, status: 200 }),
  },
  'POST /api/bookings/:id/runs': {
    access: 'signed-in',
    build: async (world, caller) => ({ params: { id: (await world.releasedBooking(caller)).id }, body: BENCH_RUN, status: 201 }),
  },
  'POST /api/bookings/:id/runs/import': {
    access: 'signed-in',
    build: async (world, caller) => ({
      params: { id: (await world.releasedBooking(caller)).id },
      body: { csv: 'kV,mA,mm\n8,0.1,30\n', mapping: { appliedKv: 'kV', currentMa: 'mA', gapMm: 'mm' } },
      status: 201,
    }),
  },
  'PUT /api/bookings/:id/runs/:runId': {
    access: 'signed-in',
    build: async (world, caller) => {
      const { bookingId, runId } = await world.benchRun(caller);
      return { params: { id: bookingId, runId }, body: { ...BENCH_RUN, currentMa: 0.11, reason: 'Misread the meter' }, status: 200 };
    },
  },
  'GET /api/bookings/:id/runs/:runId/revisions': {
    access: 'signed-in',
    build: async (world, caller) => {
      const { bookingId, runId } = await world.benchRun(caller);
      return { params: { id: bookingId, runId }, status: 200 };
    },
  },
  'DELETE /api/bookings/:id/runs/:runId': {
    access: STAFF,
    build: async (world, caller) => {
      const { bookingId, runId } = await world.benchRun(caller);
      return { params: { id: bookingId, runId }, body: { reason: 'Duplicate entry' }, status: 204 };
    },
  },

  'GET /api/lab-rules': { access: 'signed-in', build: ok() },
  'PUT /api/lab-rules': {
    access: OFFICER,
    // Written back unchanged: the rules are shared by every test running at the same time.
    build: async (world) => ({ body: (await world.staff.agent.get('/api/lab-rules')).body, status: 200 }),
  },
  'GET /api/lab-rules/confirmation': { access: STAFF, build: ok() },
  'POST /api/lab-rules/confirm': {
    access: OFFICER,
    // A change by another officer waits for confirmation; the rules themselves stay as they are.
    build: async (world) => {
      const editor = await world.person('officer');
      await world
        .db('lab_rules')
        .where({ id: 1 })
        .update({ pending_editors: JSON.stringify([editor.id]) });
      return { status: 200 };
    },
  },

  'GET /api/checklist-templates': { access: 'signed-in', build: ok() },
  'POST /api/checklist-templates': { access: OFFICER, build: async (world) => ({ body: { ...INERT_TEMPLATE, text: world.inertText() }, status: 201 }) },
  'PUT /api/checklist-templates/:id': {
    access: OFFICER,
    build: async (world) => ({ params: { id: await world.inertTemplate() }, body: { ...INERT_TEMPLATE, text: world.inertText() }, status: 200 }),
  },
  'DELETE /api/checklist-templates/:id': { access: OFFICER, build: async (world) => ({ params: { id: await world.inertTemplate() }, status: 204 }) },

  'GET /api/audit': { access: STAFF, build: async () => ({ query: { entity: 'item', limit: '5' }, status: 200 }) },
  'GET /api/audit/verify': { access: STAFF, build: ok() },

  'POST /api/invitations': {
    access: MANAGER,
    build: async () => ({ body: { email: uniqueEmail('invitee'), name: 'Invited by security suite', role: 'member' }, status: 201 }),
  },
  'POST /api/invitations/:token': {
    access: 'public',
    build: async (world) => ({ params: { token: await world.token('invitation') }, body: { password: 'a long enough new password' }, status: 200 }),
  },
  'POST /api/password-resets': { access: 'public', build: async () => ({ body: { email: uniqueEmail('nobody') }, status: 202 }) },
  'POST /api/password-resets/:token': {
    access: 'public',
    build: async (world) => ({ params: { token: await world.token('password-reset') }, body: { password: 'a long enough new password' }, status: 200 }),
  },

  'GET /api/mailbox': { access: MANAGER, build: ok() },

  'GET /api/reports/desk': { access: STAFF, build: ok() },
  'GET /api/reports/inspections': { access: STAFF, build: async () => ({ query: { limit: '5' }, status: 200 }) },
  'GET /api/reports/usage': { access: MANAGER, build: async () => ({ query: period(), status: 200 }) },
  'GET /api/reports/usage.csv': { access: MANAGER, build: async () => ({ query: period(), status: 200 }) },
  'GET /api/reports/overdue.csv': { access: MANAGER, build: ok() },
  'GET /api/reports/inspections.csv': { access: MANAGER, build: ok() },

  'GET /api/incidents': { access: 'signed-in', build: async () => ({ query: { status: 'open' }, status: 200 }) },
  'POST /api/incidents': { access: 'signed-in', build: async () => ({ body: SECURITY_INCIDENT, status: 201 }) },
  'GET /api/incidents/actions/past-due': { access: 'signed-in', build: ok() },
  'PATCH /api/incidents/actions/:id': {
    access: 'signed-in',
    build: async (world, caller) => ({ params: { id: await world.incidentAction(caller) }, body: { done: true }, status: 200 }),
  },
  'GET /api/incidents/:id': { access: 'signed-in', build: async (world, caller) => ({ params: { id: await world.incident(caller) }, status: 200 }) },
  'PATCH /api/incidents/:id': {
    access: OFFICER,
    build: async (world, caller) => ({ params: { id: await world.incident(caller) }, body: { status: 'under-review' }, status: 200 }),
  },
  'POST /api/incidents/:id/photos': {
    access: 'signed-in',
    build: async (world, caller) => ({ params: { id: await world.incident(caller) }, upload: { fileName: 'near-miss.png', bytes: pngBytes() }, status: 201 }),
  },

  'GET /api/calendar-feed': { access: 'signed-in', build: ok() },
  'POST /api/calendar-feed': { access: 'signed-in', build: async () => ({ body: {}, status: 200 }) },
  'DELETE /api/calendar-feed': { access: 'signed-in', build: ok(204) },

  'GET /api/reports/charts': { access: MANAGER, build: async () => ({ query: period(), status: 200 }) },
  'GET /api/reports/charts/:name.csv': { access: MANAGER, build: async () => ({ params: { name: 'overdue-returns' }, query: period(), status: 200 }) },
  'GET /api/reports/safety-summary': { access: MANAGER, build: async () => ({ query: { month: todayIso().slice(0, 7) }, status: 200 }) },
  'GET /api/reports/safety-summary.pdf': { access: MANAGER, build: async () => ({ query: { month: todayIso().slice(0, 7) }, status: 200 }) },
};
