// Booking payloads, lab rules and qualifications: one schema each, for the form and the API.
import { z } from 'zod';
// Installs the shared error map (plain words with units) wherever a schema is used.
import type { RuleFailure } from '../errors';
import '../zod-errors';
import type { Assessment } from './assessment';
import { BOOKING_WINDOW } from '../rules/booking-window';
import { polaritySchema, type ItemSummary } from './items';

/**
 * A number with at most `places` decimals: the schema refuses what the database column would
 * round, so a value is stored exactly as it was assessed (15.004 kV is not silently 15 kV).
 */
export const decimalNumber = (places: number) =>
  z.number().refine((v) => Number(v.toFixed(places)) === v, {
    message: places === 0 ? 'Use a whole number' : `Use at most ${places} decimal place${places === 1 ? '' : 's'}`,
  });

export const BOOKING_STATUSES = ['requested', 'awaiting-approval', 'approved', 'refused', 'released', 'returned', 'cancelled'] as const;
export type BookingStatus = (typeof BOOKING_STATUSES)[number];
/** States in which a booking holds its items (an item is never in two overlapping live bookings). */
export const LIVE_STATUSES: readonly BookingStatus[] = ['requested', 'awaiting-approval', 'approved', 'released'];
/** On the way to release: the states in which gear is scanned, the pre-energize checklist answered and the booking released. */
export const PRE_RELEASE_STATUSES: readonly BookingStatus[] = ['requested', 'awaiting-approval', 'approved'];
/** Not yet released and not closed: the booker may still change or cancel it. */
export const OPEN_STATUSES: readonly BookingStatus[] = [...PRE_RELEASE_STATUSES, 'refused'];

export const testPlanSchema = z
  .object({
    // Columns: planned_kv DECIMAL(7,2), max_current_ma DECIMAL(10,3).
    plannedKv: decimalNumber(2).min(0.05, 'At least 0.05 kV').max(300, 'At most 300 kV'),
    polarity: polaritySchema,
    maxCurrentMa: decimalNumber(3).min(0, 'At least 0 mA').max(10_000, 'At most 10 000 mA'),
    peoplePresent: z.number().int().min(1, 'Count yourself').max(50),
  })
  .strict();
export type TestPlan = z.infer<typeof testPlanSchema>;

const itemIds = z.array(z.number().int().positive()).min(1, 'Pick at least one item').max(30, 'At most 30 items');
const isoTime = z.iso.datetime({ offset: true, message: 'Use an ISO date and time' });

const windowRefine = <T extends { startsAt?: string; endsAt?: string }>(v: T) => !v.startsAt || !v.endsAt || new Date(v.endsAt) > new Date(v.startsAt);

// The fields of a booking, shared by a new booking and a change to one so that both accept
// exactly the same values; the window as a whole is checked by shared/rules/booking-window.ts
// (here for the form, and on the server against its own clock for the merged window of a change).
const bookingFields = {
  itemIds,
  startsAt: isoTime,
  endsAt: isoTime,
  location: z.string().trim().min(1, 'Which bench or bay?').max(120, 'At most 120 characters'),
  purpose: z.string().trim().min(3, 'Say what the test is for').max(500, 'At most 500 characters'),
  plan: testPlanSchema,
};

const maxLengthMs = BOOKING_WINDOW.maxLengthDays * 24 * 3600_000;
const windowLengthRefine = <T extends { startsAt?: string; endsAt?: string }>(v: T) =>
  !v.startsAt || !v.endsAt || new Date(v.endsAt).getTime() - new Date(v.startsAt).getTime() <= maxLengthMs;
const distinctItems = <T extends { itemIds?: number[] }>(v: T) => !v.itemIds || new Set(v.itemIds).size === v.itemIds.length;

export const bookingCreateSchema = z
  .object(bookingFields)
  .strict()
  .refine(windowRefine, { message: 'The end must be after the start', path: ['endsAt'] })
  .refine(windowLengthRefine, { message: `A booking can last at most ${BOOKING_WINDOW.maxLengthDays} days`, path: ['endsAt'] })
  .refine(distinctItems, { message: 'An item is listed twice', path: ['itemIds'] });
export type BookingCreateInput = z.infer<typeof bookingCreateSchema>;

export const bookingUpdateSchema = z
  .object(bookingFields)
  .partial()
  .strict()
  .refine((v) => Object.keys(v).length > 0, 'Nothing to change')
  .refine(windowRefine, { message: 'The end must be after the start', path: ['endsAt'] })
  .refine(windowLengthRefine, { message: `A booking can last at most ${BOOKING_WINDOW.maxLengthDays} days`, path: ['endsAt'] })
  .refine(distinctItems, { message: 'An item is listed twice', path: ['itemIds'] });
export type BookingUpdateInput = z.infer<typeof bookingUpdateSchema>;

export const bookingListQuerySchema = z
  .object({
    mine: z.enum(['1', '0', 'true', 'false']).optional(),
    status: z.enum([...BOOKING_STATUSES, 'overdue', 'live']).optional(),
    itemId: z.coerce.number().int().positive().optional(),
    cursor: z.string().max(100).optional(),
    limit: z.coerce.number().int().min(1).max(100).default(25),
  })
  .strict();

export const assessmentRequestSchema = z.object({ itemIds, plan: testPlanSchema, personId: z.number().int().positive().optional() }).strict();

export const approvalDecisionSchema = z
  .object({
    decision: z.enum(['approve', 'refuse']),
    /** The plan version the officer had on screen; required to approve (POST /api/bookings/:id/approval). */
    planVersion: z.number().int().positive().optional(),
    conditions: z.string().trim().max(1000).optional(),
    reason: z.string().trim().max(1000).optional(),
  })
  .strict()
  .refine((v) => v.decision !== 'refuse' || (v.reason ?? '').length > 0, { message: 'Say why the test is refused', path: ['reason'] })
  .refine((v) => v.decision !== 'approve' || v.planVersion !== undefined, { message: 'Approve the plan version you reviewed', path: ['planVersion'] });
/** What the officer's form sends (the schema's input: optional fields may be left out). */
export type ApprovalDecisionInput = z.input<typeof approvalDecisionSchema>;

export const scanSchema = z.object({ tag: z.string().trim().min(1).max(40) }).strict();

export const checklistSubmitSchema = z
  .object({
    phase: z.enum(['pre', 'return']),
    answers: z
      .array(
        z
          .object({
            itemId: z.number().int().positive(),
            confirmed: z.boolean().optional(),
            value: z.number().optional(),
            fileId: z.number().int().positive().optional(),
          })
          .strict(),
      )
      .max(60),
  })
  .strict();
export type ChecklistSubmitInput = z.infer<typeof checklistSubmitSchema>;

export const returnSchema = z
  .object({
    damagedItemIds: z.array(z.number().int().positive()).max(30).default([]),
    notes: z.string().trim().max(2000).default(''),
  })
  .strict()
  .refine((v) => v.damagedItemIds.length === 0 || v.notes.length > 0, { message: 'Describe the damage', path: ['notes'] });
export type ReturnInput = z.input<typeof returnSchema>;

export const labRulesSchema = z
  .object({
    // Columns: DECIMAL(7,2), (12,4), (6,2), (7,2), (8,2).
    approvalKv: decimalNumber(2).min(0).max(300),
    energyThresholdJ: decimalNumber(4).min(0).max(10_000),
    ratingMarginPct: decimalNumber(2).min(0).max(200),
    interlockKv: decimalNumber(2).min(0).max(300),
    safeResidualV: decimalNumber(2).min(1).max(1000),
    earlyPickupMin: z
      .number()
      .int()
      .min(0)
      .max(24 * 60),
    overdueGraceMin: z
      .number()
      .int()
      .min(0)
      .max(7 * 24 * 60),
  })
  .strict();
export type LabRules = z.infer<typeof labRulesSchema>;

export const qualificationSchema = z
  .object({
    authorisedKv: decimalNumber(2).min(0).max(300),
    expiresOn: z.iso.date(),
    notes: z.string().trim().max(500).default(''),
  })
  .strict();
export type QualificationInput = z.infer<typeof qualificationSchema>;

export interface Qualification {
  personId: number;
  authorisedKv: number;
  expiresOn: string;
  notes: string;
  recordedByName: string | null;
  updatedAt: string;
}

export const CHECKLIST_KINDS = ['confirm', 'reading', 'photo'] as const;
export const checklistTemplateItemSchema = z
  .object({
    phase: z.enum(['pre', 'return']),
    kind: z.enum(CHECKLIST_KINDS),
    text: z.string().trim().min(3).max(300),
    unit: z.string().trim().max(20).nullable().default(null),
    min: decimalNumber(4).min(-1e9).max(1e9).nullable().default(null),
    max: decimalNumber(4).min(-1e9).max(1e9).nullable().default(null),
    /** The upper limit comes from a lab rule instead of a fixed number. */
    maxFromRule: z.enum(['safeResidualV']).nullable().default(null),
    required: z.boolean().default(true),
    appliesFromKv: decimalNumber(2).min(0).max(300).nullable().default(null),
    appliesWithKind: z.string().max(30).nullable().default(null),
    position: z.number().int().min(0).max(1000).default(0),
  })
  .strict()
  .refine((v) => v.kind !== 'reading' || (v.unit ?? '').length > 0, { message: 'A reading needs a unit', path: ['unit'] })
  .refine((v) => v.min === null || v.max === null || v.min <= v.max, { message: 'min must not exceed max', path: ['max'] });
export type ChecklistTemplateItemInput = z.input<typeof checklistTemplateItemSchema>;

/** A photo taken at the counter for one of the booking's checklist lines (POST /api/bookings/:id/photos). */
export interface BookingPhoto {
  id: number;
  bookingId: number;
  kind: 'photo';
  fileName: string;
  contentType: string;
  sizeBytes: number;
  uploadedAt: string;
  uploadedByName: string | null;
}

/** One line of a checklist as the booking shows it (limits already resolved from lab rules). */
export interface ChecklistEntry {
  id: number;
  kind: 'confirm' | 'reading' | 'photo';
  text: string;
  unit?: string;
  min?: number;
  max?: number;
  required: boolean;
}

// ---------------------------------------------------------------------------------------------
// Response shapes (the server builds them, the app reads them).

/** One line of a completed checklist as it was answered: text and limits as they were then. */
export interface ChecklistAnswerRecord {
  id: number;
  kind: ChecklistEntry['kind'];
  text: string;
  unit?: string;
  min?: number;
  max?: number;
  /** Whether the line was required when answered (absent on runs recorded before it was kept). */
  required?: boolean;
  confirmed?: boolean;
  value?: number;
  /** A photo taken for the booking at the counter (GET /api/files/:id). */
  fileId?: number;
  withinLimits: boolean;
}

/** A completed checklist of a booking (GET /api/bookings/:id/checklist-runs), newest first. */
export interface ChecklistRunRecord {
  id: number;
  phase: 'pre' | 'return';
  planVersion: number;
  /** False when the plan changed afterwards: the release needs a new run for the new plan. */
  current: boolean;
  withinLimits: boolean;
  completedAt: string;
  completedByName: string;
  answers: ChecklistAnswerRecord[];
}

export interface BookingApproval {
  decision: 'approve' | 'refuse';
  officerName: string;
  conditions: string | null;
  reason: string | null;
  decidedAt: string;
  /** The plan version the decision was given for. */
  planVersion: number;
  /** False once the plan changed after the decision: it no longer covers the booking. */
  current: boolean;
}

export interface ChecklistRunState {
  completedAt: string;
  /** Every reading inside the limits in force now. */
  withinLimits: boolean;
  /** Every line in force now answered as it stands (a line added or changed since makes it false). */
  complete: boolean;
  /** What stops the run from counting, one sentence a line. */
  gaps: string[];
}

export interface Booking {
  id: number;
  personId: number;
  personName: string;
  /** False once the booker's account is deactivated: the booking cannot be released. */
  bookerActive: boolean;
  status: BookingStatus;
  overdue: boolean;
  /** Gear out that must come back now: overdue, or out with a person since deactivated. */
  needsReturn: boolean;
  startsAt: string;
  endsAt: string;
  location: string;
  purpose: string;
  plan: TestPlan;
  planVersion: number;
  itemIds: number[];
  items: ItemSummary[];
  assessment: Assessment;
  approvalRequired: boolean;
  approval: BookingApproval | null;
  checklist: { pre: ChecklistEntry[]; return: ChecklistEntry[] };
  checklistRuns: { pre: ChecklistRunState | null; return: ChecklistRunState | null };
  scannedItemIds: number[];
  releasedAt: string | null;
  returnedAt: string | null;
  cancelledAt: string | null;
  createdAt: string;
}

export interface BookingSummary {
  id: number;
  personId: number;
  personName: string;
  status: BookingStatus;
  overdue: boolean;
  startsAt: string;
  endsAt: string;
  location: string;
  purpose: string;
  plannedKv: number;
  approvalRequired: boolean;
  itemTags: string[];
}

/** One line of an item's booking history. */
export interface ItemBooking {
  bookingId: number;
  personId: number;
  status: BookingStatus;
  overdue: boolean;
  startsAt: string;
  endsAt: string;
  plannedKv: number;
  personName: string;
}

/** A live booking holding an item in a window. */
export interface BusyWindow {
  bookingId: number;
  status: BookingStatus;
  startsAt: string;
  endsAt: string;
  personName: string;
}

/** A checklist line as officers keep it (GET /api/checklist-templates). */
export interface ChecklistTemplate {
  id: number;
  phase: 'pre' | 'return';
  kind: 'confirm' | 'reading' | 'photo';
  text: string;
  unit: string | null;
  min: number | null;
  max: number | null;
  maxFromRule: 'safeResidualV' | null;
  required: boolean;
  appliesFromKv: number | null;
  appliesWithKind: string | null;
  position: number;
}

/** What release would answer now (GET /api/bookings/:id/release-check): the screen shows it before the last button. */
export interface ReleasePreview {
  failures: RuleFailure[];
  /** When the counter may release at the earliest (the start less the lab's early pick-up). */
  opensAt: string;
  checkedAt: string;
}
