// One zod schema per payload: the same schema the client's form uses. A failed parse is a 400
// with field errors the form can map onto its fields.
import type { z } from 'zod';
import { ValidationError } from '../errors';

export function validate<S extends z.ZodType>(schema: S, value: unknown, what = 'request'): z.output<S> {
  const result = schema.safeParse(value);
  if (result.success) return result.data;
  const fieldErrors: Record<string, string[]> = {};
  for (const issue of result.error.issues) {
    const key = issue.path.length > 0 ? issue.path.map(String).join('.') : '_';
    (fieldErrors[key] ??= []).push(issue.message);
  }
  const first = result.error.issues[0];
  const where = first && first.path.length > 0 ? `${first.path.map(String).join('.')}: ` : '';
  throw new ValidationError(`Invalid ${what}. ${where}${first?.message ?? ''}`.trim(), fieldErrors);
}
