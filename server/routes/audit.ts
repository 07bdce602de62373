import { Router } from 'express';
import { z } from 'zod';
import type { Db } from '../db';
import { requireRole } from '../middleware/require-role';
import { validate } from '../middleware/validate';
import { listAudit, verifyAuditChain } from '../services/audit';

const querySchema = z
  .object({
    entity: z.string().max(40).optional(),
    id: z.string().max(64).optional(),
    cursor: z.coerce.number().int().positive().optional(),
    limit: z.coerce.number().int().min(1).max(200).default(50),
  })
  .strict();

export function auditRouter(db: Db): Router {
  const router = Router();
  router.get('/', requireRole('officer', 'manager'), async (req, res) => {
    const q = validate(querySchema, req.query, 'audit filter');
    res.json(await listAudit(db, { entity: q.entity, entityId: q.id, beforeId: q.cursor, limit: q.limit }));
  });
  router.get('/verify', requireRole('officer', 'manager'), async (_req, res) => {
    res.json(await verifyAuditChain(db));
  });
  return router;
}
