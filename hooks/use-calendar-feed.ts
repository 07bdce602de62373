// The person's private calendar feed: its address (or none), turning it on or giving it a new
// address, and turning it off.
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';

import type { CalendarFeedAnswer, CalendarFeedScopes } from '@/shared/schemas/calendar-feed';

import { apiRequest } from './api-client';

export const calendarFeedKeys = { all: ['calendar-feed'] as const };

export function useCalendarFeedQuery() {
  return useQuery({ queryKey: calendarFeedKeys.all, queryFn: ({ signal }) => apiRequest<CalendarFeedAnswer>('/api/calendar-feed', { signal }) });
}

export function useCreateCalendarFeedMutation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (scopes: Partial<CalendarFeedScopes>) => apiRequest<CalendarFeedAnswer>('/api/calendar-feed', { method: 'POST', body: scopes }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: calendarFeedKeys.all }),
  });
}

export function useRevokeCalendarFeedMutation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => apiRequest<void>('/api/calendar-feed', { method: 'DELETE' }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: calendarFeedKeys.all }),
  });
}
