// The reports' charts and the monthly safety summary: their figures and where each download lives.
import { keepPreviousData, useQuery } from '@tanstack/react-query';

import type { ChartCsvName, ChartsReport } from '@/shared/schemas/report-charts';

import { apiRequest } from './api-client';
import { periodToInstants, reportKeys, type ReportPeriod } from './use-reports';

export type { ChartsReport };

export const chartKeys = {
  charts: (period: ReportPeriod) => [...reportKeys.all, 'charts', period.from, period.to] as const,
};

const periodQuery = (period: ReportPeriod) => new URLSearchParams(periodToInstants(period)).toString();

export const chartUrls = {
  csv: (name: ChartCsvName, period: ReportPeriod) => `/api/reports/charts/${name}.csv?${periodQuery(period)}`,
  /** The one-page monthly safety summary, month "YYYY-MM". */
  safetySummaryPdf: (month: string) => `/api/reports/safety-summary.pdf?month=${month}`,
};

export function useChartsReportQuery(period: ReportPeriod) {
  return useQuery({
    queryKey: chartKeys.charts(period),
    queryFn: ({ signal }) => apiRequest<ChartsReport>(`/api/reports/charts?${periodQuery(period)}`, { signal }),
    placeholderData: keepPreviousData,
  });
}
