// What the server sends a phone: the web app's files as the brotli or gzip twin the build made,
// chosen by Accept-Encoding and marked `Vary: Accept-Encoding`; hashed files cached for a year,
// index.html revalidated; API answers over 1 KB compressed on the fly, small ones left as they are.
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { brotliCompressSync, brotliDecompressSync, gunzipSync, gzipSync } from 'node:zlib';
import request from 'supertest';
import { createPerson, createTestContext, itemBody, uniqueWord, type TestContext } from '../../helpers/test-app';

interface Wire {
  status: number;
  headers: http.IncomingHttpHeaders;
  body: Buffer;
}

/** supertest decodes compressed bodies by itself; node's http client keeps the bytes as sent. */
function onTheWire(url: string, headers: Record<string, string>): Promise<Wire> {
  return new Promise((resolve, reject) => {
    http
      .get(`${baseUrl}${url}`, { headers }, (res) => {
        const chunks: Buffer[] = [];
        res.on('data', (chunk: Buffer) => chunks.push(chunk));
        res.on('end', () => resolve({ status: res.statusCode ?? 0, headers: res.headers, body: Buffer.concat(chunks) }));
      })
      .on('error', reject);
  });
}

const SCRIPT = `console.log(${JSON.stringify('a phone at the bench '.repeat(200))});`;
const INDEX = `<!DOCTYPE html><html><head><title>Voltcrib</title></head><body>${'<div></div>'.repeat(100)}</body></html>`;
let webDir: string;
let ctx: TestContext;
let server: http.Server;
let baseUrl: string;

beforeAll(() => {
  webDir = mkdtempSync(path.join(os.tmpdir(), 'voltcrib-web-'));
  const js = path.join(webDir, '_expo', 'static', 'js', 'web');
  mkdirSync(js, { recursive: true });
  // Twins with markers, so a test can tell which file was sent.
  writeFileSync(path.join(js, 'entry-0123456789abcdef0123456789abcdef.js'), SCRIPT);
  writeFileSync(path.join(js, 'entry-0123456789abcdef0123456789abcdef.js.br'), brotliCompressSync(SCRIPT));
  writeFileSync(path.join(js, 'entry-0123456789abcdef0123456789abcdef.js.gz'), gzipSync(SCRIPT));
  writeFileSync(path.join(webDir, 'index.html'), INDEX);
  writeFileSync(path.join(webDir, 'index.html.br'), brotliCompressSync(INDEX));
  writeFileSync(path.join(webDir, 'index.html.gz'), gzipSync(INDEX));
  ctx = createTestContext({ WEB_DIR: webDir });
  server = http.createServer(ctx.app);
  return new Promise<void>((resolve) =>
    server.listen(0, '127.0.0.1', () => {
      baseUrl = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
      resolve();
    }),
  );
});

afterAll(async () => {
  await new Promise<void>((resolve) => server.close(() => resolve()));
  await ctx.close();
  rmSync(webDir, { recursive: true, force: true });
});

describe('GET a hashed script', () => {
  const url = '/_expo/static/js/web/entry-0123456789abcdef0123456789abcdef.js';

  it('sends the brotli twin to a browser that accepts it, cached for a year', async () => {
    const res = await onTheWire(url, { 'accept-encoding': 'br, gzip' });
    expect(res.status).toBe(200);
    expect(res.headers['content-encoding']).toBe('br');
    expect(res.headers.vary).toMatch(/accept-encoding/i);
    expect(res.headers['content-type']).toMatch(/javascript/);
    expect(res.headers['cache-control']).toBe('public, max-age=31536000, immutable');
    expect(brotliDecompressSync(res.body).toString()).toBe(SCRIPT);
  });

  it('sends the gzip twin when brotli is not accepted, and the plain file when nothing is', async () => {
    const gz = await onTheWire(url, { 'accept-encoding': 'gzip' });
    expect(gz.headers['content-encoding']).toBe('gzip');
    expect(gunzipSync(gz.body).toString()).toBe(SCRIPT);
    const plain = await onTheWire(url, { 'accept-encoding': 'identity' });
    expect(plain.headers['content-encoding']).toBeUndefined();
    expect(plain.body.toString()).toBe(SCRIPT);
  });

  it('answers 404 for a chunk that is not there, never the app page', async () => {
    const res = await request(ctx.app).get('/_expo/static/js/web/entry-ffffffffffffffffffffffffffffffff.js').expect(404);
    expect(res.text).not.toContain('<html');
  });
});

describe('GET a page of the app', () => {
  it('sends index.html compressed for any deep link, revalidated by ETag', async () => {
    const res = await onTheWire('/bookings/12/release', { 'accept-encoding': 'br' });
    expect(res.status).toBe(200);
    expect(res.headers['content-encoding']).toBe('br');
    expect(res.headers.vary).toMatch(/accept-encoding/i);
    expect(res.headers['cache-control']).toBe('no-cache');
    expect(brotliDecompressSync(res.body).toString()).toBe(INDEX);
    const etag = res.headers.etag;
    expect(etag).toBeTruthy();
    expect((await onTheWire('/bookings/12/release', { 'accept-encoding': 'br', 'if-none-match': etag! })).status).toBe(304);
  });
});

describe('API answers', () => {
  it('compresses a list over 1 KB and leaves a small answer as it is', async () => {
    const person = await createPerson(ctx.db, { role: 'manager' });
    const first = await fetch(`${baseUrl}/api/session`);
    const anonymous = first.headers.get('set-cookie')!.split(';')[0]!;
    const { csrfToken } = (await first.json()) as { csrfToken: string };
    const signIn = await fetch(`${baseUrl}/api/session`, {
      method: 'POST',
      headers: { cookie: anonymous, 'content-type': 'application/json', 'x-csrf-token': csrfToken },
      body: JSON.stringify({ email: person.email, password: person.password }),
    });
    expect(signIn.status).toBe(200);
    const cookie = signIn.headers.get('set-cookie')?.split(';')[0] ?? anonymous;
    const { csrfToken: token } = (await signIn.json()) as { csrfToken: string };

    const small = await onTheWire('/api/session', { 'accept-encoding': 'gzip', cookie });
    expect(small.status).toBe(200);
    expect(small.body.length).toBeLessThan(1024);
    expect(small.headers['content-encoding']).toBeUndefined();
    const word = uniqueWord();
    for (const kind of ['probe', 'hv-supply', 'isolation-stand', 'grounding-stick', 'interlock', 'multiplier']) {
      const created = await fetch(`${baseUrl}/api/items`, {
        method: 'POST',
        headers: { cookie, 'content-type': 'application/json', 'x-csrf-token': token },
        body: JSON.stringify(itemBody(kind, word)),
      });
      expect(created.status).toBe(201);
    }
    const big = await onTheWire(`/api/items?q=${word}`, { 'accept-encoding': 'gzip', cookie });
    const body = big.body;
    expect(big.status).toBe(200);
    expect(big.headers['content-encoding']).toBe('gzip');
    expect(big.headers.vary).toMatch(/accept-encoding/i);
    expect(big.headers['cache-control']).toMatch(/no-store/);
    const json = gunzipSync(body);
    expect(json.length).toBeGreaterThan(1024);
    expect(body.length).toBeLessThan(json.length);
    expect(() => JSON.parse(json.toString())).not.toThrow();
  });
});
