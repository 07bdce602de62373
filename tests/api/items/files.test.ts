import { PNG } from 'pngjs';
import request from 'supertest';
import { createTestContext, itemBody, signedInAs, uniqueWord, type TestContext } from '../../helpers/test-app';

let ctx: TestContext;
let manager: Awaited<ReturnType<typeof signedInAs>>;
let itemId: number;

function pngBytes(): Buffer {
  const png = new PNG({ width: 4, height: 4 });
  png.data.fill(200);
  return PNG.sync.write(png);
}
const PDF_BYTES = Buffer.from(
  '%PDF-1.4\n1 0 obj<</Type/Catalog/Pages 2 0 R>>endobj 2 0 obj<</Type/Pages/Kids[]/Count 0>>endobj\ntrailer<</Root 1 0 R>>\n%%EOF\n',
);

beforeAll(async () => {
  ctx = createTestContext({ UPLOAD_MAX_MB: '0.05' });
  manager = await signedInAs(ctx, 'manager');
  const res = await manager.agent.post('/api/items').set('x-csrf-token', manager.csrf()).send(itemBody('probe', uniqueWord()));
  itemId = res.body.item.id;
});
afterAll(() => ctx.close());

const upload = (name: string, bytes: Buffer, kind?: string) => {
  const req = manager.agent.post(`/api/items/${itemId}/files`).set('x-csrf-token', manager.csrf());
  if (kind) req.field('kind', kind);
  // `filepath` makes the multipart encoder send the name as given, folders included.
  return req.attach('file', bytes, { filepath: name } as unknown as string);
};

async function storedCount() {
  const row = await ctx.db('item_files').where({ item_id: itemId }).count({ n: '*' }).first();
  return Number(row?.n);
}

describe('POST /api/items/:id/files', () => {
  it('stores a photo, makes it the item photo, and serves it back to signed-in people only', async () => {
    const bytes = pngBytes();
    const res = await upload('bench-photo.png', bytes, 'photo');
    expect(res.status).toBe(201);
    expect(res.body.file).toMatchObject({ kind: 'photo', contentType: 'image/png', fileName: 'bench-photo.png', sizeBytes: bytes.length });
    const item = await manager.agent.get(`/api/items/${itemId}`);
    expect(item.body.item.photoFileId).toBe(res.body.file.id);

    const served = await manager.agent
      .get(`/api/files/${res.body.file.id}`)
      .buffer(true)
      .parse((r, cb) => {
        const chunks: Buffer[] = [];
        r.on('data', (c: Buffer) => chunks.push(c));
        r.on('end', () => cb(null, Buffer.concat(chunks)));
      });
    expect(served.status).toBe(200);
    expect(Buffer.compare(served.body as Buffer, bytes)).toBe(0);
    expect(served.headers['content-type']).toBe('image/png');
    expect(served.headers['x-content-type-options']).toBe('nosniff');
    expect(served.headers['content-disposition']).toMatch(/^inline; filename="bench-photo.png"/);

    expect((await request(ctx.app).get(`/api/files/${res.body.file.id}`)).status).toBe(401);
  });

  it('accepts a PDF certificate as a document', async () => {
    const res = await upload('calibration-2026.pdf', PDF_BYTES);
    expect(res.status).toBe(201);
    expect(res.body.file).toMatchObject({ kind: 'document', contentType: 'application/pdf' });
  });

  it('judges by content: an executable script renamed to .pdf is refused with 415 and nothing is kept', async () => {
    const before = await storedCount();
    const res = await upload('certificate.pdf', Buffer.from('#!/bin/sh\necho not a pdf\n'));
    expect(res.status).toBe(415);
    expect(res.body.error.code).toBe('UNSUPPORTED_FILE_TYPE');
    expect(await storedCount()).toBe(before);
  });

  it('refuses a PDF sent as a photo', async () => {
    const res = await upload('photo.jpg', PDF_BYTES, 'photo');
    expect(res.status).toBe(415);
  });

  it('refuses a file over the size limit with 413', async () => {
    const before = await storedCount();
    const big = Buffer.concat([pngBytes(), Buffer.alloc(80 * 1024)]);
    const res = await upload('huge.png', big);
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe('FILE_TOO_LARGE');
    expect(await storedCount()).toBe(before);
  });

  it.each(['../../etc/passwd.png', 'folder/inner.png', '..\\win.png', '..'])('refuses the path-like name %j with 400', async (name) => {
    const before = await storedCount();
    const res = await upload(name, pngBytes());
    expect(res.status).toBe(400);
    expect(await storedCount()).toBe(before);
  });

  it('refuses a request without a file and a member upload', async () => {
    const none = await manager.agent.post(`/api/items/${itemId}/files`).set('x-csrf-token', manager.csrf()).field('kind', 'photo');
    expect(none.status).toBe(400);
    const member = await signedInAs(ctx, 'member');
    const res = await member.agent.post(`/api/items/${itemId}/files`).set('x-csrf-token', member.csrf()).attach('file', pngBytes(), 'a.png');
    expect(res.status).toBe(403);
  });
});
