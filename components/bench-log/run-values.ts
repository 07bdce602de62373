// The run form's values: a new run starts from the last one (a sweep changes one knob at a time),
// a correction from the run itself. Currents and thrusts come back in the unit they were typed in.
import type { BenchRun, BenchRunInput } from '@/shared/schemas/bench-runs';

export type RunFormValues = BenchRunInput & { reason?: string };

const opt = (v: number | null) => (v === null ? undefined : v);

export function valuesFromRun(run: BenchRun | undefined, withNotes = false): RunFormValues {
  if (!run) return {} as RunFormValues;
  return {
    appliedKv: run.appliedKv,
    polarity: run.polarity,
    ...(run.currentUnit === 'µA' ? { currentUa: Number((run.currentMa * 1000).toPrecision(12)) } : { currentMa: run.currentMa }),
    gapMm: run.gapMm,
    stages: opt(run.stages),
    velocityMps: opt(run.velocityMps),
    ...(run.thrustMn === null ? {} : run.thrustUnit === 'gf' ? { thrustGf: Number((run.thrustMn / 9.80665).toPrecision(6)) } : { thrustMn: run.thrustMn }),
    massG: opt(run.massG),
    outletAreaCm2: opt(run.outletAreaCm2),
    temperatureC: opt(run.temperatureC),
    pressureKpa: opt(run.pressureKpa),
    humidityPct: opt(run.humidityPct),
    wireRadiusMm: opt(run.wireRadiusMm),
    collectorRadiusMm: opt(run.collectorRadiusMm),
    surfaceFactor: opt(run.surfaceFactor),
    notes: withNotes && run.notes ? run.notes : undefined,
    photoFileId: withNotes ? opt(run.photoFileId) : undefined,
  } as RunFormValues;
}

/** Drops the empty fields a form leaves behind, so the payload names only what was entered. */
export function payloadOf(values: RunFormValues): RunFormValues {
  return Object.fromEntries(
    Object.entries(values).filter(([, v]) => v !== undefined && v !== null && v !== '' && !(typeof v === 'number' && Number.isNaN(v))),
  ) as RunFormValues;
}
