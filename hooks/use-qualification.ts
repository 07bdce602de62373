import { useQuery } from '@tanstack/react-query';

import type { Qualification } from '@/shared/schemas/bookings';

import { apiRequest } from './api-client';

export const qualificationKeys = {
  all: ['qualification'] as const,
  person: (personId: number) => [...qualificationKeys.all, personId] as const,
};

/** A person's HV qualification, or null when none is on record. Members may read only their own. */
export function useQualificationQuery(personId: number | undefined) {
  return useQuery({
    queryKey: qualificationKeys.person(personId ?? 0),
    queryFn: ({ signal }) => apiRequest<{ qualification: Qualification | null }>(`/api/people/${personId}/qualification`, { signal }),
    select: (data) => data.qualification,
    enabled: personId !== undefined,
  });
}
