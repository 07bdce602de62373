// Maps a failed write's field errors onto the form that sent it. The server validates with the
// same zod schemas and reports paths joined with dots ("ratings.maxKv", "readings.0.value"),
// which are react-hook-form's field names too.
import { describeError } from '@/components/ui/error-state';
import { isApiError } from '@/hooks/api-client';

export function applyServerErrors(error: unknown, setFieldError: (path: string, message: string) => boolean): string | null {
  if (!isApiError(error)) return describeError(error);
  const leftovers: string[] = [];
  for (const [path, messages] of Object.entries(error.fieldErrors ?? {})) {
    const message = messages[0];
    if (message === undefined) continue;
    if (!setFieldError(path, message)) leftovers.push(path === '_' ? message : `${path}: ${message}`);
  }
  // The envelope's message always says what failed as a whole; fields carry the details.
  if (leftovers.length > 0) return `${error.message} ${leftovers.join(' ')}`.trim();
  return error.fieldErrors && Object.keys(error.fieldErrors).length > 0 ? null : error.message;
}
