// Metro's web export puts the modules shared by two or more lazy screens into one `__common`
// chunk and loads it as a script of every page, although the first screens (sign-in, Today) run
// none of it. This takes that script out of each exported page and names the chunk in a
// `<meta name="voltcrib-shared-chunk">` instead; components/common/shared-chunk.web.ts loads it
// before the first lazy screen. The service worker still precaches it, so lazy screens open
// offline as before.
import { readdirSync, readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';

const SHARED_SCRIPT = /<script src="(\/_expo\/static\/js\/web\/__common-[0-9a-f]+\.js)" defer><\/script>/;

function htmlFiles(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((entry) => {
    const full = path.join(dir, entry.name);
    if (entry.isDirectory()) return entry.name === '_expo' ? [] : htmlFiles(full);
    return entry.name.endsWith('.html') ? [full] : [];
  });
}

/** Rewrites every exported page; returns the shared chunk's path, or null when the export has none. */
export function deferSharedChunk(webDir: string): string | null {
  let shared: string | null = null;
  for (const file of htmlFiles(webDir)) {
    const html = readFileSync(file, 'utf8');
    const match = SHARED_SCRIPT.exec(html);
    if (!match) continue;
    if (shared && shared !== match[1]) throw new Error(`${file} names another shared chunk (${match[1]}, not ${shared})`);
    shared = match[1]!;
    if (!html.includes('</head>')) throw new Error(`${file} has no </head> for the shared chunk's name`);
    writeFileSync(file, html.replace(match[0], '').replace('</head>', `<meta name="voltcrib-shared-chunk" content="${shared}">\n</head>`));
  }
  return shared;
}
