// The service worker that lets the app open without a network once it has been opened: workbox
// precaches the app shell (index.html, the scripts it loads, the fonts, the favicon) and keeps
// every lazily loaded chunk it has seen. Pages are fetched network-first, so online visitors
// always get the current index.html (revalidated by ETag); offline, the cached shell opens and
// the app says it is offline. The API is never cached: nothing stale is shown as current.
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { generateSW } from 'workbox-build';

/** Hashed file names (Metro's 32-hex chunks, our 16-hex fonts) never change content. */
const HASHED = /[.-][0-9a-f]{16,}\./;

/** `sharedChunk`: the lazy screens' shared chunk (no longer a script of the page), kept for offline too. */
export async function buildServiceWorker(webDir: string, sharedChunk: string | null = null): Promise<{ count: number; size: number }> {
  const html = readFileSync(path.join(webDir, 'index.html'), 'utf8');
  const shellScripts = [...html.matchAll(/<script src="\/([^"]+)"/g)].map((m) => m[1]!);
  if (sharedChunk) shellScripts.push(sharedChunk.replace(/^\//, ''));
  const { count, size, warnings } = await generateSW({
    globDirectory: webDir,
    globPatterns: ['index.html', 'register-sw.js', 'favicon.ico', 'fonts/*.woff2', ...shellScripts],
    swDest: path.join(webDir, 'sw.js'),
    mode: 'production',
    inlineWorkboxRuntime: true,
    sourcemap: false,
    skipWaiting: true,
    clientsClaim: true,
    cleanupOutdatedCaches: true,
    dontCacheBustURLsMatching: HASHED,
    // The shell's entry script is well over workbox's 2 MB default only in development builds.
    maximumFileSizeToCacheInBytes: 5 * 1024 * 1024,
    runtimeCaching: [
      {
        urlPattern: ({ request, url }) => request.mode === 'navigate' && !url.pathname.startsWith('/api/'),
        handler: 'NetworkFirst',
        options: { cacheName: 'voltcrib-pages', networkTimeoutSeconds: 4, precacheFallback: { fallbackURL: '/index.html' } },
      },
      {
        urlPattern: ({ url }) => url.pathname.startsWith('/_expo/static/') || url.pathname.startsWith('/assets/'),
        handler: 'CacheFirst',
        options: { cacheName: 'voltcrib-chunks', expiration: { maxEntries: 200 } },
      },
    ],
  });
  for (const warning of warnings) console.warn(`[web] service worker: ${warning}`);
  return { count, size };
}
