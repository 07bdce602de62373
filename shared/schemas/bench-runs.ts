// The bench log: runs recorded against a released booking. One schema per payload; the run form
// (zodResolver) and the server (validate) use the same ones. Currents may be entered in µA
// (`currentUa`) and thrusts in grams-force (`thrustGf`) instead of mA / mN; the server stores
// mA and mN and remembers the unit each was entered in, so the list shows it as typed.
import { z } from 'zod';
import type { BenchFlag, BenchRunDerived } from '../hv/bench-run';

export const RUN_POLARITIES = ['positive', 'negative'] as const;
export type RunPolarity = (typeof RUN_POLARITIES)[number];

const reading = (max: number) => z.number().finite().min(0).max(max);
const positive = (max: number) => z.number().finite().positive().max(max);

const runFields = {
  appliedKv: positive(300),
  polarity: z.enum(RUN_POLARITIES).optional(),
  currentMa: reading(10_000).optional(),
  currentUa: reading(10_000_000).optional(),
  gapMm: positive(5_000),
  stages: z.number().int().min(1).max(50).optional(),
  velocityMps: reading(200).optional(),
  thrustMn: reading(1_000_000).optional(),
  thrustGf: reading(100_000).optional(),
  massG: positive(1_000_000).optional(),
  outletAreaCm2: positive(1_000_000).optional(),
  // Bench rooms, not weather stations: wide enough for a cold store or a hot enclosure.
  temperatureC: z.number().finite().min(-40).max(80).optional(),
  pressureKpa: z.number().finite().min(30).max(120).optional(),
  humidityPct: z.number().finite().min(0).max(100).optional(),
  notes: z.string().trim().max(1000).optional(),
  /** A photo uploaded to this booking (POST /api/bookings/:id/photos). */
  photoFileId: z.number().int().positive().optional(),
  // Electrode geometry for comparing the fitted onset with Peek's (the Planner's corona inputs).
  wireRadiusMm: positive(100).optional(),
  collectorRadiusMm: positive(10_000).optional(),
  surfaceFactor: z.number().positive().max(1).optional(),
};

type RunShape = { currentMa?: number; currentUa?: number; thrustMn?: number; thrustGf?: number; wireRadiusMm?: number; collectorRadiusMm?: number };
const oneCurrent = (v: RunShape) => (v.currentMa === undefined) !== (v.currentUa === undefined);
const atMostOneThrust = (v: RunShape) => v.thrustMn === undefined || v.thrustGf === undefined;
const collectorOutside = (v: RunShape) => v.collectorRadiusMm === undefined || v.wireRadiusMm === undefined || v.collectorRadiusMm > v.wireRadiusMm;

export const benchRunInputSchema = z
  .strictObject(runFields)
  .refine(oneCurrent, { message: 'Give the current once: in mA (currentMa) or in µA (currentUa)', path: ['currentMa'] })
  .refine(atMostOneThrust, { message: 'Give the thrust once: in mN (thrustMn) or in grams-force (thrustGf)', path: ['thrustMn'] })
  .refine(collectorOutside, { message: 'The collector radius must be larger than the wire radius', path: ['collectorRadiusMm'] });
export type BenchRunInput = z.infer<typeof benchRunInputSchema>;

/** Why an edit was made, kept with the revision. */
export const benchRunEditSchema = z
  .strictObject({ ...runFields, reason: z.string().trim().min(3, 'Say why the run is corrected').max(500) })
  .refine(oneCurrent, { message: 'Give the current once: in mA (currentMa) or in µA (currentUa)', path: ['currentMa'] })
  .refine(atMostOneThrust, { message: 'Give the thrust once: in mN (thrustMn) or in grams-force (thrustGf)', path: ['thrustMn'] })
  .refine(collectorOutside, { message: 'The collector radius must be larger than the wire radius', path: ['collectorRadiusMm'] });
export type BenchRunEdit = z.infer<typeof benchRunEditSchema>;

export const benchRunDeleteSchema = z.strictObject({ reason: z.string().trim().min(3, 'Say why the run is removed').max(500) });

export const runParamsSchema = z.strictObject({
  id: z.coerce.number().int().positive().max(2_147_483_647),
  runId: z.coerce.number().int().positive().max(2_147_483_647),
});

/** The bench form's field names that a CSV column can be mapped onto. */
export const CSV_FIELDS = [
  'appliedKv',
  'currentMa',
  'currentUa',
  'gapMm',
  'polarity',
  'stages',
  'velocityMps',
  'thrustMn',
  'thrustGf',
  'massG',
  'outletAreaCm2',
  'temperatureC',
  'pressureKpa',
  'humidityPct',
  'notes',
] as const;
export type CsvField = (typeof CSV_FIELDS)[number];

export const benchRunImportSchema = z.strictObject({
  /** The logger's file as text (the JSON body limit caps it at about 100 kB). */
  csv: z.string().min(1, 'The file is empty').max(90_000, 'The file is larger than 90 kB: split it'),
  /** Run field → the file's column header. */
  mapping: z.partialRecord(z.enum(CSV_FIELDS), z.string().min(1).max(200)),
});
export type BenchRunImport = z.infer<typeof benchRunImportSchema>;

export type CurrentUnit = 'mA' | 'µA';
export type ThrustUnit = 'mN' | 'gf';

export interface BenchRun {
  id: number;
  bookingId: number;
  /** Position in the booking's log, 1 for the first run. */
  number: number;
  revision: number;
  recordedAt: string;
  recordedBy: { id: number; name: string };
  appliedKv: number;
  polarity: RunPolarity;
  currentMa: number;
  currentUnit: CurrentUnit;
  gapMm: number;
  stages: number | null;
  velocityMps: number | null;
  thrustMn: number | null;
  thrustUnit: ThrustUnit;
  massG: number | null;
  outletAreaCm2: number | null;
  temperatureC: number | null;
  pressureKpa: number | null;
  humidityPct: number | null;
  notes: string;
  photoFileId: number | null;
  wireRadiusMm: number | null;
  collectorRadiusMm: number | null;
  surfaceFactor: number | null;
  derived: BenchRunDerived;
  flags: BenchFlag[];
}

export interface CoronaFitSummary {
  gapMm: number;
  polarity: RunPolarity;
  /** Runs with current above zero that the fit used. */
  n: number;
  onsetKv: number;
  onsetKvStdErr: number;
  /** mA/kV². */
  c: number;
  cStdErr: number;
  r2: number;
  /** Peek's coaxial onset for the geometry entered with these runs, when there is one. */
  peekOnsetKv: number | null;
  source: string;
}

export interface BenchRunRevision {
  revision: number;
  editedAt: string;
  editedBy: string;
  reason: string;
  /** The run's readings as they were before this edit (or the deletion). */
  before: Record<string, unknown>;
  action: 'edited' | 'deleted';
}

export interface BenchRunsResponse {
  runs: BenchRun[];
  /** The fit for the gap and polarity of the latest run, or null when it has too few runs. */
  fit: CoronaFitSummary | null;
  /** One per gap and polarity with at least four runs above onset. */
  fits: CoronaFitSummary[];
  /** Whether the caller may add runs now (released, or returned within the grace). */
  open: boolean;
  /** The hours after return in which runs may still be typed up. */
  graceHours: number;
}
