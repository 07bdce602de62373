import { Router } from 'express';
import type { Db } from '../db';
import { requireRole } from '../middleware/require-role';
import { listPeople } from '../services/people';

export function peopleRouter(db: Db): Router {
  const router = Router();
  router.get('/', requireRole('manager'), async (_req, res) => {
    res.json({ people: await listPeople(db) });
  });
  return router;
}
