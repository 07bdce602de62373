// What the reports' charts draw, worked out from the figures alone, so each chart's table and
// text summary say exactly what its picture shows. Drawn by the bench log's chart (scatter-chart).
import type { ChartModel, ChartSeries } from '@/components/bench-log/chart-data';
import { incidentKindWords, type IncidentKind } from '@/shared/schemas/incidents';
import type { ChartsReport } from '@/shared/schemas/report-charts';

const dayMonth = new Intl.DateTimeFormat(undefined, { day: 'numeric', month: 'short', timeZone: 'UTC' });
const monthYear = new Intl.DateTimeFormat(undefined, { month: 'short', year: 'numeric', timeZone: 'UTC' });
export const weekLabel = (week: string) => dayMonth.format(new Date(`${week}T00:00:00Z`));
export const monthLabel = (month: string) => monthYear.format(new Date(`${month}-01T00:00:00Z`));

/** At most six named ticks, so labels never overlap on a phone. */
function ticks(labels: string[]): { x: number; label: string }[] {
  const step = Math.max(1, Math.ceil(labels.length / 6));
  return labels.map((label, x) => ({ x, label })).filter((t) => t.x % step === 0);
}

/** One series per name, a point per x where it has a value, joined by a line. */
function seriesBy<T>(
  rows: T[],
  xs: string[],
  nameOf: (r: T) => string,
  xOf: (r: T) => string,
  yOf: (r: T) => number,
  label: (name: string) => string,
): ChartSeries[] {
  const names = [...new Set(rows.map(nameOf))].sort();
  return names.map((name) => {
    const points = xs.map((xKey, x) => ({
      x,
      y: rows.filter((r) => nameOf(r) === name && xOf(r) === xKey).reduce((n, r) => n + yOf(r), 0),
      run: x,
      flagged: false,
    }));
    return { key: name, label: label(name), points, curve: points.map((p) => ({ x: p.x, y: p.y })) };
  });
}

function sorted(values: string[]): string[] {
  return [...new Set(values)].sort();
}

function largest<T>(rows: T[], value: (r: T) => number): T | undefined {
  return rows.reduce<T | undefined>((best, r) => (best === undefined || value(r) > value(best) ? r : best), undefined);
}

const hours = (n: number) => `${Math.round(n * 10) / 10} h`;

export function bookedHoursChart(r: ChartsReport): ChartModel {
  const weeks = sorted(r.bookedHours.map((b) => b.week));
  const total = r.bookedHours.reduce((n, b) => n + b.hours, 0);
  const top = largest(r.bookedHours, (b) => b.hours);
  return {
    key: 'booked-hours',
    title: 'Booked hours per group, by week',
    xLabel: 'Week starting (Monday)',
    yLabel: 'Hours booked',
    xTicks: ticks(weeks.map(weekLabel)),
    series: seriesBy(
      r.bookedHours,
      weeks,
      (b) => b.groupName,
      (b) => b.week,
      (b) => b.hours,
      (g) => g,
    ),
    summary:
      r.bookedHours.length === 0
        ? 'No hours booked in this period.'
        : `${hours(total)} booked over ${weeks.length} week${weeks.length === 1 ? '' : 's'}; the busiest was ${top!.groupName} in the week of ${weekLabel(top!.week)} (${hours(top!.hours)}).`,
  };
}

export function energizedHoursChart(r: ChartsReport): ChartModel {
  const groups = r.energizedHours.map((e) => e.groupName);
  const total = r.energizedHours.reduce((n, e) => n + e.hours, 0);
  const top = largest(r.energizedHours, (e) => e.hours);
  return {
    key: 'energized-hours',
    title: 'Released (energized) hours per group',
    xLabel: 'Group',
    yLabel: 'Hours out after release',
    xTicks: ticks(groups),
    series: [{ key: 'released', label: 'Hours out', points: r.energizedHours.map((e, x) => ({ x, y: e.hours, run: x, flagged: false })) }],
    summary:
      r.energizedHours.length === 0
        ? 'No gear was released in this period.'
        : `${hours(total)} of released gear in all; most by ${top!.groupName} (${hours(top!.hours)}). Counted from release to return, the time the gear may have been energized.`,
  };
}

export function overdueChart(r: ChartsReport): ChartModel {
  const weeks = sorted(r.overdueReturns.map((o) => o.week));
  const total = r.overdueReturns.reduce((n, o) => n + o.count, 0);
  return {
    key: 'overdue-returns',
    title: 'Overdue returns per week',
    xLabel: 'Week of the booking’s end',
    yLabel: 'Returns late or still out',
    xTicks: ticks(weeks.map(weekLabel)),
    series: [
      {
        key: 'overdue',
        label: 'Overdue returns',
        points: r.overdueReturns.map((o, x) => ({ x, y: o.count, run: x, flagged: false })),
        curve: r.overdueReturns.map((o, x) => ({ x, y: o.count })),
      },
    ],
    summary:
      total === 0
        ? 'No return was late in this period.'
        : `${total} return${total === 1 ? '' : 's'} came back late or are still out, over ${weeks.length} week${weeks.length === 1 ? '' : 's'}.`,
  };
}

export function inspectionsChart(r: ChartsReport): ChartModel {
  const weeks = sorted(r.inspectionsDue.map((i) => i.week));
  const now = r.inspectionsDue.filter((i) => i.week === weeks[0]);
  const blocking = now.reduce((n, i) => n + i.overdue + i.never, 0);
  const total = r.inspectionsDue.reduce((n, i) => n + i.count, 0);
  return {
    key: 'inspections-due',
    title: 'Inspections and calibrations due, next 12 weeks',
    xLabel: 'Week starting (Monday)',
    yLabel: 'Items due',
    xTicks: ticks(weeks.map(weekLabel)),
    series: seriesBy(
      r.inspectionsDue,
      weeks,
      (i) => i.kind,
      (i) => i.week,
      (i) => i.count,
      (k) => k,
    ),
    summary:
      total === 0
        ? 'Nothing falls due in the next 12 weeks.'
        : `${total} item${total === 1 ? '' : 's'} due in the next 12 weeks; ${blocking} of them (overdue or never inspected) block release now and are counted in this week.`,
  };
}

export function incidentsChart(r: ChartsReport): ChartModel {
  const months = sorted(r.incidents.map((i) => i.month));
  const total = r.incidents.reduce((n, i) => n + i.count, 0);
  const serious = r.incidents.filter((i) => i.severity === 'serious' || i.severity === 'severe').reduce((n, i) => n + i.count, 0);
  const kindName = (k: string) => incidentKindWords[k as IncidentKind]?.label ?? k;
  return {
    key: 'incidents',
    title: 'Incidents per month, by kind',
    xLabel: 'Month',
    yLabel: 'Incidents reported',
    xTicks: ticks(months.map(monthLabel)),
    series: seriesBy(
      r.incidents,
      months,
      (i) => i.kind,
      (i) => i.month,
      (i) => i.count,
      kindName,
    ),
    summary:
      total === 0
        ? 'No incident was reported in this period.'
        : `${total} incident${total === 1 ? '' : 's'} reported, ${serious} of them serious or severe. The table gives each month by kind and severity.`,
  };
}
