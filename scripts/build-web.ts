// Builds the Expo web app into dist/ when its sources are newer than the last build.
// `tsx scripts/build-web.ts --force` rebuilds regardless.
import { spawnSync } from 'node:child_process';
import { copyFileSync, existsSync, mkdirSync, readdirSync, statSync, writeFileSync } from 'node:fs';
import path from 'node:path';

const ROOT = path.resolve(__dirname, '..');
const SOURCES = ['app', 'components', 'hooks', 'shared', 'assets', 'metro', 'public', 'app.json', 'metro.config.js', 'babel.config.js', 'package-lock.json'];
const STAMP = path.join(ROOT, 'dist', '.build-stamp');

function newestMtime(target: string): number {
  if (!existsSync(target)) return 0;
  const stat = statSync(target);
  if (!stat.isDirectory()) return stat.mtimeMs;
  let newest = stat.mtimeMs;
  for (const entry of readdirSync(target)) newest = Math.max(newest, newestMtime(path.join(target, entry)));
  return newest;
}

/** The QR decoder's wasm is served from our own origin; it is never fetched from a CDN. */
function copyDecoderWasm(): void {
  const source = path.join(ROOT, 'node_modules', 'zxing-wasm', 'dist', 'reader', 'zxing_reader.wasm');
  if (!existsSync(source)) return;
  mkdirSync(path.join(ROOT, 'public'), { recursive: true });
  const target = path.join(ROOT, 'public', 'zxing_reader.wasm');
  if (!existsSync(target) || statSync(target).size !== statSync(source).size) copyFileSync(source, target);
}

export function buildWebIfStale(force = false): boolean {
  copyDecoderWasm();
  const built = existsSync(STAMP) ? statSync(STAMP).mtimeMs : 0;
  const newest = Math.max(...SOURCES.map((s) => newestMtime(path.join(ROOT, s))));
  if (!force && built > newest && existsSync(path.join(ROOT, 'dist', 'index.html'))) return false;
  console.log('[web] building the web app (about a minute the first time)…');
  const started = Date.now();
  const result = spawnSync(path.join(ROOT, 'node_modules', '.bin', 'expo'), ['export', '--platform', 'web', '--output-dir', 'dist'], {
    cwd: ROOT,
    stdio: ['ignore', 'inherit', 'inherit'],
    env: { ...process.env, CI: '1', EXPO_NO_TELEMETRY: '1' },
  });
  if (result.status !== 0) throw new Error(`expo export failed (exit ${result.status})`);
  writeFileSync(STAMP, new Date().toISOString());
  console.log(`[web] built in ${((Date.now() - started) / 1000).toFixed(1)} s`);
  return true;
}

if (require.main === module) {
  try {
    buildWebIfStale(process.argv.includes('--force'));
  } catch (error) {
    console.error(error instanceof Error ? error.message : error);
    process.exit(1);
  }
}
