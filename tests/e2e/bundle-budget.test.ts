// The web budget: the main bundle a phone downloads before the first screen stays at or under
// 450 KB gzip. Heavy parts (scanner and its wasm, Planner, admin screens) load lazily.
import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { gzipSync } from 'node:zlib';

const WEB_DIR = process.env.VOLTCRIB_E2E_WEB_DIR ?? path.resolve(__dirname, '../../dist');
const BUDGET_GZIP_BYTES = 450 * 1024;

it('keeps the main web bundle within 450 KB gzip and ships no other zod locale', () => {
  const dir = path.join(WEB_DIR, '_expo', 'static', 'js', 'web');
  const entry = readdirSync(dir).find((f) => f.startsWith('entry-') && f.endsWith('.js'));
  expect(entry).toBeDefined();
  const bytes = readFileSync(path.join(dir, entry!));
  const gzip = gzipSync(bytes, { level: 9 }).length;
  console.log(`[budget] ${entry}: ${(bytes.length / 1024).toFixed(0)} KB raw, ${(gzip / 1024).toFixed(0)} KB gzip (budget 450 KB)`);
  expect(gzip).toBeLessThanOrEqual(BUDGET_GZIP_BYTES);
  // zod's German locale text as a canary for the locale bundle.
  expect(bytes.toString('utf8')).not.toContain('Ungültige Eingabe');
});

it('serves the QR decoder wasm from our own origin, not a CDN', () => {
  const wasm = readFileSync(path.join(WEB_DIR, 'zxing_reader.wasm'));
  expect(wasm.subarray(0, 4).toString('hex')).toBe('0061736d');
});
