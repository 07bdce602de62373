// Decodes the printed labels with an independent decoder (jsQR over pdftoppm's rendering),
// so the test checks what a phone camera would read, not what our code meant to draw.
import { execFileSync } from 'node:child_process';
import { mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import jsQR from 'jsqr';
import { PNG } from 'pngjs';
import { createTestContext, itemBody, signedInAs, uniqueWord, type TestContext } from '../../helpers/test-app';

let ctx: TestContext;
let manager: Awaited<ReturnType<typeof signedInAs>>;
const items: { id: number; tag: string }[] = [];

beforeAll(async () => {
  ctx = createTestContext();
  manager = await signedInAs(ctx, 'manager');
  for (const kind of ['multiplier', 'probe', 'grounding-stick', 'isolation-stand', 'hv-supply'] as const) {
    const res = await manager.agent.post('/api/items').set('x-csrf-token', manager.csrf()).send(itemBody(kind, uniqueWord()));
    items.push(res.body.item);
  }
});
afterAll(() => ctx.close());

function binary(req: ReturnType<typeof manager.agent.get>) {
  return req.buffer(true).parse((r, cb) => {
    const chunks: Buffer[] = [];
    r.on('data', (c: Buffer) => chunks.push(c));
    r.on('end', () => cb(null, Buffer.concat(chunks)));
  });
}

/** Renders every page at 200 dpi and decodes each label cell of the 3 x 7 sheet. */
function decodeLabels(pdf: Buffer, grid: { columns: number; rows: number } | null): string[] {
  const dir = mkdtempSync(path.join(os.tmpdir(), 'voltcrib-labels-'));
  try {
    writeFileSync(path.join(dir, 'labels.pdf'), pdf);
    execFileSync('pdftoppm', ['-r', '200', '-png', path.join(dir, 'labels.pdf'), path.join(dir, 'page')]);
    const found: string[] = [];
    for (const file of readdirSync(dir)
      .filter((f) => f.endsWith('.png'))
      .sort()) {
      const png = PNG.sync.read(readFileSync(path.join(dir, file)));
      const cells = grid ? { columns: grid.columns, rows: grid.rows } : { columns: 1, rows: 1 };
      // Each label: QR on the left part of the cell. Crop cell by cell so jsQR sees one code.
      const mm = 200 / 25.4;
      for (let row = 0; row < cells.rows; row += 1) {
        for (let col = 0; col < cells.columns; col += 1) {
          const x0 = grid ? Math.round((7.2 + col * 66) * mm) : 0;
          const y0 = grid ? Math.round((15.15 + row * 38.1) * mm) : 0;
          const w = Math.round(38.1 * mm);
          const h = Math.round(38.1 * mm);
          const crop = new Uint8ClampedArray(w * h * 4);
          for (let y = 0; y < h; y += 1) {
            const srcStart = ((y0 + y) * png.width + x0) * 4;
            crop.set(png.data.subarray(srcStart, srcStart + w * 4), y * w * 4);
          }
          const code = jsQR(crop, w, h);
          if (code) found.push(code.data);
        }
      }
    }
    return found;
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

describe('GET /api/labels.pdf', () => {
  it('prints a sheet whose QR codes carry each item URL, in order', async () => {
    const ids = items.map((i) => i.id).join(',');
    const res = await binary(manager.agent.get(`/api/labels.pdf?items=${ids}`));
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    const decoded = decodeLabels(res.body as Buffer, { columns: 3, rows: 7 });
    expect(decoded).toEqual(items.map((i) => `${ctx.config.publicUrl}/i/${i.tag}`));
  });

  it('puts the tag, the name and the max kV in text beside the code', async () => {
    const res = await binary(manager.agent.get(`/api/labels.pdf?items=${items[0]!.id}`));
    const dir = mkdtempSync(path.join(os.tmpdir(), 'voltcrib-text-'));
    try {
      writeFileSync(path.join(dir, 'l.pdf'), res.body as Buffer);
      const text = execFileSync('pdftotext', [path.join(dir, 'l.pdf'), '-']).toString();
      expect(text).toContain(items[0]!.tag);
      expect(text).toContain('Max 80 kV');
      expect(text).toMatch(/multiplier unit/);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });

  it('prints a single label for one item', async () => {
    const item = items[1]!;
    const res = await binary(manager.agent.get(`/api/items/${item.id}/label.pdf`));
    expect(res.status).toBe(200);
    expect(decodeLabels(res.body as Buffer, null)).toEqual([`${ctx.config.publicUrl}/i/${item.tag}`]);
  });

  it('refuses bad id lists with 400 and unknown items with 404', async () => {
    expect((await manager.agent.get('/api/labels.pdf?items=1,abc')).status).toBe(400);
    expect((await manager.agent.get('/api/labels.pdf')).status).toBe(400);
    expect((await manager.agent.get('/api/labels.pdf?items=99999999')).status).toBe(404);
  });

  it('is not for members', async () => {
    const member = await signedInAs(ctx, 'member');
    expect((await member.agent.get(`/api/labels.pdf?items=${items[0]!.id}`)).status).toBe(403);
  });
});
