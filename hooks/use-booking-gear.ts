// Gear as the booking form needs it: a quick search to pick from, each picked item's full ratings
// (the live assessment reads them) and whether it is free over the chosen window. Kept apart from
// the gear screens' own hooks so the two caches never step on each other.
import { keepPreviousData, useQueries, useQuery } from '@tanstack/react-query';

import type { Item, ItemSummary } from '@/shared/schemas/items';

import { apiRequest } from './api-client';

export interface BusySlot {
  bookingId: number;
  status: string;
  startsAt: string;
  endsAt: string;
  personName: string;
}

export const bookingGearKeys = {
  all: ['booking-gear'] as const,
  search: (q: string) => [...bookingGearKeys.all, 'search', q] as const,
  item: (id: number) => [...bookingGearKeys.all, 'item', id] as const,
  availabilities: () => [...bookingGearKeys.all, 'availability'] as const,
  availability: (id: number, from: string, to: string) => [...bookingGearKeys.availabilities(), id, from, to] as const,
};

const SEARCH_LIMIT = 8;

/** In-service and tagged-out gear (retired gear cannot be booked), best matches by tag order. */
export function useGearSearchQuery(q: string, filters: { kind?: string; minKv?: number; limit?: number } = {}) {
  const params = new URLSearchParams({ limit: String(filters.limit ?? SEARCH_LIMIT) });
  if (q.trim() !== '') params.set('q', q.trim());
  if (filters.kind) params.set('kind', filters.kind);
  if (filters.minKv !== undefined && Number.isFinite(filters.minKv) && filters.minKv > 0) params.set('minKv', String(filters.minKv));
  return useQuery({
    queryKey: [...bookingGearKeys.search(q.trim()), params.toString()],
    queryFn: ({ signal }) => apiRequest<{ items: ItemSummary[]; nextCursor: string | null }>(`/api/items?${params.toString()}`, { signal }),
    select: (data) => data.items,
    placeholderData: keepPreviousData,
  });
}

export interface GearItems {
  /** In the order of the ids asked for; only the ones loaded so far. */
  items: Item[];
  loading: boolean;
  error: unknown;
}

/** Full records (ratings included) for the picked items. */
export function useGearItems(ids: readonly number[]): GearItems {
  return useQueries({
    queries: ids.map((id) => ({
      queryKey: bookingGearKeys.item(id),
      queryFn: ({ signal }: { signal: AbortSignal }) => apiRequest<{ item: Item }>(`/api/items/${id}`, { signal }),
    })),
    combine: (results) => ({
      items: results.flatMap((r) => (r.data ? [r.data.item] : [])),
      loading: results.some((r) => r.isPending),
      error: results.find((r) => r.error)?.error ?? null,
    }),
  });
}

export interface Availability {
  busy: BusySlot[] | undefined;
  loading: boolean;
  error: unknown;
}

/** Live bookings holding each item over the window; null window (not valid yet) asks nothing. */
export function useGearAvailability(ids: readonly number[], window: { from: string; to: string } | null): Record<number, Availability> {
  return useQueries({
    queries: ids.map((id) => ({
      queryKey: bookingGearKeys.availability(id, window?.from ?? '', window?.to ?? ''),
      queryFn: ({ signal }: { signal: AbortSignal }) => {
        const params = new URLSearchParams({ from: window!.from, to: window!.to });
        return apiRequest<{ busy: BusySlot[] }>(`/api/items/${id}/availability?${params.toString()}`, { signal });
      },
      enabled: window !== null,
      placeholderData: keepPreviousData,
    })),
    combine: (results) =>
      Object.fromEntries(
        ids.map((id, index) => {
          const r = results[index];
          return [id, { busy: r?.data?.busy, loading: r?.isFetching ?? false, error: r?.error ?? null }];
        }),
      ),
  });
}
