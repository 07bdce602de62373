import { Router, type Response } from 'express';
import { z } from 'zod';
import type { Db } from '../db';
import { requireRole } from '../middleware/require-role';
import { validate } from '../middleware/validate';
import { deskOverview, inspectionRows, inspectionsDue, overdueRows, toCsv, usageByGroup } from '../services/reports';
import { DUE_SOON_DAYS } from '../../shared/schemas/items';
import { CHART_CSV_COLUMNS, type ChartCsvName, type ChartsReport } from '../../shared/schemas/report-charts';
import { NotFoundError } from '../errors';
import { chartsReport } from '../services/report-charts';
import { safetySummary, safetySummaryPdf } from '../services/safety-summary';

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
const monthSchema = z.object({ month: z.string().regex(/^\d{4}-(0[1-9]|1[0-2])$/, 'Give a month as YYYY-MM, for example 2026-11') }).strict();

/** Which rows of the charts answer each CSV holds. */
const CHART_ROWS: Record<ChartCsvName, (r: ChartsReport) => Record<string, unknown>[]> = {
  'booked-hours': (r) => r.bookedHours,
  'energized-hours': (r) => r.energizedHours,
  'overdue-returns': (r) => r.overdueReturns,
  'inspections-due': (r) => r.inspectionsDue,
  incidents: (r) => r.incidents,
};
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
    sendCsv(
      res,
      'voltcrib-usage.csv',
      toCsv((await usageByGroup(db, from, to)) as unknown as Record<string, unknown>[], ['groupName', 'bookings', 'hours', 'people']),
    );
  });
  router.get('/charts', async (req, res) => {
    const { from, to } = validate(periodSchema, req.query, 'period');
    res.json(await chartsReport(db, from, to));
  });
  router.get('/charts/:name.csv', async (req, res) => {
    const name = String(req.params.name);
    if (!(name in CHART_CSV_COLUMNS)) throw new NotFoundError(`No chart called ${name}.`);
    const { from, to } = validate(periodSchema, req.query, 'period');
    const chart = name as ChartCsvName;
    sendCsv(res, `voltcrib-${chart}.csv`, toCsv(CHART_ROWS[chart](await chartsReport(db, from, to)), [...CHART_CSV_COLUMNS[chart]]));
  });
  router.get('/safety-summary', async (req, res) => {
    const { month } = validate(monthSchema, req.query, 'month');
    res.json({ summary: await safetySummary(db, month) });
  });
  router.get('/safety-summary.pdf', async (req, res) => {
    const { month } = validate(monthSchema, req.query, 'month');
    const pdf = await safetySummaryPdf(await safetySummary(db, month));
    res.type('application/pdf').set('Content-Disposition', `attachment; filename="voltcrib-safety-summary-${month}.pdf"`).send(pdf);
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
