// The session rows this process read lately, so a signed-in request does not need a database round
// trip to learn who is asking. Every round trip costs the server a context switch; in the bench the
// session read was a third of a signed-in list's database work.
//
// Safe because every way a session ends in this process drops its copy at once: sign-out and
// regeneration (the store's destroy and set), a person's sessions ended on deactivation, role change
// or new password (`forgetPerson`), and the session's own expiry (checked on every read). Another
// server process sharing the database would see those only after FRESH_MS, so a deployment of
// several processes (`npm run cluster`, README "Several machines") sets SESSION_CACHE_MS=0 and
// every request reads its session row: a signed-out or deactivated person is refused at once on
// every process (tests/cluster/sessions.test.ts).
// A read that started before a session was ended is not kept (the generation check), so a
// concurrent request cannot put an ended session back.
import type { Db } from '../db';

/** How long a copy is used before the row is read again (SESSION_CACHE_MS; 0: no copies). */
export const DEFAULT_FRESH_MS = 5_000;
/** A bound on memory: the oldest copies go first. */
const MAX_ENTRIES = 10_000;

interface Entry {
  at: number;
  /** The stored JSON, parsed afresh per request: express-session mutates what it is given. */
  json: string;
  expiresMs: number;
  personId: number | null;
}

export class SessionCache {
  private readonly entries = new Map<string, Entry>();
  private generation = 0;

  constructor(private readonly freshMs = DEFAULT_FRESH_MS) {}

  /** Call before reading a row; pass the value to `keep`. */
  begin(): number {
    return this.generation;
  }

  /** A fresh, unexpired copy of the session row, or undefined. */
  read(sid: string, now = Date.now()): { json: string; expiresMs: number } | undefined {
    const entry = this.entries.get(sid);
    if (!entry) return undefined;
    if (now - entry.at > this.freshMs || entry.expiresMs <= now) {
      this.entries.delete(sid);
      return undefined;
    }
    return entry;
  }

  /** Keeps a row read since `begin`, unless any session was ended in between. */
  keep(sid: string, json: string, expiresMs: number, startedAt: number): void {
    if (startedAt !== this.generation || this.freshMs <= 0) return;
    this.entries.delete(sid);
    if (this.entries.size >= MAX_ENTRIES) this.entries.delete(this.entries.keys().next().value!);
    this.entries.set(sid, { at: Date.now(), json, expiresMs, personId: personIdOf(json) });
  }

  forget(sid: string): void {
    this.generation += 1;
    this.entries.delete(sid);
  }

  forgetPerson(personId: number): void {
    this.generation += 1;
    for (const [sid, entry] of this.entries) if (entry.personId === personId) this.entries.delete(sid);
  }
}

function personIdOf(json: string): number | null {
  const id = (JSON.parse(json) as { passport?: { user?: { id?: unknown } } }).passport?.user?.id;
  return typeof id === 'number' ? id : null;
}

const caches = new WeakMap<Db, SessionCache>();

/**
 * One cache per database handle: the session store and the people service share it. The store
 * creates it first (app.ts), with the configured freshness; later callers get that one.
 */
export function sessionCacheOf(db: Db, freshMs = DEFAULT_FRESH_MS): SessionCache {
  let cache = caches.get(db);
  if (!cache) {
    cache = new SessionCache(freshMs);
    caches.set(db, cache);
  }
  return cache;
}
