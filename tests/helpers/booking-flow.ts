// Drives a booking through the counter steps with the real API.
import { expect } from '@jest/globals';
import type { signedInAs } from './test-app';

type Who = Awaited<ReturnType<typeof signedInAs>>;
type Entry = { id: number; kind: string; min?: number; max?: number; required: boolean };

export const post = (who: Who, path: string, body: unknown = {}) =>
  who.agent
    .post(path)
    .set('x-csrf-token', who.csrf())
    .send(body as object);
export const put = (who: Who, path: string, body: unknown = {}) =>
  who.agent
    .put(path)
    .set('x-csrf-token', who.csrf())
    .send(body as object);

/**
 * Answers every required line; readings get the middle of their limits unless overridden. A
 * required photo line is sent without a photo (the server names it): only a photo uploaded to the
 * booking itself answers one (tests/api/bookings/photos.test.ts).
 */
export function answersFor(entries: Entry[], readings: Record<number, number> = {}) {
  return entries
    .filter((e) => e.required)
    .map((e) => {
      if (e.kind === 'confirm') return { itemId: e.id, confirmed: true };
      if (e.kind === 'reading') return { itemId: e.id, value: readings[e.id] ?? ((e.min ?? 0) + (e.max ?? (e.min ?? 0) + 10)) / 2 };
      return { itemId: e.id };
    });
}

export async function scanAll(who: Who, booking: { id: number; items: { tag: string }[] }) {
  for (const item of booking.items) {
    const res = await post(who, `/api/bookings/${booking.id}/scans`, { tag: item.tag });
    expect(res.status).toBe(200);
  }
}

export async function completePre(who: Who, booking: { id: number; checklist: { pre: Entry[] } }, readings: Record<number, number> = {}) {
  const res = await post(who, `/api/bookings/${booking.id}/checklist`, { phase: 'pre', answers: answersFor(booking.checklist.pre, readings) });
  expect(res.status).toBe(200);
  return res.body.booking;
}
