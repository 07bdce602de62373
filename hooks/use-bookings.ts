// Bookings and the safety gate's steps: list, detail, create/change/cancel, the officer's decision,
// and the counter steps (scan, checklist, release, return). Every mutation refreshes the bookings
// cache (and what depends on it) itself, so screens never invalidate anything.
import { useInfiniteQuery, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';

import { ERROR_CODES, type RuleFailure } from '@/shared/errors';

import type {
  ApprovalDecisionInput,
  Booking,
  BookingApproval,
  BookingCreateInput,
  BookingStatus,
  BookingSummary,
  BookingUpdateInput,
  ChecklistRunRecord,
  ChecklistRunState,
  ChecklistSubmitInput,
  ReleasePreview,
  ReturnInput,
} from '@/shared/schemas/bookings';

import { apiRequest, isApiError } from './api-client';
import { auditKeys } from './use-audit';
import { bookingGearKeys } from './use-booking-gear';

export type { Booking, BookingApproval, BookingSummary, ChecklistRunRecord, ChecklistRunState, ReleasePreview };

export type BookingListStatus = BookingStatus | 'overdue' | 'live';

export interface BookingFilters {
  mine: boolean;
  status?: BookingListStatus;
  limit?: number;
}

export const bookingKeys = {
  all: ['bookings'] as const,
  lists: () => [...bookingKeys.all, 'list'] as const,
  list: (filters: BookingFilters) => [...bookingKeys.lists(), filters] as const,
  pages: (filters: BookingFilters) => [...bookingKeys.lists(), 'pages', filters] as const,
  details: () => [...bookingKeys.all, 'detail'] as const,
  detail: (id: number) => [...bookingKeys.details(), id] as const,
  checklistRuns: (id: number) => [...bookingKeys.all, 'checklist-runs', id] as const,
  releaseCheck: (id: number) => [...bookingKeys.all, 'release-check', id] as const,
};

interface BookingPage {
  bookings: BookingSummary[];
  nextCursor: string | null;
}

function listPath(filters: BookingFilters, cursor: string | null): string {
  const params = new URLSearchParams({ limit: String(filters.limit ?? 20) });
  // Members always get their own; staff get everyone's unless they ask for their own.
  if (filters.mine) params.set('mine', '1');
  if (filters.status) params.set('status', filters.status);
  if (cursor) params.set('cursor', cursor);
  return `/api/bookings?${params.toString()}`;
}

/** One page (newest first): enough for Today's short lists and the approvals count. */
export function useBookingsQuery(filters: BookingFilters) {
  return useQuery({
    queryKey: bookingKeys.list(filters),
    queryFn: ({ signal }) => apiRequest<BookingPage>(listPath(filters, null), { signal }),
  });
}

/** Newest first, a page at a time. */
export function useBookingsInfiniteQuery(filters: BookingFilters) {
  return useInfiniteQuery({
    queryKey: bookingKeys.pages(filters),
    queryFn: ({ pageParam, signal }) => apiRequest<BookingPage>(listPath(filters, pageParam), { signal }),
    initialPageParam: null as string | null,
    getNextPageParam: (last) => last.nextCursor,
  });
}

export function useBookingQuery(id: number) {
  return useQuery({
    queryKey: bookingKeys.detail(id),
    queryFn: ({ signal }) => apiRequest<{ booking: Booking }>(`/api/bookings/${id}`, { signal }),
    select: (data) => data.booking,
    enabled: Number.isInteger(id) && id > 0,
  });
}

/**
 * What release would answer now: the server runs the release rules (shared/rules/release.ts) on
 * the booking as it stands, so the counter sees every refusal before the last button. Checked
 * again every half minute while shown: the window opens by the clock.
 */
export function useReleaseCheckQuery(id: number, enabled = true) {
  return useQuery({
    queryKey: bookingKeys.releaseCheck(id),
    queryFn: ({ signal }) => apiRequest<ReleasePreview>(`/api/bookings/${id}/release-check`, { signal }),
    enabled: enabled && Number.isInteger(id) && id > 0,
    refetchInterval: 30_000,
  });
}

/** The booking's completed checklists as answered, newest first (its page shows them). */
export function useChecklistRunsQuery(id: number) {
  return useQuery({
    queryKey: bookingKeys.checklistRuns(id),
    queryFn: ({ signal }) => apiRequest<{ runs: ChecklistRunRecord[] }>(`/api/bookings/${id}/checklist-runs`, { signal }),
    select: (data) => data.runs,
  });
}

/** After any write: the answer is the new detail; lists, runs, availability and the trail follow. */
function useBookingWritten() {
  const queryClient = useQueryClient();
  return async (booking: Booking) => {
    queryClient.setQueryData(bookingKeys.detail(booking.id), { booking });
    await Promise.all([
      queryClient.invalidateQueries({ queryKey: bookingKeys.lists() }),
      queryClient.invalidateQueries({ queryKey: bookingKeys.checklistRuns(booking.id) }),
      queryClient.invalidateQueries({ queryKey: bookingKeys.releaseCheck(booking.id) }),
      queryClient.invalidateQueries({ queryKey: bookingGearKeys.availabilities() }),
      queryClient.invalidateQueries({ queryKey: auditKeys.all }),
    ]);
  };
}

const bookingOf = (response: { booking: Booking }) => response.booking;

export function useCreateBookingMutation() {
  const written = useBookingWritten();
  return useMutation({
    mutationFn: (input: BookingCreateInput) => apiRequest<{ booking: Booking }>('/api/bookings', { method: 'POST', body: input }).then(bookingOf),
    onSuccess: written,
  });
}

export function useUpdateBookingMutation(id: number) {
  const written = useBookingWritten();
  return useMutation({
    mutationFn: (input: BookingUpdateInput) => apiRequest<{ booking: Booking }>(`/api/bookings/${id}`, { method: 'PATCH', body: input }).then(bookingOf),
    onSuccess: written,
  });
}

export function useCancelBookingMutation(id: number) {
  const written = useBookingWritten();
  return useMutation({
    mutationFn: () => apiRequest<{ booking: Booking }>(`/api/bookings/${id}/cancel`, { method: 'POST' }).then(bookingOf),
    onSuccess: written,
  });
}

export function useApprovalDecisionMutation(id: number) {
  const written = useBookingWritten();
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: ApprovalDecisionInput) =>
      apiRequest<{ booking: Booking }>(`/api/bookings/${id}/approval`, { method: 'POST', body: input }).then(bookingOf),
    onSuccess: written,
    // PLAN_CHANGED: the booking moved on while the officer read it; show it as it is now.
    onError: () => queryClient.invalidateQueries({ queryKey: bookingKeys.detail(id) }),
  });
}

export function useScanMutation(id: number) {
  const written = useBookingWritten();
  return useMutation({
    mutationFn: (tag: string) => apiRequest<{ booking: Booking }>(`/api/bookings/${id}/scans`, { method: 'POST', body: { tag } }).then(bookingOf),
    onSuccess: written,
  });
}

export function useChecklistMutation(id: number) {
  const written = useBookingWritten();
  return useMutation({
    mutationFn: (input: ChecklistSubmitInput) =>
      apiRequest<{ booking: Booking }>(`/api/bookings/${id}/checklist`, { method: 'POST', body: input }).then(bookingOf),
    onSuccess: written,
  });
}

/** A release or return the server refused, with every rule that failed. */
export class GateRefusedError extends Error {
  readonly code: string;
  readonly failures: RuleFailure[];

  constructor(code: string, message: string, failures: RuleFailure[]) {
    super(message);
    this.name = 'GateRefusedError';
    this.code = code;
    this.failures = failures;
  }
}

export function isGateRefusedError(error: unknown): error is GateRefusedError {
  return error instanceof GateRefusedError;
}

export function useReleaseMutation(id: number) {
  const written = useBookingWritten();
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: async () => {
      try {
        return bookingOf(await apiRequest<{ booking: Booking }>(`/api/bookings/${id}/release`, { method: 'POST' }));
      } catch (error) {
        if (!isApiError(error) || error.code !== ERROR_CODES.releaseRefused) throw error;
        throw new GateRefusedError(error.code, error.message, error.failures ?? []);
      }
    },
    onSuccess: written,
    // A refusal may be news (an inspection lapsed, an approval was voided): show the booking as it is.
    onError: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: bookingKeys.detail(id) }),
        queryClient.invalidateQueries({ queryKey: bookingKeys.releaseCheck(id) }),
      ]),
  });
}

/** The make-safe checklist, then the return itself: one step for the member at the counter. */
export function useReturnMutation(id: number) {
  const written = useBookingWritten();
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: async ({ answers, ...input }: ReturnInput & { answers: ChecklistSubmitInput['answers'] }) => {
      const checked = bookingOf(
        await apiRequest<{ booking: Booking }>(`/api/bookings/${id}/checklist`, { method: 'POST', body: { phase: 'return', answers } }),
      );
      // The run is on record even if the return is refused: keep the detail in step with it.
      queryClient.setQueryData(bookingKeys.detail(id), { booking: checked });
      try {
        return bookingOf(await apiRequest<{ booking: Booking }>(`/api/bookings/${id}/return`, { method: 'POST', body: input }));
      } catch (error) {
        if (!isApiError(error) || error.code !== ERROR_CODES.returnRefused) throw error;
        throw new GateRefusedError(error.code, error.message, error.failures ?? []);
      }
    },
    onSuccess: written,
    onError: () => queryClient.invalidateQueries({ queryKey: bookingKeys.all }),
  });
}
