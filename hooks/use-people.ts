import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';

import type { Group, InvitationInput, PersonSummary, PersonUpdateInput, UpdatedPerson } from '@/shared/schemas/accounts';
import type { Role } from '@/shared/schemas/session';

import { apiRequest } from './api-client';

// The shapes are the shared schemas' (shared/schemas/accounts.ts), which the server builds too.
export type Person = PersonSummary;
export type { Group, UpdatedPerson };

export const peopleKeys = {
  all: ['people'] as const,
  list: () => [...peopleKeys.all, 'list'] as const,
};

export const groupKeys = {
  all: ['groups'] as const,
  list: () => [...groupKeys.all, 'list'] as const,
};

export function usePeopleQuery() {
  return useQuery({
    queryKey: peopleKeys.list(),
    queryFn: ({ signal }) => apiRequest<{ people: Person[] }>('/api/people', { signal }),
    select: (data) => data.people,
  });
}

export function useGroupsQuery() {
  return useQuery({
    queryKey: groupKeys.list(),
    queryFn: ({ signal }) => apiRequest<{ groups: Group[] }>('/api/groups', { signal }),
    select: (data) => data.groups,
    // Groups change rarely (a new research group joins the lab).
    staleTime: 10 * 60_000,
  });
}

/** POST /api/invitations: adds the person and queues the e-mail with their one-time link. */
export function useInvitePersonMutation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: InvitationInput) =>
      apiRequest<{ person: { id: number; email: string; name: string; role: Role } }>('/api/invitations', { method: 'POST', body: input }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: peopleKeys.all }),
  });
}

/** PATCH /api/people/:id: role, group, active. A new role or a deactivation ends their sessions. */
export function useUpdatePersonMutation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, change }: { id: number; change: PersonUpdateInput }) =>
      apiRequest<{ person: UpdatedPerson }>(`/api/people/${id}`, { method: 'PATCH', body: change }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: peopleKeys.all }),
  });
}
