// Serves the exported Expo web app from the same origin as /api. Unknown non-API paths get
// index.html so deep links such as /i/<tag> (a scanned label) open the right screen.
//
// Every text file has a brotli and a gzip twin made at build time (scripts/lib/web-precompress.ts);
// express-static-gzip sends the twin the request's Accept-Encoding allows, with
// `Vary: Accept-Encoding`, so no CPU is spent compressing per request. Files whose names carry a
// content hash are kept by browsers for a year without asking again; index.html and the service
// worker are revalidated on every visit (a cheap 304 by ETag).
import express, { type Express, type NextFunction, type Request, type Response } from 'express';
import expressStaticGzip from 'express-static-gzip';
import { existsSync } from 'node:fs';
import type { ServerResponse } from 'node:http';
import path from 'node:path';

/** Folders whose file names change whenever their content does (Metro's and the font build's hashes). */
const HASHED_FOLDERS = ['/_expo/static/', '/assets/', '/fonts/'];
export const IMMUTABLE = 'public, max-age=31536000, immutable';
const REVALIDATE = 'no-cache';
/** Unhashed extras (favicon, the QR decoder's wasm): an hour, then a revalidation. */
const SHORT = 'public, max-age=3600';

function cacheControlFor(root: string, filePath: string): string {
  const url = `/${path.relative(root, filePath).split(path.sep).join('/')}`.replace(/\.(br|gz)$/, '');
  if (HASHED_FOLDERS.some((folder) => url.startsWith(folder))) return IMMUTABLE;
  if (url === '/index.html' || url === '/sw.js') return REVALIDATE;
  return SHORT;
}

export function webRouter(webDir: string): Express {
  // An app of its own, not a Router: the API app turns ETags off (its answers are no-store), but
  // the web app's files keep theirs, so a browser revalidates index.html with a cheap 304.
  const router = express();
  router.disable('x-powered-by');
  router.set('etag', 'weak');
  const root = path.resolve(webDir);
  const indexHtml = path.join(root, 'index.html');
  const serve = expressStaticGzip(root, {
    enableBrotli: true,
    orderPreference: ['br', 'gzip'],
    index: false,
    serveStatic: {
      index: false,
      cacheControl: false,
      setHeaders: (res: ServerResponse, filePath: string) => res.setHeader('Cache-Control', cacheControlFor(root, filePath)),
    },
  });
  router.use(serve);
  // A missing hashed file is a 404, not the app: a stale page asking for an old chunk must fail
  // visibly rather than parse HTML as script.
  for (const folder of HASHED_FOLDERS) {
    router.use(folder.slice(0, -1), (_req: Request, res: Response) => {
      res.status(404).type('text/plain').send('Not found');
    });
  }
  router.get(/^(?!\/api(\/|$)).*/, (req: Request, res: Response, next: NextFunction) => {
    if (!existsSync(indexHtml)) {
      res.status(503).type('text/plain').send('The web app is not built yet. Run `npm start` (it builds it) or `npm run build:web`.');
      return;
    }
    req.url = '/index.html';
    serve(req, res, next);
  });
  return router;
}
