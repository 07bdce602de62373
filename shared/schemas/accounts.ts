import { z } from 'zod';
// Installs the shared error map (plain words with units) wherever a schema is used.
import '../zod-errors';
import { roleSchema } from './session';

/** Long enough to resist guessing; no composition rules (they push people to worse passwords). */
export const passwordSchema = z.string().min(10, 'Use at least 10 characters').max(200);

export const invitationSchema = z
  .object({
    email: z.string().trim().toLowerCase().email('Enter a valid e-mail address').max(254),
    name: z.string().trim().min(2, 'Enter the person’s name').max(120),
    role: roleSchema,
    groupId: z.number().int().positive().nullable().optional(),
  })
  .strict();
export type InvitationInput = z.infer<typeof invitationSchema>;

export const setPasswordSchema = z.object({ password: passwordSchema }).strict();
export const passwordResetRequestSchema = z.object({ email: z.string().trim().toLowerCase().max(254) }).strict();
export const tokenParamSchema = z.object({ token: z.string().regex(/^[A-Za-z0-9_-]{20,100}$/, 'Invalid link') }).strict();

export const personUpdateSchema = z
  .object({
    role: roleSchema.optional(),
    active: z.boolean().optional(),
    groupId: z.number().int().positive().nullable().optional(),
    name: z.string().trim().min(2).max(120).optional(),
  })
  .strict()
  .refine((v) => Object.keys(v).length > 0, 'Nothing to change');
export type PersonUpdateInput = z.infer<typeof personUpdateSchema>;

// Answers (GET /api/people, PATCH /api/people/:id, GET /api/groups): the server builds them
// (server/services/people.ts, accounts.ts) and the app's hooks read them, both through these types.
export const personSummarySchema = z.object({
  id: z.number().int(),
  email: z.string(),
  name: z.string(),
  role: roleSchema,
  groupName: z.string().nullable(),
  active: z.boolean(),
  lastSignInAt: z.string().nullable(),
  /** The HV qualification on record; `expiresOn` is a calendar date (YYYY-MM-DD). */
  qualification: z.object({ authorisedKv: z.number(), expiresOn: z.string() }).nullable(),
});
export type PersonSummary = z.infer<typeof personSummarySchema>;

export const updatedPersonSchema = z.object({
  id: z.number().int(),
  email: z.string(),
  name: z.string(),
  role: roleSchema,
  active: z.boolean(),
  groupId: z.number().int().nullable(),
});
export type UpdatedPerson = z.infer<typeof updatedPersonSchema>;

export const groupSchema = z.object({ id: z.number().int(), name: z.string() });
export type Group = z.infer<typeof groupSchema>;
