// Signed-out account flows: asking for a password reset, and redeeming a one-time link from an
// e-mail (invitation or reset). Redeeming ends every session of that person on the server, so the
// cached session is refreshed: whoever was signed in on this browser as them is now signed out.
import { useMutation, useQueryClient } from '@tanstack/react-query';

import { apiRequest } from './api-client';
import { sessionKeys } from './use-session';

export function useRequestPasswordResetMutation() {
  return useMutation({
    mutationFn: (input: { email: string }) => apiRequest<{ ok: true; message: string }>('/api/password-resets', { method: 'POST', body: input }),
  });
}

export function useCompletePasswordResetMutation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ token, password }: { token: string; password: string }) =>
      apiRequest<{ ok: true }>(`/api/password-resets/${encodeURIComponent(token)}`, { method: 'POST', body: { password } }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: sessionKeys.all }),
  });
}

export function useAcceptInvitationMutation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ token, password }: { token: string; password: string }) =>
      apiRequest<{ ok: true }>(`/api/invitations/${encodeURIComponent(token)}`, { method: 'POST', body: { password } }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: sessionKeys.all }),
  });
}
