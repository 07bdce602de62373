// The lab manager's one-page monthly safety summary (issue 17 point 3): the month's incidents by
// kind and severity and where their reviews stand, corrective actions, overdue returns, use, and
// the inspections that block release now. Figures as JSON (for the test and the screen) and as a
// PDF drawn with pdfkit in the app's typeface.
import path from 'node:path';
import PDFDocument from 'pdfkit';
import { INCIDENT_KINDS, INCIDENT_SEVERITIES, incidentKindWords, incidentSeverityWords } from '../../shared/schemas/incidents';
import type { Db } from '../db';
import { mailDay } from '../mail/lab-time';
import { todayIso } from './dates';

const FONT_DIR = path.dirname(require.resolve('@expo-google-fonts/atkinson-hyperlegible/package.json'));
const FONT_REGULAR = path.join(FONT_DIR, '400Regular', 'AtkinsonHyperlegible_400Regular.ttf');
const FONT_BOLD = path.join(FONT_DIR, '700Bold', 'AtkinsonHyperlegible_700Bold.ttf');

export interface SafetySummary {
  month: string;
  incidents: { total: number; byKind: Record<string, number>; bySeverity: Record<string, number>; open: number; underReview: number; closed: number };
  actions: { raised: number; done: number; pastDue: number };
  bookings: { count: number; hours: number };
  overdueReturns: number;
  inspections: { overdue: number; never: number };
}

/** [start, end) of a calendar month "YYYY-MM" in UTC. */
export function monthBounds(month: string): { from: Date; to: Date } {
  const [y, m] = month.split('-').map(Number) as [number, number];
  return { from: new Date(Date.UTC(y, m - 1, 1)), to: new Date(Date.UTC(y, m, 1)) };
}

export async function safetySummary(db: Db, month: string, now = new Date()): Promise<SafetySummary> {
  const { from, to } = monthBounds(month);
  const incidents = await db('incidents').where('occurred_at', '>=', from).andWhere('occurred_at', '<', to).select('id', 'kind', 'severity', 'status');
  const byKind = Object.fromEntries(INCIDENT_KINDS.map((k) => [k, 0])) as Record<string, number>;
  const bySeverity = Object.fromEntries(INCIDENT_SEVERITIES.map((s) => [s, 0])) as Record<string, number>;
  for (const i of incidents) {
    byKind[i.kind] = (byKind[i.kind] ?? 0) + 1;
    bySeverity[i.severity] = (bySeverity[i.severity] ?? 0) + 1;
  }
  const ids = incidents.map((i) => i.id as number);
  const today = todayIso(now);
  const actions = ids.length === 0 ? [] : await db('incident_actions').whereIn('incident_id', ids).select('done_at', 'due_on');
  const [use] = (await db('bookings')
    .whereNotIn('status', ['cancelled', 'refused'])
    .andWhere('starts_at', '<', to)
    .andWhere('ends_at', '>', from)
    .select(
      db.raw('COUNT(*) AS n'),
      db.raw('COALESCE(SUM(TIMESTAMPDIFF(SECOND, GREATEST(starts_at, ?), LEAST(ends_at, ?))), 0) / 3600 AS hours', [from, to]),
    )) as unknown as { n: number; hours: number }[];
  const [overdue] = (await db('bookings')
    .whereIn('status', ['released', 'returned'])
    .andWhere('ends_at', '>=', from)
    .andWhere('ends_at', '<', to)
    .andWhere((w) => w.whereRaw('returned_at > ends_at').orWhere((o) => o.whereNull('returned_at').andWhere('ends_at', '<', now)))
    .count({ n: '*' })) as { n: number }[];
  const [inspections] = (await db('items')
    .whereNot('status', 'retired')
    .select(db.raw('SUM(next_inspection_due < ?) AS overdue', [today]), db.raw('SUM(next_inspection_due IS NULL) AS never'))) as unknown as {
    overdue: number | null;
    never: number | null;
  }[];
  return {
    month,
    incidents: {
      total: incidents.length,
      byKind,
      bySeverity,
      open: incidents.filter((i) => i.status === 'open').length,
      underReview: incidents.filter((i) => i.status === 'under-review').length,
      closed: incidents.filter((i) => i.status === 'closed').length,
    },
    actions: {
      raised: actions.length,
      done: actions.filter((a) => a.done_at !== null).length,
      pastDue: actions.filter((a) => a.done_at === null && String(a.due_on instanceof Date ? a.due_on.toISOString().slice(0, 10) : a.due_on) < today).length,
    },
    bookings: { count: Number(use?.n ?? 0), hours: Math.round(Number(use?.hours ?? 0) * 10) / 10 },
    overdueReturns: Number(overdue?.n ?? 0),
    inspections: { overdue: Number(inspections?.overdue ?? 0), never: Number(inspections?.never ?? 0) },
  };
}

const MONTH_WORDS = new Intl.DateTimeFormat('en-GB', { month: 'long', year: 'numeric', timeZone: 'UTC' });

export async function safetySummaryPdf(summary: SafetySummary, now = new Date()): Promise<Buffer> {
  const doc = new PDFDocument({ size: 'A4', margin: 56, info: { Title: `Voltcrib safety summary ${summary.month}`, Creator: 'Voltcrib' } });
  doc.registerFont('regular', FONT_REGULAR);
  doc.registerFont('bold', FONT_BOLD);
  const chunks: Buffer[] = [];
  doc.on('data', (chunk: Buffer) => chunks.push(chunk));
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });

  const heading = (text: string) => doc.moveDown(0.8).font('bold').fontSize(13).fillColor('black').text(text);
  const line = (label: string, value: string | number) => doc.font('regular').fontSize(11).fillColor('black').text(`${label}: ${value}`);
  const { from } = monthBounds(summary.month);

  doc
    .font('bold')
    .fontSize(20)
    .text(`Safety summary, ${MONTH_WORDS.format(from)}`);
  doc
    .font('regular')
    .fontSize(11)
    .fillColor('#333333')
    .text(`Prepared by Voltcrib on ${mailDay(todayIso(now))}. Months and weeks are counted in UTC.`);

  heading('Incidents and near misses');
  line('Reported this month', summary.incidents.total);
  for (const kind of INCIDENT_KINDS) line(incidentKindWords[kind].label, summary.incidents.byKind[kind] ?? 0);
  heading('By severity');
  for (const severity of INCIDENT_SEVERITIES) line(incidentSeverityWords[severity].label, summary.incidents.bySeverity[severity] ?? 0);
  line('Reviews: open', summary.incidents.open);
  line('Reviews: under review', summary.incidents.underReview);
  line('Reviews: closed', summary.incidents.closed);

  heading('Corrective actions (for this month’s incidents)');
  line('Raised', summary.actions.raised);
  line('Done', summary.actions.done);
  line('Past due', summary.actions.pastDue);

  heading('Use and returns');
  line('Bookings', summary.bookings.count);
  line('Hours booked', summary.bookings.hours);
  line('Overdue returns', summary.overdueReturns);

  heading('Inspections blocking release now');
  line('Overdue', summary.inspections.overdue);
  line('Never inspected', summary.inspections.never);

  doc
    .moveDown(1.2)
    .font('regular')
    .fontSize(9)
    .fillColor('#333333')
    .text('Severities: ' + INCIDENT_SEVERITIES.map((s) => `${incidentSeverityWords[s].label}: ${incidentSeverityWords[s].definition}`).join(' '), {
      width: 480,
    });
  doc.end();
  return done;
}
