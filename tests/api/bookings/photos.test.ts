// Checklist photos: POST /api/bookings/:id/photos stores a photo for a booking's checklist, and a
// checklist answer may only name a photo of its own booking. The required photo line here applies
// only to bookings holding an item of kind "other", which no other suite books.
import { PNG } from 'pngjs';
import request from 'supertest';
import { createApp } from '../../../server/app';
import { UnavailableError } from '../../../server/errors';
import { createLogger } from '../../../server/logger';
import { createObjectStore, type ObjectStore } from '../../../server/storage/object-store';
import { post } from '../../helpers/booking-flow';
import { insertItem, insertKit, plan, qualify, windowFromNow } from '../../helpers/gear';
import { createTestContext, signedInAgent, signedInAs, uniqueWord, type TestContext } from '../../helpers/test-app';

let ctx: TestContext;
let member: Awaited<ReturnType<typeof signedInAs>>;
let officer: Awaited<ReturnType<typeof signedInAs>>;
let photoLineId: number;

function pngBytes(): Buffer {
  const png = new PNG({ width: 4, height: 4 });
  png.data.fill(120);
  return PNG.sync.write(png);
}
const PDF_BYTES = Buffer.from(
  '%PDF-1.4\n1 0 obj<</Type/Catalog/Pages 2 0 R>>endobj 2 0 obj<</Type/Pages/Kids[]/Count 0>>endobj\ntrailer<</Root 1 0 R>>\n%%EOF\n',
);

beforeAll(async () => {
  ctx = createTestContext();
  member = await signedInAs(ctx, 'member');
  officer = await signedInAs(ctx, 'officer');
  await qualify(ctx.db, member.person.id, 20);
  const line = await post(officer, '/api/checklist-templates', {
    phase: 'pre',
    kind: 'photo',
    text: `Photo of the barrier before energizing ${uniqueWord()}`,
    required: true,
    appliesWithKind: 'other',
  });
  expect(line.status).toBe(201);
  photoLineId = line.body.template.id;
});
afterAll(async () => {
  await ctx.db('checklist_templates').where({ id: photoLineId }).update({ active: false });
  await ctx.close();
});

type Who = typeof member;
type Entry = { id: number; kind: string; required: boolean; min?: number; max?: number };

/** A 10 kV booking of a full kit plus an "other" item, so the required photo line applies. */
async function newBooking(who: Who = member) {
  const kit = await insertKit(ctx.db);
  const rig = await insertItem(ctx.db, 'other', { ratings: { maxKv: 40 } });
  const res = await post(who, '/api/bookings', {
    itemIds: [...kit.all.map((i) => i.id), rig.id],
    ...windowFromNow(),
    location: 'Bay 4',
    purpose: 'Barrier photo test',
    plan: plan(10),
  });
  expect(res.status).toBe(201);
  return res.body.booking as { id: number; status: string; checklist: { pre: Entry[] } };
}

const upload = (who: Who, bookingId: number, name: string, bytes: Buffer) =>
  who.agent
    .post(`/api/bookings/${bookingId}/photos`)
    .set('x-csrf-token', who.csrf())
    .attach('file', bytes, { filepath: name } as unknown as string);

/** Every required line answered; every photo line (ours and any a parallel suite added) gets `fileId`. */
function answers(entries: Entry[], fileId: number | undefined) {
  return entries
    .filter((e) => e.required || e.kind === 'photo')
    .map((e) => {
      if (e.kind === 'confirm') return { itemId: e.id, confirmed: true };
      if (e.kind === 'reading') return { itemId: e.id, value: ((e.min ?? 0) + (e.max ?? (e.min ?? 0) + 10)) / 2 };
      return fileId === undefined ? { itemId: e.id } : { itemId: e.id, fileId };
    });
}

async function photoRows(bookingId: number) {
  return ctx.db('item_files').where({ booking_id: bookingId }).select('id', 'storage_key');
}

describe('POST /api/bookings/:id/photos', () => {
  it('stores a photo for the booker, audited, and serves it to the booker and staff only', async () => {
    const booking = await newBooking();
    const bytes = pngBytes();
    const res = await upload(member, booking.id, 'barrier.png', bytes);
    expect(res.status).toBe(201);
    expect(res.body.file).toEqual({
      id: expect.any(Number),
      bookingId: booking.id,
      kind: 'photo',
      fileName: 'barrier.png',
      contentType: 'image/png',
      sizeBytes: bytes.length,
      uploadedAt: expect.any(String),
      uploadedByName: expect.any(String),
    });
    const fileId = res.body.file.id as number;
    expect(await ctx.db('item_files').where({ id: fileId }).first('item_id', 'booking_id', 'kind')).toEqual({
      item_id: null,
      booking_id: booking.id,
      kind: 'photo',
    });

    const audit = await officer.agent.get(`/api/audit?entity=booking&id=${booking.id}`).expect(200);
    expect(audit.body.events[0]).toMatchObject({ action: 'booking.photo-added', after: { fileId, fileName: 'barrier.png', contentType: 'image/png' } });

    const mine = await member.agent.get(`/api/files/${fileId}`);
    expect(mine.status).toBe(200);
    expect(mine.headers['content-type']).toBe('image/png');
    expect(mine.headers['x-content-type-options']).toBe('nosniff');
    expect(mine.headers['content-disposition']).toMatch(/^inline; filename="barrier.png"/);
    expect((await officer.agent.get(`/api/files/${fileId}`)).status).toBe(200);
    const other = await signedInAs(ctx, 'member');
    expect((await other.agent.get(`/api/files/${fileId}`)).status).toBe(404);
    expect((await request(ctx.app).get(`/api/files/${fileId}`)).status).toBe(401);
  });

  it("lets staff working the counter attach a photo to a member's booking", async () => {
    const booking = await newBooking();
    expect((await upload(officer, booking.id, 'stand.png', pngBytes())).status).toBe(201);
  });

  it('judges by content: a PDF named .jpg is refused with 415 and nothing is stored', async () => {
    const booking = await newBooking();
    const res = await upload(member, booking.id, 'barrier.jpg', PDF_BYTES);
    expect(res.status).toBe(415);
    expect(res.body.error).toMatchObject({ code: 'UNSUPPORTED_FILE_TYPE', message: 'A photo must be a JPEG, PNG or WebP image.' });
    expect(await photoRows(booking.id)).toEqual([]);
  });

  it('refuses a request without a file, with other fields, or with a path for a name (400, nothing stored)', async () => {
    const booking = await newBooking();
    const none = await member.agent.post(`/api/bookings/${booking.id}/photos`).set('x-csrf-token', member.csrf()).field('note', 'x');
    expect(none.status).toBe(400);
    const extra = await member.agent
      .post(`/api/bookings/${booking.id}/photos`)
      .set('x-csrf-token', member.csrf())
      .field('kind', 'photo')
      .attach('file', pngBytes(), 'a.png');
    expect(extra.status).toBe(400);
    expect((await upload(member, booking.id, '../../barrier.png', pngBytes())).status).toBe(400);
    expect(await photoRows(booking.id)).toEqual([]);
  });

  it('answers 404 to another member, as for any booking they cannot see, and stores nothing', async () => {
    const booking = await newBooking();
    const other = await signedInAs(ctx, 'member');
    const res = await upload(other, booking.id, 'barrier.png', pngBytes());
    expect(res.status).toBe(404);
    expect((await upload(member, 99999999, 'barrier.png', pngBytes())).status).toBe(404);
    expect(await photoRows(booking.id)).toEqual([]);
  });

  it('refuses a cancelled booking with 409', async () => {
    const booking = await newBooking();
    await post(member, `/api/bookings/${booking.id}/cancel`).expect(200);
    const res = await upload(member, booking.id, 'barrier.png', pngBytes());
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('BOOKING_LOCKED');
    expect(await photoRows(booking.id)).toEqual([]);
  });
});

describe('a required photo line in the checklist', () => {
  it("refuses a missing, unknown, foreign or item photo on the line with 400 and records nothing; accepts the booking's own", async () => {
    const booking = await newBooking();
    expect(booking.checklist.pre.some((e) => e.id === photoLineId)).toBe(true);
    const own = (await upload(member, booking.id, 'barrier.png', pngBytes())).body.file.id as number;
    const elsewhere = await newBooking();
    const foreign = (await upload(member, elsewhere.id, 'other-barrier.png', pngBytes())).body.file.id as number;
    const probe = await insertItem(ctx.db, 'probe');
    const itemFile = await officer.agent.post(`/api/items/${probe.id}/files`).set('x-csrf-token', officer.csrf()).attach('file', pngBytes(), 'probe.png');
    expect(itemFile.status).toBe(201);

    const submit = (fileId: number | undefined) =>
      post(member, `/api/bookings/${booking.id}/checklist`, { phase: 'pre', answers: answers(booking.checklist.pre, fileId) });
    const cases: [string, number | undefined, RegExp][] = [
      ['missing', undefined, /^Attach the photo/],
      ['unknown', 99999999, /not taken for this booking/],
      ["another booking's", foreign, /not taken for this booking/],
      ["an item's file", itemFile.body.file.id as number, /not taken for this booking/],
    ];
    for (const [what, fileId, message] of cases) {
      const res = await submit(fileId);
      expect({ what, status: res.status }).toEqual({ what, status: 400 });
      expect(res.body.error.fieldErrors[`answers.${photoLineId}`]).toEqual([expect.stringMatching(message)]);
    }
    expect(await ctx.db('checklist_runs').where({ booking_id: booking.id })).toEqual([]);

    const ok = await submit(own);
    expect(ok.status).toBe(200);
    const run = await ctx.db('checklist_runs').where({ booking_id: booking.id }).first('answers');
    const snapshot = (typeof run.answers === 'string' ? JSON.parse(run.answers) : run.answers) as { id: number; fileId?: number }[];
    expect(snapshot.find((a) => a.id === photoLineId)?.fileId).toBe(own);
  });

  it('refuses a photo sent on a line that takes none', async () => {
    const booking = await newBooking();
    const own = (await upload(member, booking.id, 'barrier.png', pngBytes())).body.file.id as number;
    const confirm = booking.checklist.pre.find((e) => e.kind === 'confirm' && e.required)!;
    const body = answers(booking.checklist.pre, own).map((a) => (a.itemId === confirm.id ? { ...a, fileId: own } : a));
    const res = await post(member, `/api/bookings/${booking.id}/checklist`, { phase: 'pre', answers: body });
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors[`answers.${confirm.id}`]).toEqual(['This line takes no photo.']);
  });
});

describe('GET /api/bookings/:id/checklist-runs', () => {
  type Run = {
    id: number;
    phase: string;
    planVersion: number;
    current: boolean;
    withinLimits: boolean;
    completedAt: string;
    completedByName: string;
    answers: { id: number; kind: string; text: string; confirmed?: boolean; value?: number; fileId?: number; withinLimits: boolean }[];
  };

  it('shows every run as answered, newest first, with its photo, readings, who and when', async () => {
    const booking = await newBooking();
    const photo = (await upload(member, booking.id, 'barrier.png', pngBytes())).body.file.id as number;
    expect((await member.agent.get(`/api/bookings/${booking.id}/checklist-runs`)).body).toEqual({ runs: [] });

    const before = Date.now();
    expect((await post(member, `/api/bookings/${booking.id}/checklist`, { phase: 'pre', answers: answers(booking.checklist.pre, photo) })).status).toBe(200);
    // Answered again by the officer at the counter: a second run, not an edit of the first.
    expect((await post(officer, `/api/bookings/${booking.id}/checklist`, { phase: 'pre', answers: answers(booking.checklist.pre, photo) })).status).toBe(200);

    const res = await member.agent.get(`/api/bookings/${booking.id}/checklist-runs`);
    expect(res.status).toBe(200);
    const runs = res.body.runs as Run[];
    expect(runs.map((r) => [r.phase, r.completedByName, r.current, r.planVersion])).toEqual([
      ['pre', officer.person.name, true, 1],
      ['pre', member.person.name, true, 1],
    ]);
    expect(runs[0]!.id).toBeGreaterThan(runs[1]!.id);
    expect(Date.parse(runs[1]!.completedAt)).toBeGreaterThanOrEqual(before - 1000);
    const lines = runs[1]!.answers;
    expect(lines.map((l) => l.id)).toEqual(booking.checklist.pre.map((e) => e.id));
    expect(lines.find((l) => l.id === photoLineId)).toMatchObject({ kind: 'photo', fileId: photo, withinLimits: true });
    for (const entry of booking.checklist.pre.filter((e) => e.required && e.kind === 'reading')) {
      const line = lines.find((l) => l.id === entry.id)!;
      expect(line.value).toBe(((entry.min ?? 0) + (entry.max ?? (entry.min ?? 0) + 10)) / 2);
      expect(line.withinLimits).toBe(true);
    }
    // The photo the record names is the booking's, served to whoever sees the record.
    expect((await officer.agent.get(`/api/files/${photo}`)).status).toBe(200);
  });

  it('marks runs of an earlier plan as no longer current', async () => {
    const booking = await newBooking();
    const photo = (await upload(member, booking.id, 'barrier.png', pngBytes())).body.file.id as number;
    expect((await post(member, `/api/bookings/${booking.id}/checklist`, { phase: 'pre', answers: answers(booking.checklist.pre, photo) })).status).toBe(200);
    const changed = await member.agent
      .patch(`/api/bookings/${booking.id}`)
      .set('x-csrf-token', member.csrf())
      .send({ plan: plan(12) });
    expect(changed.status).toBe(200);
    const runs = (await member.agent.get(`/api/bookings/${booking.id}/checklist-runs`)).body.runs as Run[];
    expect(runs.map((r) => [r.planVersion, r.current])).toEqual([[1, false]]);
  });

  it('answers 404 to another member and for a booking that does not exist, 400 for a bad id', async () => {
    const booking = await newBooking();
    const other = await signedInAs(ctx, 'member');
    expect((await other.agent.get(`/api/bookings/${booking.id}/checklist-runs`)).status).toBe(404);
    expect((await member.agent.get('/api/bookings/99999999/checklist-runs')).status).toBe(404);
    expect((await member.agent.get('/api/bookings/abc/checklist-runs')).status).toBe(400);
  });
});

describe('nothing is half-stored', () => {
  /** The real bucket, with a hook that runs while the object is being stored. */
  function storeWith(duringPut: () => Promise<void>): ObjectStore & { keys: string[] } {
    const real = createObjectStore(ctx.config);
    const keys: string[] = [];
    return {
      keys,
      async put(key, body, type) {
        keys.push(key);
        await real.put(key, body, type);
        await duringPut();
      },
      get: (key) => real.get(key),
      remove: (key) => real.remove(key),
    };
  }

  async function signedInOn(app: ReturnType<typeof createApp>, who: Who) {
    return signedInAgent(app, who.person);
  }

  it('answers 503 when the object store is down, and writes no row', async () => {
    const down: ObjectStore = {
      put: () => Promise.reject(new UnavailableError('File storage is unavailable. Try again in a moment.')),
      get: () => Promise.reject(new UnavailableError('File storage is unavailable. Try again in a moment.')),
      remove: () => Promise.reject(new UnavailableError('File storage is unavailable. Try again in a moment.')),
    };
    const app = createApp({ db: ctx.db, config: ctx.config, logger: createLogger('silent'), objectStore: down });
    const booking = await newBooking();
    const session = await signedInOn(app, member);
    const res = await session.agent.post(`/api/bookings/${booking.id}/photos`).set('x-csrf-token', session.csrf()).attach('file', pngBytes(), 'barrier.png');
    expect(res.status).toBe(503);
    expect(res.body.error.code).toBe('SERVICE_UNAVAILABLE');
    expect(await photoRows(booking.id)).toEqual([]);
  });

  it('removes the stored object again when the row cannot be written (the booking was cancelled meanwhile)', async () => {
    const booking = await newBooking();
    const store = storeWith(async () => {
      await ctx.db('bookings').where({ id: booking.id }).update({ status: 'cancelled', cancelled_at: new Date() });
    });
    const app = createApp({ db: ctx.db, config: ctx.config, logger: createLogger('silent'), objectStore: store });
    const session = await signedInOn(app, member);
    const res = await session.agent.post(`/api/bookings/${booking.id}/photos`).set('x-csrf-token', session.csrf()).attach('file', pngBytes(), 'barrier.png');
    expect(res.status).toBe(409);
    expect(await photoRows(booking.id)).toEqual([]);
    expect(store.keys).toHaveLength(1);
    await expect(store.get(store.keys[0]!)).rejects.toMatchObject({ code: 'NoSuchKey' });
  });
});
