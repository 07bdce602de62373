// Serves the exported Expo web app from the same origin as /api. Unknown non-API paths get
// index.html so deep links such as /i/<tag> (a scanned label) open the right screen.
import express, { type Express } from 'express';
import { existsSync } from 'node:fs';
import path from 'node:path';

export function webRouter(webDir: string): Express {
  // An app of its own, not a Router: the API app turns ETags off (its answers are no-store), but
  // the web app's files keep theirs, so a browser revalidates index.html with a cheap 304.
  const router = express();
  router.disable('x-powered-by');
  router.set('etag', 'weak');
  const root = path.resolve(webDir);
  const indexHtml = path.join(root, 'index.html');
  router.use(
    '/_expo/static',
    express.static(path.join(root, '_expo', 'static'), { immutable: true, maxAge: '365d', fallthrough: false }),
  );
  router.use(express.static(root, { index: false, maxAge: '1h' }));
  router.get(/^(?!\/api(\/|$)).*/, (_req, res) => {
    if (!existsSync(indexHtml)) {
      res.status(503).type('text/plain').send('The web app is not built yet. Run `npm start` (it builds it) or `npm run build:web`.');
      return;
    }
    res.set('Cache-Control', 'no-cache').sendFile(indexHtml);
  });
  return router;
}
