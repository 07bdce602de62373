// Builds the Expo web app into dist/ when its sources are newer than the last build, then makes
// what a phone needs from it: WOFF2 fonts (the icon font cut to the icons the app lists) declared
// and preloaded in index.html, the lazy screens' shared chunk taken off the first page, a service
// worker for opening offline, and a brotli and a gzip twin of every text file. `tsx scripts/build-web.ts --force` rebuilds regardless.
import { spawnSync } from 'node:child_process';
import { copyFileSync, existsSync, mkdirSync, readdirSync, readFileSync, statSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { buildWebFonts, fontHeadHtml } from './lib/web-fonts';
import { precompressWeb } from './lib/web-precompress';
import { deferSharedChunk } from './lib/web-shared-chunk';
import { buildServiceWorker } from './lib/web-service-worker';

const ROOT = path.resolve(__dirname, '..');
const SOURCES = [
  'app',
  'components',
  'hooks',
  'shared',
  'assets',
  'metro',
  'public',
  'app.json',
  'metro.config.js',
  'babel.config.js',
  'package-lock.json',
  'scripts/build-web.ts',
  'scripts/lib/web-fonts.ts',
  'scripts/lib/web-precompress.ts',
  'scripts/lib/web-service-worker.ts',
  'scripts/lib/web-shared-chunk.ts',
];
const DIST = path.join(ROOT, 'dist');
const STAMP = path.join(DIST, '.build-stamp');

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

/** Fonts, service worker and compressed twins: everything after Metro's export. */
async function finishWebBuild(webDir: string): Promise<void> {
  const indexPath = path.join(webDir, 'index.html');
  const fonts = await buildWebFonts(webDir);
  const html = readFileSync(indexPath, 'utf8');
  if (!html.includes('</head>')) throw new Error('dist/index.html has no </head> to add the fonts to');
  writeFileSync(indexPath, html.replace('</head>', `${fontHeadHtml(fonts)}</head>`));
  console.log(`[web] fonts: ${fonts.map((f) => `${path.basename(f.href)} ${(f.bytes / 1024).toFixed(1)} KB`).join(', ')}`);
  const sharedChunk = deferSharedChunk(webDir);
  if (sharedChunk) console.log(`[web] lazy screens' shared chunk loads with the first of them: ${path.basename(sharedChunk)}`);
  const sw = await buildServiceWorker(webDir, sharedChunk);
  console.log(`[web] service worker precaches ${sw.count} files (${(sw.size / 1024).toFixed(0)} KB)`);
  const totals = precompressWeb(webDir);
  console.log(
    `[web] precompressed ${totals.files} files: ${(totals.rawBytes / 1024).toFixed(0)} KB raw, ${(totals.brBytes / 1024).toFixed(0)} KB brotli, ${(totals.gzBytes / 1024).toFixed(0)} KB gzip`,
  );
}

export async function buildWebIfStale(force = false): Promise<boolean> {
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
  await finishWebBuild(DIST);
  writeFileSync(STAMP, new Date().toISOString());
  console.log(`[web] built in ${((Date.now() - started) / 1000).toFixed(1)} s`);
  return true;
}

if (require.main === module) {
  buildWebIfStale(process.argv.includes('--force')).catch((error: unknown) => {
    console.error(error instanceof Error ? error.message : error);
    process.exit(1);
  });
}
