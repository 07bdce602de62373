import { z } from 'zod';
// Installs the shared error map (plain words with units) wherever a schema is used.
import '../zod-errors';

// Request bodies of the calculation API (field names are the contract shared with shared/hv).
// In zod 4, z.number() already rejects NaN and ±Infinity; `.finite()` is a deprecated no-op,
// so it is left out. Objects are strict: an unknown field is more likely a unit mix-up
// (capacitanceNf for capacitanceF) than something to ignore.

const positive = () => z.number().positive();
const nonNegative = () => z.number().nonnegative();

export const energyBodySchema = z.strictObject({
  capacitanceF: positive(),
  voltageV: nonNegative(),
});

export const dischargeBodySchema = z
  .strictObject({
    resistanceOhm: positive(),
    capacitanceF: positive(),
    initialV: positive(),
    safeV: positive(),
  })
  .refine((body) => body.safeV < body.initialV, {
    message: 'The safe voltage must be below the initial voltage',
    path: ['safeV'],
  });

export const hazardBodySchema = z.strictObject({
  voltageV: nonNegative(),
  currentA: nonNegative(),
  capacitanceF: nonNegative(),
});

export const boundariesBodySchema = z.strictObject({
  voltageV: nonNegative(),
  system: z.enum(['dc', 'ac']),
});

export const multiplierBodySchema = z.strictObject({
  stages: z.int().min(1).max(50),
  peakInputV: positive(),
  frequencyHz: positive(),
  stageCapacitanceF: positive(),
  loadCurrentA: nonNegative(),
});

export const coronaBodySchema = z
  .strictObject({
    wireRadiusM: positive(),
    pressureCmHg: positive(),
    // Peek's density factor uses 273 + t, so only temperatures above −273 °C are meaningful.
    temperatureC: z.number().gt(-273),
    surfaceFactor: z.number().positive().max(1),
    outerRadiusM: positive().optional(),
  })
  .refine((body) => body.outerRadiusM === undefined || body.outerRadiusM > body.wireRadiusM, {
    message: 'The outer radius must be larger than the wire radius',
    path: ['outerRadiusM'],
  });

export type EnergyBody = z.infer<typeof energyBodySchema>;
export type DischargeBody = z.infer<typeof dischargeBodySchema>;
export type HazardBody = z.infer<typeof hazardBodySchema>;
export type BoundariesBody = z.infer<typeof boundariesBodySchema>;
export type MultiplierBody = z.infer<typeof multiplierBodySchema>;
export type CoronaBody = z.infer<typeof coronaBodySchema>;
