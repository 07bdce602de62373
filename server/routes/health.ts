import { Router } from 'express';
import type { Db } from '../db';

export function healthRouter(db: Db): Router {
  const router = Router();
  router.get('/', async (_req, res) => {
    try {
      await db.raw('SELECT 1');
      res.json({ ok: true, db: 'up' });
    } catch {
      res.status(503).json({ ok: false, db: 'down' });
    }
  });
  return router;
}
