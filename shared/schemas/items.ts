// Gear records: one zod schema per payload, shared by the item form and the API.
// Ratings are a discriminated union on `kind`; every field name carries its unit.
import { z } from 'zod';
// Installs the shared error map (plain words with units) wherever a schema is used.
import '../zod-errors';

export const ITEM_KINDS = ['multiplier', 'hv-supply', 'probe', 'isolation-stand', 'grounding-stick', 'interlock', 'meter', 'other'] as const;
export const itemKindSchema = z.enum(ITEM_KINDS);
export type ItemKind = z.infer<typeof itemKindSchema>;

export const KIND_LABELS: Record<ItemKind, string> = {
  multiplier: 'Voltage multiplier',
  'hv-supply': 'HV supply',
  probe: 'HV probe / divider',
  'isolation-stand': 'Isolation stand',
  'grounding-stick': 'Grounding stick',
  interlock: 'Interlock / enclosure',
  meter: 'Meter',
  other: 'Other',
};

/** Tag prefixes per kind: tags read like KH-MUL-0007 on a label across the room. */
export const KIND_TAG_CODES: Record<ItemKind, string> = {
  multiplier: 'MUL',
  'hv-supply': 'SUP',
  probe: 'PRB',
  'isolation-stand': 'STD',
  'grounding-stick': 'GST',
  interlock: 'ILK',
  meter: 'MTR',
  other: 'OTH',
};

/**
 * Default inspection intervals in days (managers can change them per item).
 * Common practice, no source, except where noted: sticks get a yearly documented inspection on top
 * of the visual check at every checkout; probes and dividers a yearly calibration.
 */
export const DEFAULT_INSPECTION_DAYS: Record<ItemKind, number> = {
  multiplier: 180,
  'hv-supply': 365,
  probe: 365,
  'isolation-stand': 365,
  'grounding-stick': 365,
  interlock: 180,
  meter: 365,
  other: 365,
};

export const POLARITIES = ['positive', 'negative', 'reversible'] as const;
export const polaritySchema = z.enum(POLARITIES);
export type Polarity = z.infer<typeof polaritySchema>;

const kv = z.number().finite().positive().max(1000);
const positive = z.number().finite().positive();

export const multiplierRatingsSchema = z
  .object({
    stages: z.number().int().min(1).max(50),
    stageCapacitanceNf: positive.max(1e6),
    driveFrequencyHz: positive.max(1e7),
    maxInputKvPeak: kv,
    maxOutputKv: kv,
    maxMa: positive.max(1e4),
    polarity: polaritySchema,
  })
  .strict();

export const supplyRatingsSchema = z
  .object({
    maxKv: kv,
    maxMa: positive.max(1e5),
    polarity: polaritySchema,
    outputCapacitanceNf: z.number().finite().min(0).max(1e7),
    bleederMohm: positive.max(1e7).nullable(),
    hasInterlockInput: z.boolean(),
  })
  .strict();

export const probeRatingsSchema = z
  .object({
    maxKv: kv,
    ratio: positive.max(1e7),
    inputResistanceMohm: positive.max(1e7),
  })
  .strict();

export const standRatingsSchema = z.object({ withstandKv: kv }).strict();

export const stickRatingsSchema = z
  .object({
    ratedKv: kv,
    // Null for a solid (non-resistive) grounding stick.
    hookResistanceMohm: positive.max(1e5).nullable(),
    cableLengthM: positive.max(100),
  })
  .strict();

export const interlockRatingsSchema = z.object({ ratedKv: kv }).strict();
export const meterRatingsSchema = z.object({ maxKv: kv.nullable() }).strict();
export const otherRatingsSchema = z.object({ maxKv: kv.nullable() }).strict();

export const itemRatingsSchema = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('multiplier'), ratings: multiplierRatingsSchema }),
  z.object({ kind: z.literal('hv-supply'), ratings: supplyRatingsSchema }),
  z.object({ kind: z.literal('probe'), ratings: probeRatingsSchema }),
  z.object({ kind: z.literal('isolation-stand'), ratings: standRatingsSchema }),
  z.object({ kind: z.literal('grounding-stick'), ratings: stickRatingsSchema }),
  z.object({ kind: z.literal('interlock'), ratings: interlockRatingsSchema }),
  z.object({ kind: z.literal('meter'), ratings: meterRatingsSchema }),
  z.object({ kind: z.literal('other'), ratings: otherRatingsSchema }),
]);
export type ItemRatings = z.infer<typeof itemRatingsSchema>;
export type RatingsOf<K extends ItemKind> = Extract<ItemRatings, { kind: K }>['ratings'];

export const RATINGS_SCHEMAS = {
  multiplier: multiplierRatingsSchema,
  'hv-supply': supplyRatingsSchema,
  probe: probeRatingsSchema,
  'isolation-stand': standRatingsSchema,
  'grounding-stick': stickRatingsSchema,
  interlock: interlockRatingsSchema,
  meter: meterRatingsSchema,
  other: otherRatingsSchema,
} as const satisfies Record<ItemKind, z.ZodType>;

/** The one voltage the safety gate compares with a plan. */
export function ratedKvOf(item: ItemRatings): number | null {
  switch (item.kind) {
    case 'multiplier':
      return item.ratings.maxOutputKv;
    case 'hv-supply':
    case 'probe':
      return item.ratings.maxKv;
    case 'isolation-stand':
      return item.ratings.withstandKv;
    case 'grounding-stick':
    case 'interlock':
      return item.ratings.ratedKv;
    case 'meter':
    case 'other':
      return item.ratings.maxKv;
  }
}

export const TAG_PATTERN = /^[A-Z0-9][A-Z0-9-]{1,30}[A-Z0-9]$/;
export const tagSchema = z.string().trim().toUpperCase().regex(TAG_PATTERN, 'Tags use capital letters, digits and dashes (3–32 characters)');

const text = (max: number) => z.string().trim().max(max);

const itemCommonFields = {
  name: text(120).min(2, 'Give the item a name'),
  make: text(80).default(''),
  model: text(80).default(''),
  serial: text(80).default(''),
  location: text(120).min(1, 'Where is it kept?'),
  notes: text(2000).default(''),
  inspectionIntervalDays: z.number().int().min(1).max(3650).optional(),
};

const createFields = { tag: tagSchema.optional(), ...itemCommonFields };
const createVariant = <K extends ItemKind, R extends z.ZodType>(kind: K, ratings: R) => z.object({ ...createFields, kind: z.literal(kind), ratings }).strict();

export const itemCreateSchema = z.discriminatedUnion('kind', [
  createVariant('multiplier', multiplierRatingsSchema),
  createVariant('hv-supply', supplyRatingsSchema),
  createVariant('probe', probeRatingsSchema),
  createVariant('isolation-stand', standRatingsSchema),
  createVariant('grounding-stick', stickRatingsSchema),
  createVariant('interlock', interlockRatingsSchema),
  createVariant('meter', meterRatingsSchema),
  createVariant('other', otherRatingsSchema),
]);
export type ItemCreateInput = z.input<typeof itemCreateSchema>;

/** Kind never changes after registration; ratings are replaced whole for the item's kind. */
export const itemUpdateSchema = z
  .object({
    name: itemCommonFields.name.optional(),
    make: text(80).optional(),
    model: text(80).optional(),
    serial: text(80).optional(),
    location: itemCommonFields.location.optional(),
    notes: text(2000).optional(),
    inspectionIntervalDays: z.number().int().min(1).max(3650).optional(),
    ratings: z.record(z.string(), z.unknown()).optional(),
    status: z.enum(['in-service', 'out-of-service', 'retired']).optional(),
    statusReason: text(500).optional(),
  })
  .strict()
  .refine((v) => Object.keys(v).length > 0, 'Nothing to change')
  .refine((v) => v.status !== 'out-of-service' || (v.statusReason ?? '').length > 0, {
    message: 'Say why the item is out of service',
    path: ['statusReason'],
  });
export type ItemUpdateInput = z.infer<typeof itemUpdateSchema>;

export const ITEM_STATUSES = ['in-service', 'out-of-service', 'retired'] as const;
export type ItemStatus = (typeof ITEM_STATUSES)[number];

export const ITEM_SORTS = ['tag', 'name', 'ratedKv', 'nextDue'] as const;
export const itemListQuerySchema = z
  .object({
    q: z.string().trim().max(100).optional(),
    kind: itemKindSchema.optional(),
    status: z.enum(ITEM_STATUSES).optional(),
    minKv: z.coerce.number().finite().min(0).max(1000).optional(),
    due: z.enum(['soon', 'overdue']).optional(),
    sort: z.enum(ITEM_SORTS).default('tag'),
    cursor: z.string().max(200).optional(),
    limit: z.coerce.number().int().min(1).max(100).default(25),
  })
  .strict();
export type ItemListQuery = z.infer<typeof itemListQuerySchema>;

export const inspectionCreateSchema = z
  .object({
    result: z.enum(['pass', 'fail']),
    inspectedOn: z.iso.date().optional(),
    readings: z
      .array(z.object({ label: text(80).min(1), value: z.number().finite(), unit: text(20).min(1) }).strict())
      .max(20)
      .default([]),
    notes: text(2000).default(''),
  })
  .strict()
  .refine((v) => v.result === 'pass' || v.notes.length > 0, { message: 'Describe what failed', path: ['notes'] });
export type InspectionCreateInput = z.input<typeof inspectionCreateSchema>;

export type InspectionState = 'current' | 'due-soon' | 'overdue' | 'never';

export interface ItemSummary {
  id: number;
  tag: string;
  kind: ItemKind;
  name: string;
  status: ItemStatus;
  statusReason: string | null;
  ratedKv: number | null;
  location: string;
  nextInspectionDue: string | null;
  inspectionState: InspectionState;
}

export interface Item extends ItemSummary {
  make: string;
  model: string;
  serial: string;
  notes: string;
  ratings: ItemRatings['ratings'];
  inspectionIntervalDays: number;
  lastInspectedOn: string | null;
  lastInspectionResult: 'pass' | 'fail' | null;
  photoFileId: number | null;
  labelUrl: string;
  createdAt: string;
  updatedAt: string;
}

export interface Inspection {
  id: number;
  itemId: number;
  inspectedOn: string;
  inspectorName: string;
  result: 'pass' | 'fail';
  readings: { label: string; value: number; unit: string }[];
  notes: string;
  nextDue: string;
}

export interface ItemFile {
  id: number;
  itemId: number;
  kind: 'photo' | 'document';
  fileName: string;
  contentType: string;
  sizeBytes: number;
  uploadedAt: string;
  uploadedByName: string | null;
}

/** Days before the due date at which an inspection shows as due soon. */
export const DUE_SOON_DAYS = 14;
