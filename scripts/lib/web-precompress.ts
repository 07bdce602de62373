// Every static text file of the web export gets a .br (brotli, quality 11) and a .gz (gzip,
// level 9) twin at build time, so the server sends compressed bytes without compressing per
// request (server/web.ts picks the twin by Accept-Encoding). Fonts (WOFF2), images and other
// already-compressed formats are left as they are.
import { readdirSync, readFileSync, statSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { brotliCompressSync, constants, gzipSync } from 'node:zlib';

export const COMPRESSIBLE = /\.(js|mjs|css|html|json|svg|wasm|map|txt|ico|xml|webmanifest)$/;

function filesUnder(dir: string): string[] {
  return readdirSync(dir).flatMap((entry) => {
    const full = path.join(dir, entry);
    return statSync(full).isDirectory() ? filesUnder(full) : [full];
  });
}

export interface PrecompressTotals {
  files: number;
  rawBytes: number;
  brBytes: number;
  gzBytes: number;
}

export function precompressWeb(webDir: string): PrecompressTotals {
  const totals: PrecompressTotals = { files: 0, rawBytes: 0, brBytes: 0, gzBytes: 0 };
  for (const file of filesUnder(webDir)) {
    if (!COMPRESSIBLE.test(file)) continue;
    const raw = readFileSync(file);
    // Tiny files gain nothing from a twin: the headers outweigh the saving.
    if (raw.length < 512) continue;
    const br = brotliCompressSync(raw, { params: { [constants.BROTLI_PARAM_QUALITY]: 11, [constants.BROTLI_PARAM_SIZE_HINT]: raw.length } });
    const gz = gzipSync(raw, { level: 9 });
    if (br.length < raw.length) writeFileSync(`${file}.br`, br);
    if (gz.length < raw.length) writeFileSync(`${file}.gz`, gz);
    totals.files += 1;
    totals.rawBytes += raw.length;
    totals.brBytes += Math.min(br.length, raw.length);
    totals.gzBytes += Math.min(gz.length, raw.length);
  }
  return totals;
}
