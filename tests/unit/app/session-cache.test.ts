// The per-process copy of session rows: freshness, expiry, invalidation and its memory bound.
import { SessionCache } from '../../../server/auth/session-cache';

const json = (personId: number) => JSON.stringify({ cookie: {}, passport: { user: { id: personId } } });

describe('SessionCache', () => {
  it('serves a kept row for five seconds, never past the session expiry', () => {
    const cache = new SessionCache();
    const now = Date.now();
    cache.keep('a', json(1), now + 60_000, cache.begin());
    cache.keep('b', json(2), now + 1_000, cache.begin());
    expect(cache.read('a', now + 4_900)?.json).toBe(json(1));
    expect(cache.read('a', now + 5_100)).toBeUndefined();
    expect(cache.read('b', now + 999)).toBeDefined();
    expect(cache.read('b', now + 1_000)).toBeUndefined();
  });

  it('drops one session, or every session of a person', () => {
    const cache = new SessionCache();
    const expires = Date.now() + 60_000;
    for (const [sid, person] of [
      ['a', 1],
      ['b', 1],
      ['c', 2],
    ] as const)
      cache.keep(sid, json(person), expires, cache.begin());
    cache.forget('c');
    expect(cache.read('c')).toBeUndefined();
    cache.forgetPerson(1);
    expect(cache.read('a')).toBeUndefined();
    expect(cache.read('b')).toBeUndefined();
  });

  it('does not keep a row read before any session was ended', () => {
    const cache = new SessionCache();
    const started = cache.begin();
    // Another request signs somebody out while this read is on its way.
    cache.forgetPerson(7);
    cache.keep('a', json(7), Date.now() + 60_000, started);
    expect(cache.read('a')).toBeUndefined();
  });

  it('holds at most 10 000 rows, dropping the oldest', () => {
    const cache = new SessionCache();
    const expires = Date.now() + 60_000;
    for (let i = 0; i <= 10_000; i += 1) cache.keep(`s${i}`, json(i), expires, cache.begin());
    expect(cache.read('s0')).toBeUndefined();
    expect(cache.read('s1')).toBeDefined();
    expect(cache.read('s10000')).toBeDefined();
  });
});
