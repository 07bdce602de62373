import { Router } from 'express';
import { labRulesSchema } from '../../shared/schemas/bookings';
import type { Db } from '../db';
import { currentUser, requireRole, requireSignedIn } from '../middleware/require-role';
import { validate } from '../middleware/validate';
import { confirmLabRules, getLabRules, getLabRulesState, updateLabRules } from '../services/lab-rules';

export function labRulesRouter(db: Db): Router {
  const router = Router();
  router.get('/', requireSignedIn, async (_req, res) => {
    res.json(await getLabRules(db));
  });
  router.put('/', requireRole('officer'), async (req, res) => {
    res.json(await updateLabRules(db, currentUser(req), validate(labRulesSchema, req.body, 'lab rules')));
  });
  // A change applies to the officers who made it only once another officer confirms it.
  router.get('/confirmation', requireRole('officer', 'manager'), async (_req, res) => {
    const { confirmed, pendingEditors } = await getLabRulesState(db);
    res.json({ confirmed, pendingEditors });
  });
  router.post('/confirm', requireRole('officer'), async (req, res) => {
    res.json(await confirmLabRules(db, currentUser(req)));
  });
  return router;
}
