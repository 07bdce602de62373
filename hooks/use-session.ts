import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';

import type { SessionUser, SignInInput } from '@/shared/schemas/session';

import { apiRequest, fetchSession, forgetCsrfToken } from './api-client';

export const sessionKeys = {
  all: ['session'] as const,
  current: () => [...sessionKeys.all, 'current'] as const,
};

export function useSessionQuery() {
  return useQuery({
    queryKey: sessionKeys.current(),
    queryFn: ({ signal }) => fetchSession(signal),
    // Route guards read this on every navigation; the server is the authority and a 401 anywhere
    // invalidates it (see query-client.ts), so there is no need to poll.
    staleTime: 5 * 60_000,
  });
}

/** The signed-in person, or null while signed out or still loading. */
export function useCurrentUser(): SessionUser | null {
  return useSessionQuery().data?.user ?? null;
}

export function useSignInMutation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: SignInInput) => apiRequest<{ user: SessionUser }>('/api/session', { method: 'POST', body: input }),
    onSuccess: async () => {
      // Signing in issues a new session and a new CSRF token: drop the old one and wait for the
      // refetch, so callers awaiting the mutation see the signed-in routes already in place.
      forgetCsrfToken();
      await queryClient.invalidateQueries({ queryKey: sessionKeys.all });
    },
  });
}

export function useSignOutMutation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => apiRequest<void>('/api/session', { method: 'DELETE' }),
    onSuccess: () => {
      // Nothing fetched for the previous person may be shown to the next one at this bench.
      queryClient.removeQueries({ predicate: (query) => query.queryKey[0] !== sessionKeys.all[0] });
    },
    // Even a failed sign-out (the session had already expired) must leave the guards truthful.
    onSettled: async () => {
      forgetCsrfToken();
      await queryClient.invalidateQueries({ queryKey: sessionKeys.all });
    },
  });
}

/** The lab's clock, for the gate's times; the device's own zone until the session has loaded. */
export function useLabTimeZone(): string {
  return useSessionQuery().data?.labTimeZone ?? (Intl.DateTimeFormat().resolvedOptions().timeZone || 'UTC');
}
