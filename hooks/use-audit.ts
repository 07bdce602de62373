import { useInfiniteQuery, useQuery } from '@tanstack/react-query';

import type { AuditEvent, AuditPage, AuditVerification } from '@/shared/schemas/audit';

import { apiRequest } from './api-client';

export type { AuditEvent, AuditPage, AuditVerification };

export interface AuditFilter {
  entity?: string;
  id?: string;
  /** A gear tag or its start. */
  tag?: string;
  /** Part of a name or e-mail address. */
  person?: string;
  /** ISO instants (the day's start and end on the reader's clock). */
  from?: string;
  to?: string;
}

export const auditKeys = {
  all: ['audit'] as const,
  lists: () => [...auditKeys.all, 'list'] as const,
  list: (filter: AuditFilter) => [...auditKeys.lists(), filter] as const,
  verify: () => [...auditKeys.all, 'verify'] as const,
};

const PAGE_SIZE = 30;

function auditPath(filter: AuditFilter, cursor: string | null): string {
  const params = new URLSearchParams({ limit: String(PAGE_SIZE) });
  if (filter.entity) params.set('entity', filter.entity);
  if (filter.id) params.set('id', filter.id);
  if (filter.tag) params.set('tag', filter.tag);
  if (filter.person) params.set('person', filter.person);
  if (filter.from) params.set('from', filter.from);
  if (filter.to) params.set('to', filter.to);
  if (cursor) params.set('cursor', cursor);
  return `/api/audit?${params.toString()}`;
}

/** Newest first; each page continues below the last id of the one before. */
export function useAuditInfiniteQuery(filter: AuditFilter) {
  return useInfiniteQuery({
    queryKey: auditKeys.list(filter),
    queryFn: ({ pageParam, signal }) => apiRequest<AuditPage>(auditPath(filter, pageParam), { signal }),
    initialPageParam: null as string | null,
    getNextPageParam: (last) => last.nextCursor,
  });
}

/** Walks the whole hash chain on the server: run on request only, never in the background. */
export function useAuditVerificationQuery() {
  return useQuery({
    queryKey: auditKeys.verify(),
    queryFn: ({ signal }) => apiRequest<AuditVerification>('/api/audit/verify', { signal }),
    enabled: false,
    staleTime: 0,
    retry: false,
  });
}
