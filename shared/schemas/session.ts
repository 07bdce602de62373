import { z } from 'zod';
// Installs the shared error map (plain words with units) wherever a schema is used.
import '../zod-errors';

export const ROLES = ['member', 'officer', 'manager'] as const;
export const roleSchema = z.enum(ROLES);
export type Role = z.infer<typeof roleSchema>;

export const signInSchema = z
  .object({
    email: z.string().trim().toLowerCase().email('Enter a valid e-mail address').max(254),
    password: z.string().min(1, 'Enter your password').max(200),
  })
  .strict();
export type SignInInput = z.infer<typeof signInSchema>;

export const sessionUserSchema = z.object({
  id: z.number().int(),
  email: z.string(),
  name: z.string(),
  role: roleSchema,
});
export type SessionUser = z.infer<typeof sessionUserSchema>;

export interface SessionResponse {
  user: SessionUser | null;
  csrfToken: string;
  /** The lab's clock (LAB_TIME_ZONE, else the server's): the gate's times are shown on it. */
  labTimeZone: string;
}
