// Incidents and near misses (issue 17): what anyone reports, what an officer records on review.
import { z } from 'zod';
// Installs the shared error map (plain words with units) wherever a schema is used.
import '../zod-errors';

export const INCIDENT_KINDS = ['shock', 'arc-over', 'burn', 'damage', 'near-miss', 'other'] as const;
export type IncidentKind = (typeof INCIDENT_KINDS)[number];
export const INCIDENT_SEVERITIES = ['low', 'moderate', 'serious', 'severe'] as const;
export type IncidentSeverity = (typeof INCIDENT_SEVERITIES)[number];
export const INCIDENT_STATUSES = ['open', 'under-review', 'closed'] as const;
export type IncidentStatus = (typeof INCIDENT_STATUSES)[number];

export const incidentKindWords: Record<IncidentKind, { label: string; hint: string }> = {
  shock: { label: 'Electric shock', hint: 'Current passed through someone, however briefly.' },
  'arc-over': { label: 'Arc-over or flashover', hint: 'A spark or arc jumped where it should not.' },
  burn: { label: 'Burn', hint: 'A burn from an arc, a hot part or a discharge.' },
  damage: { label: 'Equipment damage', hint: 'Gear was damaged, whether or not anyone was hurt.' },
  'near-miss': { label: 'Near miss', hint: 'Nobody was hurt and nothing broke, but it could have.' },
  other: { label: 'Something else', hint: 'Anything unsafe that fits none of the above.' },
};

/**
 * The lab's severity scale. Ours (common practice of a four-step consequence scale, no source):
 * read it as "what happened or, for a near miss, what could reasonably have happened".
 */
export const incidentSeverityWords: Record<IncidentSeverity, { label: string; definition: string }> = {
  low: { label: 'Low', definition: 'No injury and no lasting damage; a reminder or a small fix is enough.' },
  moderate: { label: 'Moderate', definition: 'First aid only, or gear damaged but repairable; work can go on once it is put right.' },
  serious: { label: 'Serious', definition: 'Medical treatment needed, or gear destroyed, or a protective measure (barrier, interlock, grounding) failed.' },
  severe: {
    label: 'Severe',
    definition: 'Hospital admission, lost consciousness, a shock through the body, or a fire; stop the work until the officer has reviewed it.',
  },
};

export const incidentStatusWords: Record<IncidentStatus, string> = {
  open: 'Open',
  'under-review': 'Under review',
  closed: 'Closed',
};

/** Kinds for which "take these items out of service now" is on unless the reporter turns it off. */
export const TAG_OUT_BY_DEFAULT: readonly IncidentKind[] = ['damage', 'shock'];

const id = z.number().int().positive().max(2_147_483_647);
const isoDay = z.iso.date({ message: 'Use a date such as 2026-12-24' });

export const incidentCreateSchema = z
  .object({
    kind: z.enum(INCIDENT_KINDS, { message: 'Choose what kind of incident it was' }),
    severity: z.enum(INCIDENT_SEVERITIES, { message: 'Choose how severe it was' }),
    occurredAt: z.iso.datetime({ offset: true, message: 'Say when it happened (date and time)' }),
    location: z.string().trim().min(1, 'Say where it happened').max(200),
    description: z.string().trim().min(3, 'Say in a few words what happened').max(4000),
    itemIds: z.array(id).max(20, 'At most 20 items in one report'),
    bookingId: id.nullable().optional(),
    tagOut: z.boolean(),
  })
  .strict();
export type IncidentCreateInput = z.infer<typeof incidentCreateSchema>;

export const correctiveActionInputSchema = z
  .object({
    action: z.string().trim().min(3, 'Say what will be done').max(500),
    ownerId: id,
    dueOn: isoDay,
  })
  .strict();

export const incidentUpdateSchema = z
  .object({
    status: z.enum(INCIDENT_STATUSES, { message: 'Choose open, under review or closed' }),
    cause: z.string().trim().max(4000).optional(),
    correctiveActions: z.array(correctiveActionInputSchema).max(20, 'At most 20 actions').optional(),
  })
  .strict();
export type IncidentUpdateInput = z.infer<typeof incidentUpdateSchema>;

export const incidentListQuerySchema = z
  .object({
    status: z.enum(INCIDENT_STATUSES).optional(),
    kind: z.enum(INCIDENT_KINDS).optional(),
    itemId: z.coerce.number().int().positive().max(2_147_483_647).optional(),
    bookingId: z.coerce.number().int().positive().max(2_147_483_647).optional(),
  })
  .strict();
export type IncidentListQuery = z.infer<typeof incidentListQuerySchema>;

export const actionDoneSchema = z.object({ done: z.boolean() }).strict();

export interface CorrectiveAction {
  id: number;
  incidentId: number;
  action: string;
  ownerId: number;
  ownerName: string;
  dueOn: string;
  doneAt: string | null;
  pastDue: boolean;
}

export interface IncidentPhoto {
  id: number;
  fileName: string;
  contentType: string;
  sizeBytes: number;
  uploadedAt: string;
}

export interface Incident {
  id: number;
  kind: IncidentKind;
  severity: IncidentSeverity;
  status: IncidentStatus;
  occurredAt: string;
  location: string;
  description: string;
  tagOut: boolean;
  bookingId: number | null;
  reportedBy: { id: number; name: string };
  items: { id: number; tag: string; name: string; status: string }[];
  cause: string | null;
  correctiveActions: CorrectiveAction[];
  photos: IncidentPhoto[];
  closedAt: string | null;
  createdAt: string;
  updatedAt: string;
}

/** One row of the queue and the item/booking lists: no description body, no actions. */
export type IncidentSummary = Omit<Incident, 'correctiveActions' | 'photos' | 'cause'> & { openActions: number };
