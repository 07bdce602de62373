import { Router } from 'express';
import { labRulesSchema } from '../../shared/schemas/bookings';
import type { Db } from '../db';
import { currentUser, requireRole, requireSignedIn } from '../middleware/require-role';
import { validate } from '../middleware/validate';
import { getLabRules, updateLabRules } from '../services/lab-rules';

export function labRulesRouter(db: Db): Router {
  const router = Router();
  router.get('/', requireSignedIn, async (_req, res) => {
    res.json(await getLabRules(db));
  });
  router.put('/', requireRole('officer'), async (req, res) => {
    res.json(await updateLabRules(db, currentUser(req), validate(labRulesSchema, req.body, 'lab rules')));
  });
  return router;
}
