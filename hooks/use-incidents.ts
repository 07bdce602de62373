// Incidents: the queue and per-item/per-booking lists, one report, reporting, the officer's
// review, corrective actions past due. Every mutation refreshes incidents, the gear it may have
// tagged out and the audit.
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';

import type {
  CorrectiveAction,
  Incident,
  IncidentCreateInput,
  IncidentKind,
  IncidentStatus,
  IncidentSummary,
  IncidentUpdateInput,
} from '@/shared/schemas/incidents';

import { apiRequest, apiUpload } from './api-client';
import { auditKeys } from './use-audit';
import { itemKeys } from './use-items';

export type { CorrectiveAction, Incident, IncidentSummary };

export interface IncidentFilters {
  status?: IncidentStatus;
  kind?: IncidentKind;
  itemId?: number;
  bookingId?: number;
}

export const incidentKeys = {
  all: ['incidents'] as const,
  lists: () => [...incidentKeys.all, 'list'] as const,
  list: (filters: IncidentFilters) => [...incidentKeys.lists(), filters] as const,
  detail: (id: number) => [...incidentKeys.all, 'detail', id] as const,
  pastDue: () => [...incidentKeys.all, 'past-due'] as const,
};

function listPath(filters: IncidentFilters): string {
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(filters)) if (value !== undefined) params.set(key, String(value));
  const query = params.toString();
  return `/api/incidents${query ? `?${query}` : ''}`;
}

export function useIncidentsQuery(filters: IncidentFilters, enabled = true) {
  return useQuery({
    queryKey: incidentKeys.list(filters),
    queryFn: ({ signal }) => apiRequest<{ incidents: IncidentSummary[] }>(listPath(filters), { signal }).then((r) => r.incidents),
    enabled,
  });
}

export function useIncidentQuery(id: number) {
  return useQuery({
    queryKey: incidentKeys.detail(id),
    queryFn: ({ signal }) => apiRequest<{ incident: Incident }>(`/api/incidents/${id}`, { signal }).then((r) => r.incident),
    enabled: Number.isInteger(id) && id > 0,
  });
}

export function usePastDueActionsQuery() {
  return useQuery({
    queryKey: incidentKeys.pastDue(),
    queryFn: ({ signal }) => apiRequest<{ actions: CorrectiveAction[] }>('/api/incidents/actions/past-due', { signal }).then((r) => r.actions),
  });
}

function useRefresh() {
  const queryClient = useQueryClient();
  return () =>
    Promise.all([
      queryClient.invalidateQueries({ queryKey: incidentKeys.all }),
      queryClient.invalidateQueries({ queryKey: itemKeys.all }),
      queryClient.invalidateQueries({ queryKey: auditKeys.all }),
    ]);
}

export function useReportIncidentMutation() {
  const refresh = useRefresh();
  return useMutation({
    mutationFn: (input: IncidentCreateInput) => apiRequest<{ incident: Incident }>('/api/incidents', { method: 'POST', body: input }).then((r) => r.incident),
    onSuccess: refresh,
  });
}

export function useReviewIncidentMutation(id: number) {
  const refresh = useRefresh();
  return useMutation({
    mutationFn: (input: IncidentUpdateInput) =>
      apiRequest<{ incident: Incident }>(`/api/incidents/${id}`, { method: 'PATCH', body: input }).then((r) => r.incident),
    onSuccess: refresh,
  });
}

export function useActionDoneMutation() {
  const refresh = useRefresh();
  return useMutation({
    mutationFn: ({ actionId, done }: { actionId: number; done: boolean }) =>
      apiRequest<{ incident: Incident }>(`/api/incidents/actions/${actionId}`, { method: 'PATCH', body: { done } }).then((r) => r.incident),
    onSuccess: refresh,
  });
}

/** Adds one photo to a report (after it is sent: the report's id names where it goes). */
export function useUploadIncidentPhotoMutation() {
  const refresh = useRefresh();
  return useMutation({
    mutationFn: ({ incidentId, file }: { incidentId: number; file: Blob & { name: string } }) => {
      const form = new FormData();
      form.append('file', file, file.name);
      return apiUpload<{ file: { id: number } }>(`/api/incidents/${incidentId}/photos`, form, () => undefined);
    },
    onSuccess: refresh,
  });
}
