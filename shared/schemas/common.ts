import { z } from 'zod';
// Installs the shared error map (plain words with units) wherever a schema is used.
import '../zod-errors';

/** A numeric id in a path, e.g. /api/items/:id. */
export const idParamSchema = z.object({ id: z.coerce.number().int().positive().max(2_147_483_647) }).strict();

export const idListSchema = z
  .string()
  .max(4000)
  .transform((value, ctx) => {
    const ids = value
      .split(',')
      .filter((p) => p.trim() !== '')
      .map((p) => Number(p.trim()));
    if (ids.length === 0 || ids.some((n) => !Number.isInteger(n) || n <= 0 || n > 2_147_483_647)) {
      ctx.addIssue({ code: 'custom', message: 'Give a comma-separated list of item ids' });
      return z.NEVER;
    }
    return [...new Set(ids)];
  });
