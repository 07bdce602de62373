import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';

import type { LabRules } from '@/shared/schemas/bookings';

import { apiRequest } from './api-client';
import { auditKeys } from './use-audit';
import { bookingKeys } from './use-bookings';

export const labRulesKeys = {
  all: ['lab-rules'] as const,
  current: () => [...labRulesKeys.all, 'current'] as const,
};

export function fetchLabRules(signal?: AbortSignal): Promise<LabRules> {
  return apiRequest<LabRules>('/api/lab-rules', { signal });
}

export function useLabRulesQuery() {
  return useQuery({
    queryKey: labRulesKeys.current(),
    queryFn: ({ signal }) => fetchLabRules(signal),
    // Officers change these rarely; a booking form open for a while should still notice.
    staleTime: 60_000,
  });
}

export function useUpdateLabRulesMutation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: LabRules) => apiRequest<LabRules>('/api/lab-rules', { method: 'PUT', body: input }),
    onSuccess: async (rules) => {
      queryClient.setQueryData(labRulesKeys.current(), rules);
      // Checklist limits on bookings (the safe residual voltage) come from these rules.
      await Promise.all([
        queryClient.invalidateQueries({ queryKey: labRulesKeys.all }),
        queryClient.invalidateQueries({ queryKey: bookingKeys.all }),
        queryClient.invalidateQueries({ queryKey: auditKeys.all }),
      ]);
    },
  });
}
