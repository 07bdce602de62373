// A booking's bench log: its runs (with derived figures, flags and corona fits), recording,
// corrections, removal by staff and CSV import. Every mutation refreshes the runs and the audit.
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';

import type { BenchRun, BenchRunEdit, BenchRunImport, BenchRunInput, BenchRunRevision, BenchRunsResponse } from '@/shared/schemas/bench-runs';

import { apiRequest } from './api-client';
import { auditKeys } from './use-audit';

export type { BenchRun, BenchRunsResponse };

export const benchRunKeys = {
  all: ['bench-runs'] as const,
  booking: (bookingId: number) => [...benchRunKeys.all, bookingId] as const,
  revisions: (bookingId: number, runId: number) => [...benchRunKeys.booking(bookingId), 'revisions', runId] as const,
};

/** The CSV export, for a download link (the session cookie goes with it). */
export const benchRunsCsvUrl = (bookingId: number) => `/api/bookings/${bookingId}/runs.csv`;

export function useBenchRunsQuery(bookingId: number) {
  return useQuery({
    queryKey: benchRunKeys.booking(bookingId),
    queryFn: ({ signal }) => apiRequest<BenchRunsResponse>(`/api/bookings/${bookingId}/runs`, { signal }),
    enabled: Number.isInteger(bookingId) && bookingId > 0,
  });
}

export function useRunRevisionsQuery(bookingId: number, runId: number | null) {
  return useQuery({
    queryKey: benchRunKeys.revisions(bookingId, runId ?? 0),
    queryFn: ({ signal }) => apiRequest<{ revisions: BenchRunRevision[] }>(`/api/bookings/${bookingId}/runs/${runId}/revisions`, { signal }),
    select: (data) => data.revisions,
    enabled: runId !== null,
  });
}

function useRefresh(bookingId: number) {
  const queryClient = useQueryClient();
  return () =>
    Promise.all([queryClient.invalidateQueries({ queryKey: benchRunKeys.booking(bookingId) }), queryClient.invalidateQueries({ queryKey: auditKeys.all })]);
}

export function useRecordRunMutation(bookingId: number) {
  const refresh = useRefresh(bookingId);
  return useMutation({
    mutationFn: (input: BenchRunInput) => apiRequest<{ run: BenchRun }>(`/api/bookings/${bookingId}/runs`, { method: 'POST', body: input }).then((r) => r.run),
    onSuccess: refresh,
  });
}

export function useEditRunMutation(bookingId: number) {
  const refresh = useRefresh(bookingId);
  return useMutation({
    mutationFn: ({ runId, edit }: { runId: number; edit: BenchRunEdit }) =>
      apiRequest<{ run: BenchRun }>(`/api/bookings/${bookingId}/runs/${runId}`, { method: 'PUT', body: edit }).then((r) => r.run),
    onSuccess: refresh,
  });
}

export function useDeleteRunMutation(bookingId: number) {
  const refresh = useRefresh(bookingId);
  return useMutation({
    mutationFn: ({ runId, reason }: { runId: number; reason: string }) =>
      apiRequest<void>(`/api/bookings/${bookingId}/runs/${runId}`, { method: 'DELETE', body: { reason } }),
    onSuccess: refresh,
  });
}

export function useImportRunsMutation(bookingId: number) {
  const refresh = useRefresh(bookingId);
  return useMutation({
    mutationFn: (body: BenchRunImport) =>
      apiRequest<{ runs: BenchRun[]; imported: number }>(`/api/bookings/${bookingId}/runs/import`, { method: 'POST', body }),
    onSuccess: refresh,
  });
}
