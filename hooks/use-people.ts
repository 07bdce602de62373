import { useQuery } from '@tanstack/react-query';

import type { Role } from '@/shared/schemas/session';

import { apiRequest } from './api-client';

// The server owns this shape; a shared schema can replace it when people gain a write API.
export interface Person {
  id: number;
  email: string;
  name: string;
  role: Role;
  groupName: string | null;
  active: boolean;
  lastSignInAt: string | null;
}

export const peopleKeys = {
  all: ['people'] as const,
  list: () => [...peopleKeys.all, 'list'] as const,
};

export function usePeopleQuery() {
  return useQuery({
    queryKey: peopleKeys.list(),
    queryFn: ({ signal }) => apiRequest<{ people: Person[] }>('/api/people', { signal }),
    select: (data) => data.people,
  });
}
