// One zod schema per payload: the same schema the client's form uses. A failed parse is a 400
// with field errors the form can map onto its fields.
import type { z } from 'zod';
import { ValidationError } from '../errors';
import { TooDeepError, wellFormed } from '../well-formed';

/** `prefix` names where the value sits in the request body (e.g. 'ratings'), for field errors. */
export function validate<S extends z.ZodType>(schema: S, value: unknown, what = 'request', prefix?: string): z.output<S> {
  let input: unknown;
  try {
    input = wellFormed(value);
  } catch (error) {
    if (error instanceof TooDeepError) throw new ValidationError(`Invalid ${what}: it is nested too deeply.`);
    throw error;
  }
  const result = schema.safeParse(input);
  if (result.success) return result.data;
  const fieldErrors: Record<string, string[]> = {};
  for (const issue of result.error.issues) {
    const path = [...(prefix ? [prefix] : []), ...issue.path.map(String)];
    const key = path.length > 0 ? path.join('.') : '_';
    (fieldErrors[key] ??= []).push(issue.message);
  }
  const first = result.error.issues[0];
  const firstPath = first ? [...(prefix ? [prefix] : []), ...first.path.map(String)] : [];
  const where = firstPath.length > 0 ? `${firstPath.join('.')}: ` : '';
  throw new ValidationError(`Invalid ${what}. ${where}${first?.message ?? ''}`.trim(), fieldErrors);
}
