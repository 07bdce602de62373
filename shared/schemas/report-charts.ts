// The reports' chart figures (server/services/report-charts.ts), shared by the server and the app.
export interface ChartsReport {
  from: string;
  to: string;
  /** Hours booked (not cancelled or refused) per group per ISO week (Monday, UTC). */
  bookedHours: { week: string; groupName: string; hours: number }[];
  /** Hours gear was out after release (and so may have been energized), per group. */
  energizedHours: { groupName: string; hours: number }[];
  /** Returns that came back after the booking's end, or are still out past it, per week of the end. */
  overdueReturns: { week: string; count: number }[];
  /** Inspections and calibrations due over the next 12 weeks by kind; overdue and never-done ones in this week. */
  inspectionsDue: { week: string; kind: string; count: number; overdue: number; never: number }[];
  /** Incidents per calendar month (UTC) by kind and severity. */
  incidents: { month: string; kind: string; severity: string; count: number }[];
}

export const CHART_CSV_COLUMNS = {
  'booked-hours': ['week', 'groupName', 'hours'],
  'energized-hours': ['groupName', 'hours'],
  'overdue-returns': ['week', 'count'],
  'inspections-due': ['week', 'kind', 'count', 'overdue', 'never'],
  incidents: ['month', 'kind', 'severity', 'count'],
} as const;
export type ChartCsvName = keyof typeof CHART_CSV_COLUMNS;
