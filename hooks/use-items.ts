// The gear registry: list (keyset pages), one item, by tag, its history and bookings, and the
// manager's writes. Every write invalidates the registry's keys here, never in a screen.
import { keepPreviousData, useInfiniteQuery, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';

import type { AuditPage } from '@/shared/schemas/audit';
import type { ItemBooking } from '@/shared/schemas/bookings';
import type { Item, ItemCreateInput, ItemKind, ItemStatus, ItemSummary, ItemUpdateInput } from '@/shared/schemas/items';

import { apiRequest } from './api-client';

/** The list's filters as the screen holds them; empty values are left out of the request. */
export interface ItemFilters {
  q?: string;
  kind?: ItemKind;
  status?: ItemStatus;
  minKv?: number;
  due?: 'soon' | 'overdue';
  sort?: 'tag' | 'name' | 'ratedKv' | 'nextDue';
}

export interface ItemPage {
  items: ItemSummary[];
  nextCursor: string | null;
}

export const itemKeys = {
  all: ['items'] as const,
  lists: () => [...itemKeys.all, 'list'] as const,
  list: (filters: ItemFilters, pageSize: number) => [...itemKeys.lists(), filters, pageSize] as const,
  details: () => [...itemKeys.all, 'detail'] as const,
  detail: (id: number) => [...itemKeys.details(), id] as const,
  history: (id: number) => [...itemKeys.detail(id), 'history'] as const,
  bookings: (id: number) => [...itemKeys.detail(id), 'bookings'] as const,
  clearance: (id: number) => [...itemKeys.detail(id), 'clearance'] as const,
  byTag: (tag: string) => [...itemKeys.all, 'by-tag', tag] as const,
};

export const DEFAULT_PAGE_SIZE = 25;

function listPath(filters: ItemFilters, pageSize: number, cursor: string | undefined): string {
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(filters)) {
    if (value !== undefined && value !== '') params.set(key, String(value));
  }
  params.set('limit', String(pageSize));
  if (cursor) params.set('cursor', cursor);
  return `/api/items?${params.toString()}`;
}

/** Keyset pages: each "Load more" asks for the rows after the last one shown. */
export function useItemsInfiniteQuery(filters: ItemFilters, pageSize = DEFAULT_PAGE_SIZE) {
  return useInfiniteQuery({
    queryKey: itemKeys.list(filters, pageSize),
    queryFn: ({ pageParam, signal }) => apiRequest<ItemPage>(listPath(filters, pageSize, pageParam), { signal }),
    initialPageParam: undefined as string | undefined,
    getNextPageParam: (last) => last.nextCursor ?? undefined,
    // Keep the previous rows on screen while a new search runs, instead of flashing a spinner
    // on every keystroke.
    placeholderData: keepPreviousData,
  });
}

export function useItemQuery(id: number) {
  return useQuery({
    queryKey: itemKeys.detail(id),
    queryFn: ({ signal }) => apiRequest<{ item: Item }>(`/api/items/${id}`, { signal }),
    select: (data) => data.item,
    enabled: Number.isInteger(id) && id > 0,
  });
}

/** A scanned or typed tag; `null` waits. A 404 (no such tag) is final, so it is not retried. */
export function useItemByTagQuery(tag: string | null) {
  return useQuery({
    queryKey: itemKeys.byTag(tag ?? ''),
    queryFn: ({ signal }) => apiRequest<{ item: Item }>(`/api/items/by-tag/${encodeURIComponent(tag ?? '')}`, { signal }),
    select: (data) => data.item,
    enabled: tag !== null && tag !== '',
    // A label may be re-tagged or retired between scans; always ask.
    staleTime: 0,
  });
}

export function useItemHistoryQuery(id: number) {
  return useQuery({
    queryKey: itemKeys.history(id),
    queryFn: ({ signal }) => apiRequest<AuditPage>(`/api/items/${id}/history`, { signal }),
    select: (data) => data.events,
  });
}

export function useItemBookingsQuery(id: number) {
  return useQuery({
    queryKey: itemKeys.bookings(id),
    queryFn: ({ signal }) => apiRequest<{ bookings: ItemBooking[] }>(`/api/items/${id}/bookings`, { signal }),
    select: (data) => data.bookings,
  });
}

export function useCreateItemMutation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: ItemCreateInput) => apiRequest<{ item: Item }>('/api/items', { method: 'POST', body: input }),
    onSuccess: async ({ item }) => {
      queryClient.setQueryData(itemKeys.detail(item.id), { item });
      await queryClient.invalidateQueries({ queryKey: itemKeys.lists() });
    },
  });
}

/** Edits, tag out (`status: 'out-of-service'` with a reason), clear (`in-service`) and retire. */
export function useUpdateItemMutation(id: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: ItemUpdateInput) => apiRequest<{ item: Item }>(`/api/items/${id}`, { method: 'PATCH', body: input }),
    onSuccess: async ({ item }) => {
      queryClient.setQueryData(itemKeys.detail(id), { item });
      // Lists, the by-tag lookups and this item's history all change with it.
      await queryClient.invalidateQueries({ queryKey: itemKeys.all });
    },
  });
}

/** Where the item's label and files live; used as image sources and links, not fetched as JSON. */
export const itemUrls = {
  labelSvg: (id: number) => `/api/items/${id}/label.svg`,
  labelPdf: (id: number) => `/api/items/${id}/label.pdf`,
  labelSheetPdf: (ids: readonly number[]) => `/api/labels.pdf?items=${ids.join(',')}`,
  file: (fileId: number) => `/api/files/${fileId}`,
};

/** Whether a tagged-out item can be put back in service now (a passing inspection since the tag-out). */
export function useItemClearanceQuery(id: number, enabled: boolean) {
  return useQuery({
    queryKey: itemKeys.clearance(id),
    queryFn: ({ signal }) => apiRequest<{ clearable: boolean; reason: string | null }>(`/api/items/${id}/clearance`, { signal }),
    enabled,
  });
}
