import { Router } from 'express';
import { idParamSchema } from '../../shared/schemas/common';
import type { Db } from '../db';
import { currentUser, requireRole, requireSignedIn } from '../middleware/require-role';
import { validate } from '../middleware/validate';
import { createTemplate, listTemplates, replaceTemplate, retireTemplate } from '../services/checklists';

export function checklistTemplatesRouter(db: Db): Router {
  const router = Router();
  router.get('/', requireSignedIn, async (_req, res) => {
    res.json({ templates: await listTemplates(db) });
  });
  router.post('/', requireRole('officer'), async (req, res) => {
    res.status(201).json({ template: await createTemplate(db, currentUser(req), req.body) });
  });
  router.put('/:id', requireRole('officer'), async (req, res) => {
    const { id } = validate(idParamSchema, req.params, 'checklist line id');
    res.json({ template: await replaceTemplate(db, currentUser(req), id, req.body) });
  });
  router.delete('/:id', requireRole('officer'), async (req, res) => {
    const { id } = validate(idParamSchema, req.params, 'checklist line id');
    await retireTemplate(db, currentUser(req), id);
    res.status(204).end();
  });
  return router;
}
