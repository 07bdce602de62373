import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';

import { describeError } from '@/components/ui/error-state';
import { isApiError } from '@/hooks/api-client';

/**
 * Puts the server's `fieldErrors` (keys like "plan.plannedKv") on the form's fields, focusing the
 * first; anything that names no field becomes the form's own message (`root.server`).
 */
export function applyServerErrors<T extends FieldValues>(error: unknown, fields: readonly Path<T>[], setError: UseFormSetError<T>): void {
  const fieldErrors = isApiError(error) ? error.fieldErrors : undefined;
  let mapped = false;
  for (const field of fields) {
    const messages = fieldErrors?.[field];
    if (messages && messages.length > 0) {
      setError(field, { type: 'server', message: messages.join(' ') }, { shouldFocus: !mapped });
      mapped = true;
    }
  }
  if (!mapped || (isApiError(error) && error.status !== 400)) {
    setError('root.server' as Path<T>, { type: 'server', message: describeError(error) });
  }
}
