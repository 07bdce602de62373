import { Router } from 'express';
import { z } from 'zod';
import { idListSchema } from '../../shared/schemas/common';
import type { Config } from '../config';
import type { Db } from '../db';
import { NotFoundError, ValidationError } from '../errors';
import { requireRole } from '../middleware/require-role';
import { validate } from '../middleware/validate';
import { labelSheetPdf } from '../services/labels';

const MAX_LABELS = 210; // ten sheets

const querySchema = z.object({ items: idListSchema }).strict();

export function labelsRouter(db: Db, config: Config): Router {
  const router = Router();
  router.get('/labels.pdf', requireRole('manager', 'officer'), async (req, res) => {
    const { items: ids } = validate(querySchema, req.query, 'label request');
    if (ids.length > MAX_LABELS) throw new ValidationError(`At most ${MAX_LABELS} labels per request.`, { items: ['Too many items'] });
    const rows = await db('items').whereIn('id', ids).select('id', 'tag', 'name', 'rated_kv');
    const missing = ids.filter((id) => !rows.some((r) => r.id === id));
    if (missing.length > 0) throw new NotFoundError(`No item with id ${missing.join(', ')}.`);
    const byId = new Map(rows.map((r) => [r.id, r]));
    const items = ids.map((id) => {
      const r = byId.get(id)!;
      return { tag: r.tag, name: r.name, ratedKv: r.rated_kv === null ? null : Number(r.rated_kv) };
    });
    const pdf = await labelSheetPdf(items, config.publicUrl);
    res.type('application/pdf').set('Content-Disposition', 'inline; filename="voltcrib-labels.pdf"').send(pdf);
  });
  return router;
}
