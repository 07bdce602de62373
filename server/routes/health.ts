import { Router } from 'express';
import type { Db } from '../db';
import { retryCounters } from '../services/deadlock-retry';

export function healthRouter(db: Db): Router {
  const router = Router();
  router.get('/', async (_req, res) => {
    try {
      await db.raw('SELECT 1');
      // How often this process ran a transaction again (lock conflicts, cluster certification):
      // the bench reads it; nothing in it names a person or a record.
      res.json({ ok: true, db: 'up', retries: { ...retryCounters } });
    } catch {
      res.status(503).json({ ok: false, db: 'down' });
    }
  });
  return router;
}
