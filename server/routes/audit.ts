import { Router } from 'express';
import { z } from 'zod';
import type { Db } from '../db';
import { requireRole } from '../middleware/require-role';
import { validate } from '../middleware/validate';
import { verifyAuditChain } from '../services/audit';
import { listAudit } from '../services/audit-trail';

const querySchema = z
  .object({
    entity: z.string().max(40).optional(),
    id: z.string().max(64).optional(),
    tag: z.string().trim().min(1).max(32).optional(),
    person: z.string().trim().min(2).max(120).optional(),
    from: z.iso.datetime({ offset: true }).optional(),
    to: z.iso.datetime({ offset: true }).optional(),
    cursor: z.coerce.number().int().positive().optional(),
    limit: z.coerce.number().int().min(1).max(200).default(50),
  })
  .strict()
  .refine((q) => !q.from || !q.to || new Date(q.from) < new Date(q.to), { path: ['to'], message: 'The end must come after the start' });

export function auditRouter(db: Db): Router {
  const router = Router();
  router.get('/', requireRole('officer', 'manager'), async (req, res) => {
    const q = validate(querySchema, req.query, 'audit filter');
    res.json(
      await listAudit(db, { entity: q.entity, entityId: q.id, tag: q.tag, person: q.person, from: q.from, to: q.to, beforeId: q.cursor, limit: q.limit }),
    );
  });
  router.get('/verify', requireRole('officer', 'manager'), async (_req, res) => {
    res.json(await verifyAuditChain(db));
  });
  return router;
}
