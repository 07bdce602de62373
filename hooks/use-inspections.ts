// An item's inspections. Recording one moves the item's next due date and, on a failure, tags the
// item out (server/services/items.ts), so the registry's keys are invalidated with this list.
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';

import type { Inspection, InspectionCreateInput, Item } from '@/shared/schemas/items';

import { apiRequest } from './api-client';
import { itemKeys } from './use-items';

export const inspectionKeys = {
  all: ['inspections'] as const,
  list: (itemId: number) => [...inspectionKeys.all, itemId] as const,
};

export function useInspectionsQuery(itemId: number) {
  return useQuery({
    queryKey: inspectionKeys.list(itemId),
    queryFn: ({ signal }) => apiRequest<{ inspections: Inspection[] }>(`/api/items/${itemId}/inspections`, { signal }),
    select: (data) => data.inspections,
  });
}

export function useRecordInspectionMutation(itemId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: InspectionCreateInput) =>
      apiRequest<{ inspection: Inspection; item: Item }>(`/api/items/${itemId}/inspections`, { method: 'POST', body: input }),
    onSuccess: async ({ item }) => {
      queryClient.setQueryData(itemKeys.detail(itemId), { item });
      await Promise.all([queryClient.invalidateQueries({ queryKey: inspectionKeys.list(itemId) }), queryClient.invalidateQueries({ queryKey: itemKeys.all })]);
    },
  });
}
