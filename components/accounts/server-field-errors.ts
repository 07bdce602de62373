import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';

import { describeError } from '@/components/ui/error-state';
import { isApiError } from '@/hooks/api-client';

/**
 * Puts the server's `fieldErrors` under the matching fields (focusing the first); anything that
 * belongs to no field on this form becomes the form-wide message.
 */
export function showServerErrors<T extends FieldValues>(error: unknown, fields: readonly Path<T>[], setError: UseFormSetError<T>): void {
  const fieldErrors = isApiError(error) ? error.fieldErrors : undefined;
  let mapped = false;
  for (const field of fields) {
    const messages = fieldErrors?.[field];
    if (messages && messages.length > 0) {
      setError(field, { type: 'server', message: messages.join(' ') }, { shouldFocus: !mapped });
      mapped = true;
    }
  }
  if (!mapped) setError('root.server' as Path<T>, { type: 'server', message: describeError(error) });
}
