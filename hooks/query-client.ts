import { QueryCache, QueryClient } from '@tanstack/react-query';

import { ERROR_CODES } from '@/shared/errors';

import { isApiError } from './api-client';
import { sessionKeys } from './use-session';

const MAX_RETRIES = 2;

/** One QueryClient per app root (and per test), so caches never leak between them. */
export function createQueryClient(): QueryClient {
  const queryClient: QueryClient = new QueryClient({
    queryCache: new QueryCache({
      // A 401 on any query means the session ended on the server (expiry, sign-out elsewhere):
      // refetch the session so the route guards send the person to sign-in.
      onError: (error, query) => {
        if (isApiError(error) && error.code === ERROR_CODES.unauthenticated && query.queryKey[0] !== sessionKeys.all[0]) {
          void queryClient.invalidateQueries({ queryKey: sessionKeys.all });
        }
      },
    }),
    defaultOptions: {
      queries: {
        staleTime: 30_000,
        // Only a server that could not answer is worth asking again; a 4xx will not change.
        retry: (failureCount, error) => failureCount < MAX_RETRIES && (!isApiError(error) || error.status === 0 || error.status >= 500),
      },
      // A change (release, booking, return) is sent now or fails now: never held while offline
      // and sent later, when the person may have walked away from the bench.
      mutations: { retry: false, networkMode: 'always' },
    },
  });
  return queryClient;
}
