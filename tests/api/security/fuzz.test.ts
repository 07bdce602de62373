// Hostile input for every write route of the route table and for the list/search routes:
// fast-check mutates each route's valid request (tests/helpers/route-fixtures.ts) into wrong
// types, missing and extra keys, huge and odd unicode strings, numbers JSON cannot hold, SQL and
// script fragments, prototype-pollution keys, arrays for objects, and hostile path segments and
// query strings. Every answer must be below 500, carry no stack trace, SQL or connection error,
// use the `{ error: { code, message } }` envelope when it is an error, and a refused (4xx)
// request must leave the database exactly as it was.
//
// How "the database is unchanged" is checked while other test files write to the same database:
// whole-table checksums (CHECKSUM TABLE) move whenever any other suite writes, so they cannot
// tell a fuzz request's write from a neighbour's. Instead every fuzz request is aimed at
// resources this suite created and sent by people this suite created (the World of
// route-fixtures remembers them), and the check covers exactly the rows tied to them: in each of
// the 17 tables (items, bookings, booking_items, approvals, booking_scans, checklist_runs,
// inspections, item_files, people, qualifications, lab_rules, checklist_templates, outbox,
// person_tokens, audit_events, incidents (with the items they name), calendar_feeds) the rows whose id is a fuzz id or whose owner/actor
// column names a fuzz person (bookings.person_id, approvals.officer_id, booking_scans.scanned_by,
// checklist_runs.completed_by, inspections.inspector_id, item_files.uploaded_by or booking_id,
// qualifications.recorded_by, lab_rules.updated_by, incidents.reported_by,
// person_tokens.person_id, outbox.to_address, audit_events.actor_id or entity id) are counted and
// hashed row by row (MD5 over QUOTE() of every column) in one query. A new row a fuzz request
// wrongly wrote shows up in the count, a changed row in the hash. Two lanes run side by side,
// each with its own World and its own snapshot; within a lane requests are sequential, so the
// snapshot after request N is the baseline for request N+1 (after a success it is rebuilt, since
// the lane's people may own new bookings). The first test proves the snapshot sees a change in
// every watched table, by making one inside a rolled-back transaction.
// Audit entries are append-only (nothing in the app updates or deletes one) and outbox rows are
// hashed on their immutable columns only (another suite's mail worker may send them), so for
// those two only rows added after the suite's setup are read, which keeps each snapshot cheap.
// Mail the scheduler or other suites address to every officer or manager (approval requests for
// bookings that are not ours, overdue and inspection digests) is left out.
//
// What is never sent, because it would change state the suites running beside this one share if
// it happened to be valid: lab rules or checklist lines the schema accepts (they apply to every
// booking), bookings of gear this suite does not own, and, on write routes, a path segment that
// reads as a small positive id (e.g. 0x10 = 16) and so might name another suite's row.
import { createServer, type Server } from 'node:http';
import fc from 'fast-check';
import { createConnection, type Connection } from 'mysql2/promise';
import { checklistTemplateItemSchema, labRulesSchema, bookingCreateSchema, bookingUpdateSchema } from '../../../shared/schemas/bookings';
import {
  createSecurityContext,
  fillPath,
  IDENTITIES,
  isWrite,
  paramNames,
  pngBytes,
  ROUTES,
  splitRoute,
  World,
  type Caller,
  type Identity,
  type RouteRequest,
} from '../../helpers/route-fixtures';
import type { TestContext } from '../../helpers/test-app';

const RUNS = { body: 6200, params: 1700, query: 1700, upload: 300, raw: 600 };

/** The list and search routes whose query strings (and path segments) are fuzzed too. */
const LIST_ROUTES = [
  'GET /api/items',
  'GET /api/bookings',
  'GET /api/audit',
  'GET /api/people',
  'GET /api/groups',
  'GET /api/checklist-templates',
  'GET /api/reports/desk',
  'GET /api/reports/inspections',
  'GET /api/reports/usage',
  'GET /api/reports/usage.csv',
  'GET /api/reports/overdue.csv',
  'GET /api/reports/inspections.csv',
  'GET /api/labels.pdf',
  'GET /api/items/by-tag/:tag',
  'GET /api/items/:id/availability',
  'GET /api/items/:id/history',
  'GET /api/items/:id/bookings',
  'GET /api/items/:id/inspections',
  'GET /api/items/:id/files',
];
const WRITE_ROUTES = Object.keys(ROUTES)
  .filter((k) => isWrite(splitRoute(k).method))
  .sort();
// Sign-in and link redemption run bcrypt (cost 11) on well-formed input: fewer runs there.
const SLOW_ROUTES = new Set(['POST /api/session', 'POST /api/invitations/:token', 'POST /api/password-resets/:token']);

// ---------------------------------------------------------------------------------------------
// JSON the generators build: Raw keeps number texts JSON.stringify cannot write (1e400, -0),
// Obj keeps its keys as given, `__proto__` included.

class Raw {
  constructor(readonly text: string) {}
}
class Obj {
  constructor(readonly entries: [string, J][]) {}
}
type J = null | boolean | number | string | J[] | Raw | Obj;

function toJson(value: J): string {
  if (value instanceof Raw) return value.text;
  if (value instanceof Obj) return `{${value.entries.map(([k, v]) => `${JSON.stringify(k)}:${toJson(v)}`).join(',')}}`;
  if (Array.isArray(value)) return `[${value.map(toJson).join(',')}]`;
  return JSON.stringify(value);
}

function fromPlain(value: unknown): J {
  if (value === undefined) return null;
  if (Array.isArray(value)) return value.map(fromPlain);
  if (value !== null && typeof value === 'object') return new Obj(Object.entries(value).map(([k, v]) => [k, fromPlain(v)]));
  return value as J;
}

/** Percent-encodes bytes (a lone surrogate becomes U+FFFD, as any client would send it). */
function pct(text: string): string {
  let out = '';
  for (const byte of Buffer.from(text, 'utf8')) {
    const char = String.fromCharCode(byte);
    out += /[A-Za-z0-9\-._~]/.test(char) ? char : `%${byte.toString(16).toUpperCase().padStart(2, '0')}`;
  }
  return out;
}

// ---------------------------------------------------------------------------------------------
// Generators

const HOSTILE_STRINGS = [
  "' OR 1=1 --",
  '" OR ""="',
  '1; DROP TABLE items; --',
  "' UNION SELECT password_hash FROM people --",
  "\\'; SHUTDOWN; --",
  '<script>alert(1)</script>',
  '<img src=x onerror=alert(1)>',
  'javascript:alert(1)',
  '${7*7}',
  '{{7*7}}',
  '#{7*7}',
  '%s%s%n%x',
  '../../../../etc/passwd',
  '..\\..\\windows\\win.ini',
  '\u0000',
  'nul\u0000inside',
  '\ud800',
  '\udfff',
  'lone \udc00 surrogate',
  '\u202Egnp.exe',
  '\u200F\u202B right to left \u202C',
  '🔌⚡️👩‍🔬🏳️‍🌈',
  'e\u0301\u0301\u0301',
  '\uFEFF',
  '\r\nSet-Cookie: x=1',
  '',
  ' ',
  'NaN',
  'Infinity',
  '-Infinity',
  '1e400',
  '-1e400',
  '0x10',
  '1e9',
  '-1',
  '-0',
  '١٢٣',
  '9'.repeat(40),
  'null',
  'true',
  '[object Object]',
  '__proto__',
  'constructor',
];
const NUMBER_TEXTS = [
  '1e400',
  '-1e400',
  '1e-400',
  '-0',
  '0',
  '-1',
  '2147483648',
  '4294967296',
  '9007199254740993',
  '1.7976931348623157e308',
  '5e-324',
  '1.5',
  '-2147483649',
  '1E+2',
  '123456789012345678901234567890',
];
const HOSTILE_KEYS = [
  '__proto__',
  'constructor',
  'prototype',
  '__defineGetter__',
  'toString',
  'hasOwnProperty',
  'valueOf',
  '',
  ' ',
  'a.b',
  '$where',
  'role',
  'id',
  'personId',
  'isAdmin',
];
const ODD_CHARS = ['\u0000', '\u202E', '\u200F', '\ud800', '\udfff', '🔌', '⚡', '\uFEFF', '\n', '%', '\\', '"', "'", '<', '>', '/', '.', 'a', 'Z', '7', ' '];

const oddString = fc.string({ unit: fc.constantFrom(...ODD_CHARS), maxLength: 24 });
// Any code point, lone surrogate halves included (fast-check's 'binary' unit leaves those out).
const anyCodePoint = fc.integer({ min: 0, max: 0x10ffff }).map((cp) => String.fromCodePoint(cp));
const codePointString = fc.string({ unit: anyCodePoint, maxLength: 24 });
// Mostly a few KB, sometimes up to the 100 KB body limit (two bytes a character in UTF-8).
const hugeString = fc
  .oneof({ arbitrary: fc.integer({ min: 1_000, max: 10_000 }), weight: 3 }, { arbitrary: fc.integer({ min: 10_000, max: 100_000 }), weight: 1 })
  .map((bytes) => 'Ω'.repeat(Math.floor(bytes / 2)));
const hostileString: fc.Arbitrary<string> = fc.oneof(
  { arbitrary: fc.constantFrom(...HOSTILE_STRINGS), weight: 6 },
  { arbitrary: oddString, weight: 3 },
  { arbitrary: codePointString, weight: 2 },
  { arbitrary: fc.string({ unit: 'grapheme', maxLength: 24 }), weight: 2 },
  { arbitrary: hugeString, weight: 1 },
);
const hostileKey = fc.oneof({ arbitrary: fc.constantFrom(...HOSTILE_KEYS), weight: 3 }, { arbitrary: oddString, weight: 1 });

const pollution: fc.Arbitrary<J> = fc.constantFrom<J>(
  new Obj([
    [
      '__proto__',
      new Obj([
        ['isAdmin', true],
        ['role', 'manager'],
      ]),
    ],
  ]),
  new Obj([['constructor', new Obj([['prototype', new Obj([['polluted', 'yes']])]])]]),
  new Obj([['prototype', new Obj([['polluted', 'yes']])]]),
  new Obj([['__proto__', new Obj([['__proto__', new Obj([['deep', 1]])]])]]),
);

const scalar: fc.Arbitrary<J> = fc.oneof(
  { arbitrary: hostileString, weight: 6 },
  { arbitrary: fc.constantFrom(...NUMBER_TEXTS).map((t) => new Raw(t)), weight: 3 },
  { arbitrary: fc.double({ noNaN: true, noDefaultInfinity: true }), weight: 2 },
  { arbitrary: fc.integer(), weight: 2 },
  { arbitrary: fc.constantFrom<J>(null, true, false, 0, -1, 1, []), weight: 2 },
  { arbitrary: pollution, weight: 2 },
);

const hostileValue: fc.Memo<J> = fc.memo((depth) =>
  depth <= 1
    ? scalar
    : fc.oneof(
        { arbitrary: scalar, weight: 6 },
        { arbitrary: fc.array(hostileValue(depth - 1), { maxLength: 4 }), weight: 1 },
        { arbitrary: fc.array(fc.tuple(hostileKey, hostileValue(depth - 1)), { maxLength: 4 }).map((e) => new Obj(e)), weight: 1 },
      ),
);
const anyValue = hostileValue(3);

type Mutation =
  | { op: 'whole'; value: J }
  | { op: 'set'; pick: number; value: J }
  | { op: 'drop'; pick: number }
  | { op: 'add'; key: string; value: J }
  | { op: 'nested'; pick: number; key: string; value: J }
  | { op: 'wrap' };

const mutation: fc.Arbitrary<Mutation> = fc.oneof(
  { arbitrary: anyValue.map((value) => ({ op: 'whole' as const, value })), weight: 2 },
  { arbitrary: fc.record({ op: fc.constant('set' as const), pick: fc.nat(), value: anyValue }), weight: 6 },
  { arbitrary: fc.record({ op: fc.constant('drop' as const), pick: fc.nat() }), weight: 2 },
  { arbitrary: fc.record({ op: fc.constant('add' as const), key: hostileKey, value: anyValue }), weight: 2 },
  { arbitrary: fc.record({ op: fc.constant('nested' as const), pick: fc.nat(), key: hostileKey, value: anyValue }), weight: 2 },
  { arbitrary: fc.constant({ op: 'wrap' as const }), weight: 1 },
);

function mutate(body: J, m: Mutation): J {
  if (m.op === 'whole') return m.value;
  if (m.op === 'wrap') return [body];
  if (!(body instanceof Obj)) return m.op === 'add' ? new Obj([[m.key, m.value]]) : body;
  const entries = [...body.entries];
  if (m.op === 'add') return new Obj([...entries, [m.key, m.value]]);
  if (entries.length === 0) return new Obj([['__proto__', m.op === 'drop' ? null : (m as { value: J }).value]]);
  const i = m.pick % entries.length;
  const [key, old] = entries[i]!;
  if (m.op === 'drop') return new Obj(entries.filter((_, j) => j !== i));
  if (m.op === 'set') {
    entries[i] = [key, m.value];
    return new Obj(entries);
  }
  // nested: inside an object-valued field when there is one, else the field becomes an object
  const objectField = entries.findIndex(([, v]) => v instanceof Obj);
  if (objectField >= 0) {
    const [k, v] = entries[objectField]!;
    entries[objectField] = [k, new Obj([...(v as Obj).entries, [m.key, m.value]])];
  } else {
    entries[i] = [
      key,
      new Obj([
        [m.key, m.value],
        ['value', old],
      ]),
    ];
  }
  return new Obj(entries);
}

const HOSTILE_SEGMENTS = [
  '..',
  '.',
  '..%2F..%2Fetc%2Fpasswd',
  '%2e%2e%2f',
  '%00',
  '1%00',
  '-1',
  '0',
  '1e9',
  '0x7fffff00',
  '0x10',
  '1.5',
  'NaN',
  'Infinity',
  '9'.repeat(40),
  '%',
  '%zz',
  '%E2%80%AE',
  '%F0%9F%94%8C',
  '%ED%A0%80',
  '%C0%AE%C0%AE',
  "1'%20OR%20'1'%3D'1",
  '%3Cscript%3E',
  '%24%7B7*7%7D',
  '__proto__',
  'constructor',
  '1%2C2',
  '%201',
  '+1',
  '00001',
];
const hostileSegment = fc.oneof(
  { arbitrary: fc.constantFrom(...HOSTILE_SEGMENTS), weight: 4 },
  { arbitrary: hostileString.filter((s) => s.length < 300).map(pct), weight: 2 },
  { arbitrary: fc.integer({ min: -1e6, max: 3e9 }).map(String), weight: 1 },
);

/** A segment that a write route would read as an id someone else's test may own. */
function looksLikeForeignId(segment: string): boolean {
  let decoded: string;
  try {
    decoded = decodeURIComponent(segment);
  } catch {
    return false;
  }
  const n = Number(decoded);
  return decoded.trim() !== '' && Number.isInteger(n) && n >= 1 && n < 1e8;
}

// ---------------------------------------------------------------------------------------------
// The run. Two lanes fuzz at once (the box has two cores and most of a request is waiting), each
// with its own World and snapshot, so one lane's successes never show up in the other's check.
// The seed is printed with every failure; FUZZ_SEED=<seed> replays a run.

const LANES = 2;
const SEED = Number(process.env.FUZZ_SEED ?? Math.floor(Math.random() * 2 ** 31));

interface Baseline {
  key: string;
  caller: Caller;
  req: RouteRequest;
}

interface Sent {
  property: string;
  key: string;
  method: string;
  url: string;
  body?: string;
  note?: string;
}

interface Violation extends Sent {
  lane: number;
  problem: string;
  status: number;
  response: string;
}

type Res = { status: number; text: string; headers: Record<string, string>; body: unknown };

// Audit entries and these outbox columns never change once written (see the header).
const APPEND_ONLY_COLUMNS: Record<string, string[]> = {
  outbox: ['id', 'dedupe_key', 'kind', 'to_address', 'subject'],
  audit_events: ['id', 'actor_id', 'entity', 'entity_id', 'action', 'prev_hash', 'hash'],
};

const STACK = /at .*\.(ts|js):\d+/;
const SQL_IN_ERRORS = /SELECT |INSERT |UPDATE |ER_|sqlMessage|You have an error in your SQL/i;
// Successful answers carry stored text (names, notes, audit records) that may well contain
// "update " or "select "; leaked SQL in them would still carry these.
const SQL_IN_DATA = /sqlMessage|You have an error in your SQL|\bER_[A-Z_]{3,}\b|`voltcrib_test`/i;

/** A match the request itself contained is the server echoing input, not leaking. */
function leaks(text: string, pattern: RegExp, echo: string): string | null {
  const global = new RegExp(pattern.source, pattern.flags.includes('g') ? pattern.flags : `${pattern.flags}g`);
  for (const match of text.matchAll(global)) {
    if (!echo.includes(match[0].toLowerCase())) return match[0];
  }
  return null;
}

function changedTables(before: string, after: string): string {
  const a = before.split('\n');
  return after
    .split('\n')
    .flatMap((line, i) => {
      if (line === a[i]) return [];
      const [table, n] = line.split(':');
      return [`${table} (${a[i]?.split(':')[1] ?? '?'} → ${n} rows)`];
    })
    .join(', ');
}

let ctx: TestContext;
let server: Server;
let lanes: Lane[] = [];
const violations: Violation[] = [];
const tally = { requests: 0, byStatus: {} as Record<number, number> };
const prototypeBefore = Object.getOwnPropertyNames(Object.prototype).sort();

class Lane {
  readonly callers = {} as Record<Identity, Caller>;
  readonly baselines = new Map<string, Baseline>();
  private sql = '';
  private bindings: string[] = [];
  private last = '';

  private constructor(
    readonly index: number,
    readonly world: World,
    /** Its own connection: snapshots are prepared statements, parsed once per booking list. */
    private readonly watch: Connection,
  ) {}

  static async open(index: number): Promise<Lane> {
    const world = await World.create({ ...ctx, app: server as unknown as TestContext['app'] });
    const { db } = ctx.config;
    const watch = await createConnection({ host: db.host, port: db.port, user: db.user, password: db.password, database: db.database, charset: 'utf8mb4' });
    await watch.query('SET SESSION group_concat_max_len = 67108864');
    const lane = new Lane(index, world, watch);
    for (const identity of IDENTITIES) lane.callers[identity] = await world.caller(identity);
    for (const key of [...WRITE_ROUTES, ...LIST_ROUTES]) {
      const caller = lane.callerFor(key);
      lane.baselines.set(key, { key, caller, req: await ROUTES[key]!.build(world, caller) });
    }
    await lane.rebaseline();
    return lane;
  }

  async close(): Promise<void> {
    await this.world.close();
    await this.watch.end();
  }

  callerFor(key: string): Caller {
    const { access } = ROUTES[key]!;
    if (access === 'public') return this.callers['signed-out'];
    if (access === 'signed-in') return this.callers.member;
    return this.callers[access[0]!];
  }

  baseline(key: string): Baseline {
    return this.baselines.get(key)!;
  }

  /** The query over this lane's rows; the list of its bookings is read afresh each time. */
  private async buildSql(): Promise<void> {
    const { world, watch } = this;
    const [columns] = (await watch.query(
      'SELECT table_name AS t, column_name AS c FROM information_schema.columns WHERE table_schema = DATABASE() ORDER BY ordinal_position',
    )) as unknown as [{ t: string; c: string }[]];
    const cols = (table: string) => columns.filter((r) => r.t === table).map((r) => r.c);
    const list = (values: Iterable<number>, quote = false) => {
      const all = [...values];
      return `(${all.length > 0 ? all.map((v) => (quote ? `'${v}'` : String(v))).join(',') : quote ? "'0'" : '0'})`;
    };
    const [bookings] = (await watch.query(`SELECT id FROM bookings WHERE person_id IN ${list(world.people)} ORDER BY id`)) as unknown as [{ id: number }[]];
    const bookingIds = bookings.map((b) => b.id);
    const P = list(world.people);
    const I = list(world.items);
    const B = list(bookingIds);
    const [[floor]] = (await watch.query(
      'SELECT (SELECT IFNULL(MAX(id), 0) FROM audit_events) AS audit, (SELECT IFNULL(MAX(id), 0) FROM outbox) AS outbox',
    )) as unknown as [{ audit: number; outbox: number }[]];
    const emails = [...world.emails];
    const where: Record<string, string> = {
      people: `id IN ${P}`,
      items: `id IN ${I}`,
      // By person, not by the id list: a booking a refused request wrongly added shows here.
      bookings: `person_id IN ${P}`,
      booking_items: `booking_id IN ${B}`,
      approvals: `booking_id IN ${B} OR officer_id IN ${P}`,
      booking_scans: `booking_id IN ${B} OR scanned_by IN ${P}`,
      checklist_runs: `booking_id IN ${B} OR completed_by IN ${P}`,
      inspections: `item_id IN ${I} OR inspector_id IN ${P}`,
      item_files: `item_id IN ${I} OR booking_id IN ${B} OR uploaded_by IN ${P}`,
      qualifications: `person_id IN ${P} OR recorded_by IN ${P}`,
      lab_rules: `updated_by IN ${P}`,
      checklist_templates: `id IN ${list(world.templates)}`,
      outbox:
        `id > ? AND to_address IN (${emails.map(() => '?').join(',')}) ` +
        // Incident notices go to every officer whoever reports; a wrongly written report shows in incidents itself.
        `AND kind NOT IN ('overdue-officer', 'overdue-member', 'inspection-digest', 'incident-reported') ` +
        `AND (kind <> 'approval-requested' OR SUBSTRING_INDEX(SUBSTRING_INDEX(dedupe_key, ':', 2), ':', -1) IN ${list(bookingIds, true)}) ` +
        // Mail to every officer about someone's bookings: only this lane's people and bookings count.
        `AND (kind <> 'bench-run-beyond-plan' OR SUBSTRING_INDEX(SUBSTRING_INDEX(dedupe_key, ':', 2), ':', -1) IN ${list(bookingIds, true)}) ` +
        `AND (kind <> 'bookings-cancelled' OR SUBSTRING_INDEX(SUBSTRING_INDEX(dedupe_key, ':', 2), ':', -1) IN ${list(world.people, true)})`,
      person_tokens: `person_id IN ${P}`,
      audit_events:
        `id > ? AND (actor_id IN ${P} OR (entity IN ('person', 'qualification') AND entity_id IN ${list(world.people, true)}) ` +
        `OR (entity = 'item' AND entity_id IN ${list(world.items, true)}) OR (entity = 'checklist-template' AND entity_id IN ${list(world.templates, true)}) ` +
        `OR (entity = 'booking' AND entity_id IN ${list(bookingIds, true)}))`,
      incidents: `reported_by IN ${P} OR booking_id IN ${B} OR id IN (SELECT incident_id FROM incident_items WHERE item_id IN ${I})`,
      calendar_feeds: `person_id IN ${P}`,
    };
    // In statement order: the outbox floor and addresses, then the audit floor.
    this.bindings = [String(floor!.outbox), ...emails, String(floor!.audit)];
    this.sql = Object.entries(where)
      .map(([table, condition]) => {
        const names = APPEND_ONLY_COLUMNS[table] ?? cols(table);
        if (names.length === 0) throw new Error(`no columns for ${table}`);
        const row = `MD5(CONCAT_WS(',', ${names.map((c) => `QUOTE(\`${c}\`)`).join(', ')}))`;
        return `SELECT '${table}' AS t, COUNT(*) AS n, MD5(IFNULL(GROUP_CONCAT(${row} ORDER BY ${row} SEPARATOR ''), '')) AS h FROM \`${table}\` WHERE ${condition}`;
      })
      .join(' UNION ALL ');
  }

  private async snapshot(): Promise<string> {
    const [rows] = (await this.watch.execute(this.sql, this.bindings)) as unknown as [{ t: string; n: number; h: string }[]];
    return rows.map((r) => `${r.t}:${r.n}:${r.h}`).join('\n');
  }

  async rebaseline(): Promise<void> {
    await this.buildSql();
    this.last = await this.snapshot();
  }

  /**
   * Proves the snapshot sees a change in each watched table: makes one inside a transaction on
   * the lane's own connection (which reads its own uncommitted rows), snapshots, rolls back.
   * lab_rules is left out: locking the one shared row would stall every other suite.
   */
  async tablesNoticed(): Promise<Record<string, boolean>> {
    await this.rebaseline();
    const q = async <T>(sql: string, values: unknown[] = []) => (await this.watch.query(sql, values))[0] as unknown as T;
    const [person] = [...this.world.people];
    const [item, otherItem] = [...this.world.items];
    const [template] = [...this.world.templates];
    const [booking] = await q<{ id: number; item: number }[]>(
      'SELECT b.id, MIN(bi.item_id) AS item FROM bookings b JOIN booking_items bi ON bi.booking_id = b.id WHERE b.person_id = ? GROUP BY b.id ORDER BY b.id LIMIT 1',
      [this.world.owner.person!.id],
    );
    const [email] = [...this.world.emails];
    const b = booking!.id;
    const changes: Record<string, [string, unknown[]]> = {
      people: ['UPDATE people SET name = CONCAT(name, ?) WHERE id = ?', ['~', person]],
      items: ['UPDATE items SET notes = CONCAT(notes, ?) WHERE id = ?', ['~', item]],
      bookings: ['UPDATE bookings SET purpose = CONCAT(purpose, ?) WHERE id = ?', ['~', b]],
      booking_items: ['UPDATE booking_items SET live = NOT live WHERE booking_id = ?', [b]],
      approvals: ["INSERT INTO approvals (booking_id, officer_id, decision, plan_version) VALUES (?, ?, 'approve', 1)", [b, person]],
      booking_scans: ['INSERT INTO booking_scans (booking_id, item_id, scanned_by) VALUES (?, ?, ?)', [b, otherItem, person]],
      checklist_runs: [
        "INSERT INTO checklist_runs (booking_id, phase, plan_version, answers, complete, within_limits, completed_by) VALUES (?, 'pre', 1, '[]', 1, 1, ?)",
        [b, person],
      ],
      inspections: [
        "INSERT INTO inspections (item_id, inspected_on, inspector_id, result, readings, notes, next_due) VALUES (?, '2026-01-01', ?, 'pass', '[]', '', '2027-01-01')",
        [item, person],
      ],
      item_files: [
        "INSERT INTO item_files (item_id, kind, file_name, content_type, size_bytes, storage_key, sha256, uploaded_by) VALUES (?, 'photo', 'x.png', 'image/png', 1, ?, '0', ?)",
        [item, `probe/${Date.now()}-${Math.random()}`, person],
      ],
      qualifications: ['UPDATE qualifications SET notes = CONCAT(notes, ?) WHERE person_id = ?', ['~', person]],
      checklist_templates: ['UPDATE checklist_templates SET text = CONCAT(text, ?) WHERE id = ?', ['~', template]],
      outbox: [
        "INSERT INTO outbox (kind, to_address, subject, text_body, html_body, next_attempt_at) VALUES ('invitation', ?, 's', 't', 'h', NOW(3))",
        [email],
      ],
      person_tokens: [
        "INSERT INTO person_tokens (person_id, purpose, token_hash, expires_at) VALUES (?, 'password-reset', ?, NOW(3))",
        [person, `${Date.now()}${Math.random()}`.slice(0, 64)],
      ],
      audit_events: ["INSERT INTO audit_events (actor_id, entity, entity_id, action, prev_hash, hash) VALUES (?, 'probe', '0', 'probe', '0', '0')", [person]],
      incidents: ["INSERT INTO incidents (booking_id, kind, description, reported_by) VALUES (?, 'near-miss', 'probe', ?)", [b, person]],
      calendar_feeds: [
        'INSERT INTO calendar_feeds (person_id, token_hash, nonce) VALUES (?, ?, ?)',
        [person, `${Date.now()}${Math.random()}`.replace(/\D/g, '').padEnd(64, '0').slice(0, 64), '0'.repeat(32)],
      ],
    };
    const noticed: Record<string, boolean> = {};
    for (const [table, [sql, values]] of Object.entries(changes)) {
      await this.watch.beginTransaction();
      try {
        await this.watch.query(sql, values);
        noticed[table] = changedTables(this.last, await this.snapshot()).startsWith(`${table} `);
      } finally {
        await this.watch.rollback();
      }
    }
    // And the control: with every change rolled back the snapshot is the baseline again.
    noticed['(none after rollback)'] = (await this.snapshot()) === this.last;
    return noticed;
  }

  private record(sent: Sent, problem: string, status: number, response: string): void {
    violations.push({ ...sent, lane: this.index, body: sent.body?.slice(0, 300), problem, status, response: response.slice(0, 300) });
  }

  /** Sends one request and checks the answer and the lane's rows. */
  async inspect(sent: Sent, run: () => PromiseLike<Res>): Promise<void> {
    let res: Res;
    try {
      res = await run();
    } catch (error) {
      // The client could not form the request (a header it refuses to send): no server answer to judge.
      const message = error instanceof Error ? error.message : String(error);
      if (/timeout|socket hang up|ECONNRESET/i.test(message)) this.record(sent, `no answer: ${message}`, 0, '');
      await this.rebaseline();
      return;
    }
    tally.requests += 1;
    tally.byStatus[res.status] = (tally.byStatus[res.status] ?? 0) + 1;
    const text = typeof res.text === 'string' ? res.text : '';
    const type = String(res.headers['content-type'] ?? '');
    let echo = `${sent.url} ${sent.body ?? ''} ${sent.note ?? ''}`.toLowerCase();
    try {
      echo += ` ${decodeURIComponent(sent.url).toLowerCase()}`;
    } catch {
      // an undecodable URL is echoed, if at all, as sent
    }

    if (res.status >= 500) this.record(sent, `status ${res.status}`, res.status, text);
    if (!/application\/pdf|image\//.test(type)) {
      const stack = leaks(text, STACK, echo);
      if (stack) this.record(sent, `stack trace in the answer: ${stack}`, res.status, text);
      const sql = leaks(text, res.status >= 400 ? SQL_IN_ERRORS : SQL_IN_DATA, echo);
      if (sql) this.record(sent, `SQL in the answer: ${sql}`, res.status, text);
      if (/ECONNREFUSED/.test(text)) this.record(sent, 'ECONNREFUSED in the answer', res.status, text);
    }
    if (res.status >= 400) {
      const body = res.body as { error?: { code?: unknown; message?: unknown } } | undefined;
      if (!type.includes('application/json') || typeof body?.error?.code !== 'string' || typeof body.error.message !== 'string') {
        this.record(sent, 'error without the { error: { code, message } } envelope', res.status, text);
      }
    }
    if (res.status >= 400 && res.status < 500) {
      const after = await this.snapshot();
      if (after !== this.last) this.record(sent, `refused with ${res.status} but changed the database: ${changedTables(this.last, after)}`, res.status, text);
      this.last = after;
    } else {
      // A success may add bookings of the lane's people: read them again for the next baseline.
      await this.rebaseline();
    }
  }
}

function agentCall(who: Caller, method: string, url: string) {
  const m = method.toLowerCase() as 'get' | 'post' | 'put' | 'patch' | 'delete';
  let test = who.agent[m](url).timeout(20_000);
  if (method !== 'GET') test = test.set('x-csrf-token', who.csrf());
  return test;
}

function urlOf(key: string, params: Record<string, string | number> = {}, query = ''): string {
  const { pattern } = splitRoute(key);
  const encoded = Object.fromEntries(Object.entries(params).map(([k, v]) => [k, pct(String(v))]));
  return fillPath(pattern, encoded) + (query ? `?${query}` : '');
}

function queryText(query: Record<string, string> = {}): string {
  return Object.entries(query)
    .map(([k, v]) => `${pct(k)}=${pct(v)}`)
    .join('&');
}

/** Refuses inputs that would act on shared state if they happened to be valid (see the header). */
function unsafe(lane: Lane, key: string, body: unknown): boolean {
  const schemaAccepts = (schema: { safeParse(v: unknown): { success: boolean } }) => schema.safeParse(body).success;
  const ownsItems = () => {
    const ids = (body as { itemIds?: unknown } | null)?.itemIds;
    return !Array.isArray(ids) || ids.every((id) => lane.world.items.has(id as number));
  };
  switch (key) {
    case 'PUT /api/lab-rules':
      return schemaAccepts(labRulesSchema);
    case 'POST /api/checklist-templates':
    case 'PUT /api/checklist-templates/:id':
      return schemaAccepts(checklistTemplateItemSchema);
    case 'POST /api/bookings':
      return schemaAccepts(bookingCreateSchema) && !ownsItems();
    case 'PATCH /api/bookings/:id':
      return schemaAccepts(bookingUpdateSchema) && !ownsItems();
    default:
      return false;
  }
}

function parseOrNull(text: string): unknown {
  try {
    return JSON.parse(text);
  } catch {
    return undefined;
  }
}

const started = Date.now();

beforeAll(async () => {
  ctx = createSecurityContext({ LOGIN_RATE_LIMIT: '1000000' });
  // One listening server for every request (supertest would otherwise start one per request).
  server = createServer(ctx.app);
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  lanes = await Promise.all(Array.from({ length: LANES }, (_, i) => Lane.open(i)));
}, 300_000);

afterAll(async () => {
  await Promise.all(lanes.map((lane) => lane.close()));
  await new Promise<void>((resolve) => (server ? server.close(() => resolve()) : resolve()));
  await ctx?.close();
});

function report(property: string): void {
  const distinct = new Map<string, Violation & { times: number }>();
  for (const v of violations.filter((x) => x.property === property)) {
    const id = `${v.key} | ${v.problem.replace(/\d+ rows/g, 'n rows')}`;
    const seen = distinct.get(id);
    if (seen) seen.times += 1;
    else distinct.set(id, { ...v, times: 1 });
  }
  if (distinct.size > 0) console.log(`fuzz ${property}: ${distinct.size} distinct problems (seed ${SEED}, set FUZZ_SEED to replay)`);
  expect([...distinct.values()]).toEqual([]);
}

/** Runs a property in every lane at once, splitting the runs between the lanes. */
async function inLanes(runs: number, property: (lane: Lane) => fc.IAsyncProperty<never[]> | fc.IAsyncProperty<unknown[]>): Promise<void> {
  await Promise.all(
    lanes.map((lane, i) => fc.assert(property(lane) as fc.IAsyncProperty<unknown[]>, { numRuns: Math.ceil(runs / LANES), seed: SEED + i, endOnFailure: true })),
  );
}

const weightedWrites = WRITE_ROUTES.map((key) => ({ arbitrary: fc.constant(key), weight: SLOW_ROUTES.has(key) ? 1 : 6 }));

describe('the database check', () => {
  it('notices a changed or added row in every watched table', async () => {
    const noticed = await lanes[0]!.tablesNoticed();
    expect(Object.keys(noticed)).toHaveLength(17);
    expect(Object.values(noticed).every(Boolean) ? 'all noticed' : noticed).toBe('all noticed');
  });
});

describe('hostile input (fast-check)', () => {
  it(`JSON bodies on every write route (${RUNS.body} runs)`, async () => {
    await inLanes(RUNS.body, (lane) =>
      fc.asyncProperty(fc.oneof(...weightedWrites), fc.array(mutation, { minLength: 1, maxLength: 3 }), async (key, mutations) => {
        const { caller, req } = lane.baseline(key);
        const text = toJson(mutations.reduce(mutate, fromPlain(req.body ?? {})));
        if (unsafe(lane, key, parseOrNull(text))) return;
        const { method } = splitRoute(key);
        const url = urlOf(key, req.params);
        await lane.inspect({ property: 'body', key, method, url, body: text }, () =>
          agentCall(req.as ?? caller, method, url)
            .set('Content-Type', 'application/json')
            .send(text),
        );
      }),
    );
    report('body');
  }, 600_000);

  it(`path segments on every route with a parameter (${RUNS.params} runs)`, async () => {
    const keys = [...WRITE_ROUTES, ...LIST_ROUTES].filter((k) => paramNames(splitRoute(k).pattern).length > 0);
    const pollutedBody = toJson(
      new Obj([
        ['__proto__', new Obj([['isAdmin', true]])],
        ['x', "' OR 1=1 --"],
      ]),
    );
    await inLanes(RUNS.params, (lane) =>
      fc.asyncProperty(fc.constantFrom(...keys), hostileSegment, fc.boolean(), async (key, segment, hostileBody) => {
        const { method, pattern } = splitRoute(key);
        if (isWrite(method) && looksLikeForeignId(segment)) return;
        const { caller, req } = lane.baseline(key);
        const [name] = paramNames(pattern);
        const encoded = Object.fromEntries(Object.entries(req.params ?? {}).map(([k, v]) => [k, pct(String(v))]));
        const url = fillPath(pattern, { ...encoded, [name!]: segment }) + (req.query ? `?${queryText(req.query)}` : '');
        const text = isWrite(method) ? (hostileBody ? pollutedBody : JSON.stringify(req.body ?? {})) : undefined;
        await lane.inspect({ property: 'params', key, method, url, body: text }, () => {
          const test = agentCall(req.as ?? caller, method, url);
          return text === undefined ? test : test.set('Content-Type', 'application/json').send(text);
        });
      }),
    );
    report('params');
  }, 600_000);

  it(`query strings on the list and search routes (${RUNS.query} runs)`, async () => {
    // Values stay short enough that the URL fits Node's 16 KB header limit (beyond it Node itself
    // answers 431 before the app sees anything).
    const value = fc.oneof(
      { arbitrary: fc.constantFrom(...HOSTILE_STRINGS), weight: 4 },
      { arbitrary: oddString, weight: 2 },
      { arbitrary: codePointString, weight: 1 },
      { arbitrary: fc.integer({ min: 100, max: 2_000 }).map((n) => 'q'.repeat(n)), weight: 1 },
    );
    const name = fc.oneof(
      hostileKey,
      fc.constantFrom('q', 'limit', 'cursor', 'status', 'kind', 'sort', 'from', 'to', 'items', 'entity', 'id', 'mine', 'itemId', 'minKv', 'due'),
    );
    const junk = fc.constantFrom(
      '&&&',
      '=',
      '==',
      '%',
      '%zz',
      'a[b]=c',
      '__proto__[isAdmin]=1',
      'constructor[prototype][polluted]=1',
      'limit=1&limit=2',
      'items=1,2,,,-3',
      `items=${'1,'.repeat(500)}`,
      'cursor=eyJ2IjpudWxsLCJpZCI6MX0',
      'cursor=eyJpZCI6IjEnIE9SIDE9MSJ9',
      'q=%00',
      'sort=__proto__',
    );
    await inLanes(RUNS.query, (lane) =>
      fc.asyncProperty(
        fc.constantFrom(...LIST_ROUTES),
        fc.array(fc.tuple(name, value), { maxLength: 4 }),
        fc.option(junk),
        fc.boolean(),
        async (key, pairs, extra, keepBaseline) => {
          const { caller, req } = lane.baseline(key);
          const parts = [keepBaseline ? queryText(req.query) : '', ...pairs.map(([k, v]) => `${pct(k)}=${pct(v)}`), extra ?? ''].filter((p) => p !== '');
          const url = urlOf(key, req.params, parts.join('&'));
          await lane.inspect({ property: 'query', key, method: 'GET', url }, () => agentCall(caller, 'GET', url));
        },
      ),
    );
    report('query');
  }, 600_000);

  it(`multipart uploads on every upload route (${RUNS.upload} runs)`, async () => {
    // The write routes whose valid request is an upload (item files, booking and incident photos).
    const uploadRoutes = WRITE_ROUTES.filter((k) => lanes[0]!.baseline(k).req.upload !== undefined);
    expect(uploadRoutes).toEqual(['POST /api/bookings/:id/photos', 'POST /api/incidents/:id/photos', 'POST /api/items/:id/files']);
    const PDF = Buffer.from('%PDF-1.4\n1 0 obj<</Type/Catalog>>endobj\ntrailer<</Root 1 0 R>>\n%%EOF\n');
    const contents = fc.constantFrom<[string, Buffer]>(
      ['png', pngBytes()],
      ['pdf', PDF],
      ['html', Buffer.from('<script>alert(1)</script>')],
      ['svg', Buffer.from('<svg xmlns="http://www.w3.org/2000/svg" onload="alert(1)"/>')],
      ['empty', Buffer.alloc(0)],
      ['gif', Buffer.concat([Buffer.from('GIF89a'), Buffer.alloc(20)])],
      ['png signature + html', Buffer.concat([pngBytes().subarray(0, 8), Buffer.from('<html>')])],
    );
    const fileName = fc.oneof(
      fc.constantFrom(
        '../../etc/passwd',
        '..\\evil.png',
        'a/b.png',
        '.png',
        '...',
        'x\u0000.png',
        'gnp\u202E.exe',
        'photo".png',
        "it's.png",
        '🔌.png',
        `${'a'.repeat(300)}.png`,
        '%2e%2e%2fx.png',
        'CON',
        ' ',
        'ok.png',
      ),
      hostileString.filter((s) => s.length < 400),
    );
    const fields = fc.array(
      fc.tuple(
        fc.oneof(fc.constant('kind'), hostileKey),
        fc.oneof(
          fc.constantFrom('photo', 'document', 'PHOTO', ''),
          hostileString.filter((s) => s.length < 2000),
        ),
      ),
      { maxLength: 6 },
    );
    await inLanes(RUNS.upload, (lane) =>
      fc.asyncProperty(
        fc.constantFrom(...uploadRoutes),
        contents,
        fileName,
        fields,
        fc.constantFrom('file', 'files', '__proto__'),
        fc.boolean(),
        async (key, [what, bytes], name, extraFields, fieldName, twice) => {
          const { caller, req } = lane.baseline(key);
          const url = urlOf(key, req.params);
          const note = `${what} as ${JSON.stringify(name)} in field ${fieldName}${twice ? ' twice' : ''}; fields ${JSON.stringify(extraFields.map(([k, v]) => [k, v.slice(0, 50)]))}`;
          await lane.inspect({ property: 'upload', key, method: 'POST', url, note, body: note.slice(0, 300) }, () => {
            let test = agentCall(caller, 'POST', url);
            for (const [k, v] of extraFields) test = test.field(k, v);
            test = test.attach(fieldName, bytes, { filepath: name } as unknown as string);
            if (twice) test = test.attach(fieldName, bytes, { filepath: 'second.png' } as unknown as string);
            return test;
          });
        },
      ),
    );
    report('upload');
  }, 600_000);

  it(`raw bodies and content types on every write route (${RUNS.raw} runs)`, async () => {
    const raw = fc.oneof(
      fc.constantFrom<[string, string]>(
        ['application/json', '{"a":'],
        ['application/json', "{'a':1}"],
        ['application/json', '{"a":1e400}'],
        ['application/json', '{"a":NaN}'],
        ['application/json', '{"a":1,"a":2}'],
        ['application/json', '"just a string"'],
        ['application/json', '42'],
        ['application/json', 'null'],
        ['application/json', '\u0000'],
        ['application/json', '{"__proto__":{"isAdmin":true},"constructor":{"prototype":{"polluted":"yes"}}}'],
        ['application/json', '['.repeat(5000) + ']'.repeat(5000)],
        ['application/json', `{"a":"${'x'.repeat(120_000)}"}`],
        ['application/json; charset=utf-16', '{"a":1}'],
        ['application/json; charset=latin1', '{"a":"\u00e9"}'],
        ['text/plain', "' OR 1=1 --"],
        ['application/xml', '<?xml version="1.0"?><!DOCTYPE x [<!ENTITY e SYSTEM "file:///etc/passwd">]><x>&e;</x>'],
        ['application/x-www-form-urlencoded', 'a=1&__proto__[isAdmin]=1&constructor[prototype][polluted]=1'],
        ['multipart/form-data; boundary=x', '--x\r\nContent-Disposition: form-data; name="__proto__"\r\n\r\n1\r\n--x--'],
        ['multipart/form-data', 'no boundary'],
        ['', '{"a":1}'],
      ),
      fc.tuple(fc.constant('application/json'), fc.string({ unit: 'binary-ascii', maxLength: 200 })),
    );
    await inLanes(RUNS.raw, (lane) =>
      fc.asyncProperty(fc.constantFrom(...WRITE_ROUTES), raw, async (key, [type, text]) => {
        const { caller, req } = lane.baseline(key);
        const { method } = splitRoute(key);
        const url = urlOf(key, req.params);
        await lane.inspect({ property: 'raw', key, method, url, body: `${type}: ${text}` }, () => {
          let test = agentCall(req.as ?? caller, method, url);
          if (type) test = test.set('Content-Type', type);
          return test.send(text);
        });
      }),
    );
    report('raw');
  }, 600_000);
});

describe('hostile inputs the fuzzer found (fixed cases, so they fail until the server is fixed)', () => {
  // A lone UTF-16 surrogate is valid in a JS string and in JSON text, but MariaDB's JSON_VALID
  // rejects "\ud800": any audited free-text field carrying one breaks the audit insert.
  const LONE = 'Bench \ud800 note';
  const cases: [string, string, unknown][] = [
    ['name', 'POST /api/items', { kind: 'meter', name: LONE, location: 'Bay 1', ratings: { maxKv: null } }],
    ['name', 'POST /api/invitations', { email: `lone-${Date.now()}@test.voltcrib.example`, name: LONE, role: 'member' }],
    ['purpose', 'PATCH /api/bookings/:id', { purpose: LONE }],
    ['notes', 'POST /api/items/:id/inspections', { result: 'pass', notes: LONE }],
    ['notes', 'PUT /api/people/:id/qualification', { authorisedKv: 10, expiresOn: '2030-01-01', notes: LONE }],
  ];

  async function sendKnown(
    key: string,
    sent: Omit<Sent, 'property' | 'key' | 'method' | 'url'>,
    attach: (test: ReturnType<typeof agentCall>) => ReturnType<typeof agentCall>,
  ) {
    const lane = lanes[0]!;
    const caller = lane.callerFor(key);
    const req = await ROUTES[key]!.build(lane.world, caller);
    await lane.rebaseline();
    const { method } = splitRoute(key);
    const url = urlOf(key, req.params);
    const before = violations.length;
    await lane.inspect({ property: 'known', key, method, url, ...sent }, () => attach(agentCall(caller, method, url)));
    return violations.slice(before);
  }

  it.each(cases)('a lone surrogate in the %s sent to %s answers below 500', async (_field, key, body) => {
    const text = JSON.stringify(body);
    expect(await sendKnown(key, { body: text }, (test) => test.set('Content-Type', 'application/json').send(text))).toEqual([]);
  });

  it('a PNG signature followed by anything else, sent to POST /api/items/:id/files, answers below 500', async () => {
    const bytes = Buffer.concat([pngBytes().subarray(0, 8), Buffer.from('<html>')]);
    const found = await sendKnown('POST /api/items/:id/files', { note: 'PNG signature + "<html>" as ok.png' }, (test) =>
      test.attach('file', bytes, { filepath: 'ok.png' } as unknown as string),
    );
    expect(found).toEqual([]);
  });
});

describe('after the run', () => {
  it('sent at least 10,000 requests and polluted no prototype', () => {
    const seconds = Math.round((Date.now() - started) / 1000);
    console.log(
      `fuzz: ${tally.requests} requests in ${seconds} s over ${LANES} lanes (seed ${SEED}); answers by status ${JSON.stringify(tally.byStatus)}; ${violations.length} violations`,
    );
    expect(tally.requests).toBeGreaterThanOrEqual(10_000);
    expect(Object.getOwnPropertyNames(Object.prototype).sort()).toEqual(prototypeBefore);
    const probe = {} as Record<string, unknown>;
    expect([probe.isAdmin, probe.polluted, probe.role, probe.deep]).toEqual([undefined, undefined, undefined, undefined]);
  });
});
