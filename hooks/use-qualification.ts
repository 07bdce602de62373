import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';

import type { Qualification, QualificationInput } from '@/shared/schemas/bookings';
import type { Role } from '@/shared/schemas/session';

import { apiRequest } from './api-client';

export const qualificationKeys = {
  all: ['qualification'] as const,
  person: (personId: number) => [...qualificationKeys.all, personId] as const,
  list: () => [...qualificationKeys.all, 'list'] as const,
};

export interface QualifiedPerson {
  id: number;
  name: string;
  email: string;
  role: Role;
  groupName: string | null;
  qualification: { authorisedKv: number; expiresOn: string } | null;
}

/** Every active person with their qualification (officers and managers). */
export function useQualificationsQuery() {
  return useQuery({
    queryKey: qualificationKeys.list(),
    queryFn: ({ signal }) => apiRequest<{ people: QualifiedPerson[] }>('/api/qualifications', { signal }),
    select: (data) => data.people,
  });
}

/** Records a person's authorised voltage and expiry (officers; audited on the server). */
export function useSetQualificationMutation(personId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: QualificationInput) =>
      apiRequest<{ qualification: Qualification }>(`/api/people/${personId}/qualification`, { method: 'PUT', body: input }),
    // Assessments depend on it too: a new qualification can lift an approval reason.
    onSuccess: () => queryClient.invalidateQueries({ queryKey: qualificationKeys.all }),
  });
}

/** A person's HV qualification, or null when none is on record. Members may read only their own. */
export function useQualificationQuery(personId: number | undefined) {
  return useQuery({
    queryKey: qualificationKeys.person(personId ?? 0),
    queryFn: ({ signal }) => apiRequest<{ qualification: Qualification | null }>(`/api/people/${personId}/qualification`, { signal }),
    select: (data) => data.qualification,
    enabled: personId !== undefined,
  });
}
