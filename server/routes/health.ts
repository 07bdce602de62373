import { Router } from 'express';
import { isDatabaseUnavailable, type Db } from '../db';
import { retryCounters } from '../services/deadlock-retry';

export function healthRouter(db: Db): Router {
  const router = Router();
  router.get('/', async (_req, res) => {
    try {
      // A pooled connection to a database node that just died fails once and is dropped; the
      // next try gets a fresh one through the balancer. Only an outage that outlasts three tries
      // takes this process out of the proxy's rotation.
      await selectOne(db);
      // How often this process ran a transaction again (lock conflicts, cluster certification):
      // the bench reads it; nothing in it names a person or a record.
      res.json({ ok: true, db: 'up', retries: { ...retryCounters } });
    } catch {
      res.status(503).json({ ok: false, db: 'down' });
    }
  });
  return router;
}

async function selectOne(db: Db, tries = 3): Promise<void> {
  for (let attempt = 1; ; attempt += 1) {
    try {
      await db.raw('SELECT 1');
      return;
    } catch (error) {
      if (attempt >= tries || !isDatabaseUnavailable(error)) throw error;
    }
  }
}
