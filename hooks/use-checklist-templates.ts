import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';

import type { ChecklistTemplate, ChecklistTemplateItemInput } from '@/shared/schemas/bookings';

import { apiRequest } from './api-client';
import { auditKeys } from './use-audit';
import { bookingKeys } from './use-bookings';

export type { ChecklistTemplate };

export const checklistTemplateKeys = {
  all: ['checklist-templates'] as const,
  list: () => [...checklistTemplateKeys.all, 'list'] as const,
};

export function useChecklistTemplatesQuery() {
  return useQuery({
    queryKey: checklistTemplateKeys.list(),
    queryFn: ({ signal }) => apiRequest<{ templates: ChecklistTemplate[] }>('/api/checklist-templates', { signal }),
    select: (data) => data.templates,
  });
}

function useInvalidateTemplates() {
  const queryClient = useQueryClient();
  // A booking's checklist is built from the templates, so open bookings change with them.
  return () =>
    Promise.all([
      queryClient.invalidateQueries({ queryKey: checklistTemplateKeys.all }),
      queryClient.invalidateQueries({ queryKey: bookingKeys.all }),
      queryClient.invalidateQueries({ queryKey: auditKeys.all }),
    ]);
}

export function useCreateChecklistTemplateMutation() {
  const invalidate = useInvalidateTemplates();
  return useMutation({
    mutationFn: (input: ChecklistTemplateItemInput) => apiRequest<{ template: ChecklistTemplate }>('/api/checklist-templates', { method: 'POST', body: input }),
    onSuccess: invalidate,
  });
}

export function useRetireChecklistTemplateMutation() {
  const invalidate = useInvalidateTemplates();
  return useMutation({
    mutationFn: (id: number) => apiRequest<void>(`/api/checklist-templates/${id}`, { method: 'DELETE' }),
    onSuccess: invalidate,
  });
}
