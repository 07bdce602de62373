import { Router, type Response } from 'express';
import { z } from 'zod';
import type { Db } from '../db';
import { requireRole } from '../middleware/require-role';
import { validate } from '../middleware/validate';
import { deskOverview, inspectionRows, inspectionsDue, overdueRows, toCsv, usageByGroup } from '../services/reports';
import { DUE_SOON_DAYS } from '../../shared/schemas/items';

const periodSchema = z
  .object({ from: z.iso.datetime({ offset: true }).optional(), to: z.iso.datetime({ offset: true }).optional() })
  .strict()
  .transform((v) => {
    const to = v.to ? new Date(v.to) : new Date();
    const from = v.from ? new Date(v.from) : new Date(to.getTime() - 30 * 24 * 3600_000);
    return { from, to };
  })
  .refine((v) => v.to > v.from, { message: 'to must be after from', path: ['to'] })
  .refine((v) => v.to.getTime() - v.from.getTime() <= 3 * 366 * 24 * 3600_000, { message: 'At most three years', path: ['from'] });

const none = z.object({}).strict();
const listSchema = z.object({ limit: z.coerce.number().int().min(1).max(200).default(50) }).strict();

function sendCsv(res: Response, name: string, body: string): void {
  res.type('text/csv; charset=utf-8').set('Content-Disposition', `attachment; filename="${name}"`).send(body);
}

export function reportsRouter(db: Db): Router {
  const router = Router();
  // The desk and the inspections list serve officers too (Today's desk overview); everything
  // registered after the use() below is for managers only.
  router.get('/desk', requireRole('officer', 'manager'), async (req, res) => {
    validate(none, req.query, 'query');
    res.json(await deskOverview(db, new Date(), DUE_SOON_DAYS));
  });
  router.get('/inspections', requireRole('officer', 'manager'), async (req, res) => {
    const { limit } = validate(listSchema, req.query, 'query');
    res.json(await inspectionsDue(db, limit, DUE_SOON_DAYS));
  });
  router.use(requireRole('manager'));
  router.get('/usage', async (req, res) => {
    const { from, to } = validate(periodSchema, req.query, 'period');
    res.json({ from: from.toISOString(), to: to.toISOString(), groups: await usageByGroup(db, from, to) });
  });
  router.get('/usage.csv', async (req, res) => {
    const { from, to } = validate(periodSchema, req.query, 'period');
    sendCsv(res, 'voltcrib-usage.csv', toCsv(await usageByGroup(db, from, to) as unknown as Record<string, unknown>[], ['groupName', 'bookings', 'hours', 'people']));
  });
  router.get('/overdue.csv', async (req, res) => {
    validate(none, req.query, 'query');
    sendCsv(res, 'voltcrib-overdue.csv', toCsv(await overdueRows(db), ['bookingId', 'person', 'email', 'endedAt', 'hoursOverdue', 'plannedKv', 'location']));
  });
  router.get('/inspections.csv', async (req, res) => {
    validate(none, req.query, 'query');
    sendCsv(res, 'voltcrib-inspections.csv', toCsv(await inspectionRows(db), ['tag', 'name', 'kind', 'location', 'status', 'nextDue', 'overdue']));
  });
  return router;
}
