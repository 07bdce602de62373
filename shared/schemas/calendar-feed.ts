// The private calendar feed's options (issue 17 point 4): what a role may add to its feed.
import { z } from 'zod';
import '../zod-errors';

export const calendarFeedScopesSchema = z
  .object({
    /** Officers: bookings waiting for approval, whoever made them. */
    approvals: z.boolean().default(false),
    /** Officers: every booking in the lab. */
    labBookings: z.boolean().default(false),
    /** Managers: inspections and calibrations coming due over the next 12 weeks. */
    inspections: z.boolean().default(false),
  })
  .strict();
export type CalendarFeedScopes = z.infer<typeof calendarFeedScopesSchema>;

export interface CalendarFeedAnswer {
  url: string | null;
  scopes: CalendarFeedScopes | null;
}
