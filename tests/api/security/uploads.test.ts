// Uploads as an attacker or a careless user sends them: the stored name's extension follows the
// bytes, control and bidirectional characters are dropped from it, downloads use that name; and
// booking photos are capped per booking and per person (413 with a clear message).
import { randomBytes } from 'node:crypto';
import { PNG } from 'pngjs';
import { post } from '../../helpers/booking-flow';
import { insertKit, plan, qualify, windowFromNow } from '../../helpers/gear';
import { createTestContext, signedInAs, type TestContext } from '../../helpers/test-app';
import { storedFileName } from '../../../server/services/file-content';

/** A PNG of random pixels: it does not compress, so its size is about width × height × 4 bytes. */
function noisyPng(side: number): Buffer {
  const png = new PNG({ width: side, height: side });
  randomBytes(side * side * 4).copy(png.data);
  return PNG.sync.write(png);
}
const smallPng = () => noisyPng(4);
const JPEG = Buffer.concat([
  Buffer.from([0xff, 0xd8, 0xff, 0xe0, 0x00, 0x10, 0x4a, 0x46, 0x49, 0x46, 0x00, 0x01]),
  Buffer.alloc(64),
  Buffer.from([0xff, 0xd9]),
]);

type Who = Awaited<ReturnType<typeof signedInAs>>;

async function member(ctx: TestContext): Promise<Who> {
  const who = await signedInAs(ctx, 'member');
  await qualify(ctx.db, who.person.id, 20);
  return who;
}

async function newBooking(ctx: TestContext, who: Who): Promise<number> {
  const kit = await insertKit(ctx.db);
  const res = await post(who, '/api/bookings', {
    itemIds: kit.all.map((i) => i.id),
    ...windowFromNow(),
    location: 'Bay 4',
    purpose: 'Upload limits',
    plan: plan(10),
  });
  expect(res.status).toBe(201);
  return res.body.booking.id as number;
}

const upload = (who: Who, bookingId: number, name: string, bytes: Buffer) =>
  who.agent
    .post(`/api/bookings/${bookingId}/photos`)
    .set('x-csrf-token', who.csrf())
    .attach('file', bytes, { filepath: name } as unknown as string);

const statuses = (answers: { status: number }[]) => answers.map((a) => a.status);

describe('stored file names', () => {
  let ctx: TestContext;
  let who: Who;
  let bookingId: number;
  beforeAll(async () => {
    ctx = createTestContext();
    who = await member(ctx);
    bookingId = await newBooking(ctx, who);
  });
  afterAll(() => ctx.close());

  it('a PNG with HTML appended, named evil.html, is stored and served as evil.png, an image, never a page', async () => {
    const bytes = Buffer.concat([smallPng(), Buffer.from('<html><script>alert(document.cookie)</script></html>')]);
    const res = await upload(who, bookingId, 'evil.html', bytes);
    expect(res.status).toBe(201);
    expect(res.body.file).toMatchObject({ fileName: 'evil.png', contentType: 'image/png' });
    const served = await who.agent.get(`/api/files/${res.body.file.id}`).buffer(true);
    expect(served.status).toBe(200);
    expect(served.headers['content-type']).toBe('image/png');
    expect(served.headers['x-content-type-options']).toBe('nosniff');
    expect(served.headers['content-disposition']).toMatch(/^inline; filename="evil\.png"; filename\*=UTF-8''evil\.png$/);
  });

  it('drops a right-to-left override, so "photo‮gnp.exe" cannot pass for a PNG of another name', async () => {
    const res = await upload(who, bookingId, 'photo\u202Egnp.exe', smallPng());
    expect(res.status).toBe(201);
    expect(res.body.file.fileName).toBe('photognp.png');
    const served = await who.agent.get(`/api/files/${res.body.file.id}`).buffer(true);
    expect(decodeURIComponent(/filename\*=UTF-8''(\S+)/.exec(String(served.headers['content-disposition']))![1]!)).toBe('photognp.png');
  });

  it.each([
    ['barrier', 'barrier.png'],
    ['Prüfbericht 🔌.PNG', 'Prüfbericht 🔌.PNG'],
    ['report.pdf', 'report.png'],
    ['stand .exe.', 'stand .exe.png'],
  ])('stores %j as %j', async (name, expected) => {
    const res = await upload(who, bookingId, name, smallPng());
    expect({ status: res.status, body: res.body.error }).toEqual({ status: 201, body: undefined });
    expect(res.body.file.fileName).toBe(expected);
  });

  it("drops control characters a name carries in RFC 5987 encoding (filename*=UTF-8''…)", async () => {
    const boundary = 'voltcrib-boundary';
    const body = Buffer.concat([
      Buffer.from(`--${boundary}\r\nContent-Disposition: form-data; name="file"; filename*=UTF-8''bell%07and%09tab%1B.png\r\nContent-Type: image/png\r\n\r\n`),
      smallPng(),
      Buffer.from(`\r\n--${boundary}--\r\n`),
    ]);
    const res = await who.agent
      .post(`/api/bookings/${bookingId}/photos`)
      .set('x-csrf-token', who.csrf())
      .set('content-type', `multipart/form-data; boundary=${boundary}`)
      .send(body);
    expect(res.status).toBe(201);
    expect(res.body.file.fileName).toBe('bellandtab.png');
  });

  it('keeps either spelling of a JPEG extension and gives one to a JPEG without it', () => {
    expect(storedFileName('stack.jpeg', 'image/jpeg')).toBe('stack.jpeg');
    expect(storedFileName('stack.JPG', 'image/jpeg')).toBe('stack.JPG');
    expect(storedFileName('stack.png', 'image/jpeg')).toBe('stack.jpg');
    expect(storedFileName('scan.', 'application/pdf')).toBe('scan.pdf');
    expect(storedFileName('\u2066isolate\u2069.webp', 'image/webp')).toBe('isolate.webp');
  });

  it('stores a real JPEG under its own name', async () => {
    // file-type reads a JPEG from its FF D8 FF start (JPEG File Interchange Format, JFIF 1.02).
    const res = await upload(who, bookingId, 'stack.jpeg', JPEG);
    expect(res.status).toBe(201);
    expect(res.body.file).toMatchObject({ fileName: 'stack.jpeg', contentType: 'image/jpeg' });
  });

  it('still refuses names that are only invisible characters or look like paths', async () => {
    for (const name of ['\u202E\u0000', '../x.png', 'a/b.png']) expect((await upload(who, bookingId, name, smallPng())).status).toBe(400);
  });
});

describe('booking photo caps', () => {
  it('refuses the photo past the per-booking count with 413, also when the photos come at once, and stores nothing more', async () => {
    const ctx = createTestContext({ BOOKING_PHOTOS_MAX: '3' });
    try {
      const who = await member(ctx);
      const bookingId = await newBooking(ctx, who);
      const answers = await Promise.all(Array.from({ length: 8 }, (_, i) => upload(who, bookingId, `p${i}.png`, smallPng())));
      expect(statuses(answers).filter((s) => s === 201)).toHaveLength(3);
      expect(statuses(answers).filter((s) => s === 413)).toHaveLength(5);
      const refused = answers.find((a) => a.status === 413)!;
      expect(refused.body.error).toMatchObject({ code: 'UPLOAD_CAP_REACHED', message: expect.stringContaining('the most one booking keeps (3)') });
      expect(await ctx.db('item_files').where({ booking_id: bookingId })).toHaveLength(3);
      console.log(`[uploads] 8 photos at once on one booking (cap 3): ${JSON.stringify(statuses(answers).sort())}`);
    } finally {
      await ctx.close();
    }
  });

  it('refuses the photo that would take the booking past its total bytes', async () => {
    // 0.1 MB = 104 858 bytes; each photo is about 40 000 bytes (100 × 100 RGBA noise).
    const ctx = createTestContext({ BOOKING_PHOTOS_MAX_MB: '0.1' });
    try {
      const who = await member(ctx);
      const bookingId = await newBooking(ctx, who);
      const photo = noisyPng(100);
      expect(photo.length).toBeGreaterThan(38_000);
      expect(photo.length).toBeLessThan(52_000);
      const answers = [];
      for (let i = 0; i < 3; i += 1) answers.push(await upload(who, bookingId, `big${i}.png`, photo));
      expect(statuses(answers)).toEqual([201, 201, 413]);
      expect(answers[2]!.body.error.message).toMatch(/past 0\.1 MB/);
    } finally {
      await ctx.close();
    }
  });

  it('caps one person over 24 hours across bookings, in count and in bytes, and not anyone else', async () => {
    const ctx = createTestContext({ PERSON_UPLOADS_PER_DAY: '4' });
    try {
      const who = await member(ctx);
      const other = await member(ctx);
      const [a, b, c] = [await newBooking(ctx, who), await newBooking(ctx, who), await newBooking(ctx, other)];
      const answers = [];
      for (const booking of [a, a, b, b, b]) answers.push(await upload(who, booking, 'p.png', smallPng()));
      expect(statuses(answers)).toEqual([201, 201, 201, 201, 413]);
      expect(answers[4]!.body.error).toMatchObject({ code: 'UPLOAD_CAP_REACHED', message: expect.stringContaining('last 24 hours') });
      expect((await upload(other, c, 'p.png', smallPng())).status).toBe(201);
    } finally {
      await ctx.close();
    }
    const bytesCtx = createTestContext({ PERSON_UPLOAD_MB_PER_DAY: '0.1' });
    try {
      const who = await member(bytesCtx);
      const [a, b] = [await newBooking(bytesCtx, who), await newBooking(bytesCtx, who)];
      const photo = noisyPng(100);
      const answers = [await upload(who, a, 'x.png', photo), await upload(who, b, 'y.png', photo), await upload(who, b, 'z.png', photo)];
      expect(statuses(answers)).toEqual([201, 201, 413]);
    } finally {
      await bytesCtx.close();
    }
  });
});
