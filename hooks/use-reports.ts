// The manager's reports: use per group over a period, bookings overdue now, inspections coming
// due, and where each one's CSV download lives.
import { keepPreviousData, useQuery } from '@tanstack/react-query';

import type { BookingSummary } from '@/shared/schemas/bookings';
import type { DeskOverview, GroupUsage, InspectionDue, InspectionsDueReport, UsageReport } from '@/shared/schemas/reports';

import { apiRequest } from './api-client';

/** Calendar dates, YYYY-MM-DD, both ends included. */
export interface ReportPeriod {
  from: string;
  to: string;
}

/** An overdue booking is a booking summary (GET /api/bookings?status=overdue). */
export type OverdueBooking = BookingSummary;
export type { DeskOverview, GroupUsage, InspectionDue, UsageReport };

export const INSPECTIONS_DUE_LIMIT = 50;
const OVERDUE_LIMIT = 100;

export const reportKeys = {
  all: ['reports'] as const,
  usage: (period: ReportPeriod) => [...reportKeys.all, 'usage', period.from, period.to] as const,
  // These two live under the bookings and items list keys on purpose: a return, a cancellation or a
  // recorded inspection invalidates those lists, and these reports must refresh with them.
  overdue: () => ['bookings', 'list', 'report', 'overdue'] as const,
  inspectionsDue: () => ['items', 'list', 'report', 'inspections-due'] as const,
  // Under the bookings lists, so a decision, release or return refreshes the desk at once.
  desk: () => ['bookings', 'list', 'report', 'desk'] as const,
};

/**
 * The API takes instants: the period runs from local midnight at the start of `from` to local
 * midnight after `to`, so "the last 30 days" includes all of today in the lab's own time zone.
 */
export function periodToInstants(period: ReportPeriod): { from: string; to: string } {
  const midnight = (isoDate: string, addDays: number) => {
    const [year, month, day] = isoDate.split('-').map(Number);
    return new Date(year ?? 1970, (month ?? 1) - 1, (day ?? 1) + addDays).toISOString();
  };
  return { from: midnight(period.from, 0), to: midnight(period.to, 1) };
}

const periodQuery = (period: ReportPeriod) => new URLSearchParams(periodToInstants(period)).toString();

/** Plain links (text/csv downloads with the session cookie), not fetched as JSON. */
export const reportUrls = {
  usageCsv: (period: ReportPeriod) => `/api/reports/usage.csv?${periodQuery(period)}`,
  overdueCsv: () => '/api/reports/overdue.csv',
  inspectionsCsv: () => '/api/reports/inspections.csv',
};

export function useUsageReportQuery(period: ReportPeriod) {
  return useQuery({
    queryKey: reportKeys.usage(period),
    queryFn: ({ signal }) => apiRequest<UsageReport>(`/api/reports/usage?${periodQuery(period)}`, { signal }),
    // Keep the previous period's table on screen while the next one loads.
    placeholderData: keepPreviousData,
  });
}

/** Every overdue booking (managers see everyone's): released and past its end. */
export function useOverdueBookingsQuery() {
  return useQuery({
    queryKey: reportKeys.overdue(),
    queryFn: ({ signal }) =>
      apiRequest<{ bookings: OverdueBooking[]; nextCursor: string | null }>(`/api/bookings?status=overdue&limit=${OVERDUE_LIMIT}`, { signal }),
  });
}

/** Items whose inspection is overdue, due soon or never done (never done blocks release too). */
export function useInspectionsDueQuery() {
  return useQuery({
    queryKey: reportKeys.inspectionsDue(),
    queryFn: ({ signal }) => apiRequest<InspectionsDueReport>(`/api/reports/inspections?limit=${INSPECTIONS_DUE_LIMIT}`, { signal }),
  });
}

/** Today's desk for officers and managers: counts of what needs someone now. */
export function useDeskOverviewQuery(enabled: boolean) {
  return useQuery({
    queryKey: reportKeys.desk(),
    queryFn: ({ signal }) => apiRequest<DeskOverview>('/api/reports/desk', { signal }),
    enabled,
    // Counts span bookings and gear; a minute old is fresh enough for a desk.
    refetchInterval: 60_000,
  });
}
