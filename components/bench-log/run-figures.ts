// How a run's numbers are written on screen: a few significant digits, the unit always beside,
// and the current also in the unit it was typed in.
import type { BenchRun } from '@/shared/schemas/bench-runs';

export function sig(value: number | null | undefined, digits = 3): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  if (value === 0) return '0';
  return Number(value.toPrecision(digits)).toLocaleString('en-GB', { maximumSignificantDigits: digits });
}

export function currentText(run: Pick<BenchRun, 'currentMa' | 'currentUnit'>): string {
  return run.currentUnit === 'µA' ? `${sig(run.currentMa * 1000, 4)} µA` : `${sig(run.currentMa, 4)} mA`;
}

export function thrustText(run: Pick<BenchRun, 'thrustMn' | 'thrustUnit'>): string {
  if (run.thrustMn === null) return 'no thrust';
  const mn = `${sig(run.thrustMn)} mN`;
  return run.thrustUnit === 'gf' ? `${mn} (${sig(run.thrustMn / 9.80665)} gf)` : mn;
}

/** "Run 3 · 9 kV positive · 180 µA · 30 mm" */
export function runHeadline(run: BenchRun): string {
  return `Run ${run.number} · ${sig(run.appliedKv)} kV ${run.polarity} · ${currentText(run)} · ${sig(run.gapMm)} mm`;
}

/** The derived figures as label/value pairs, skipping those without their inputs. */
export function derivedLines(run: BenchRun): { label: string; value: string }[] {
  const d = run.derived;
  const lines = [
    { label: 'Power', value: `${sig(d.powerW)} W` },
    { label: 'Thrust', value: thrustText(run) },
    { label: '1-D thrust bound I·d/μ', value: `${sig(d.ehdThrustBoundMn)} mN` },
    d.thrustPerPowerMnPerW === null ? null : { label: 'Thrust per power', value: `${sig(d.thrustPerPowerMnPerW)} mN/W` },
    d.wattsPerGramForce === null ? null : { label: 'Power per thrust', value: `${sig(d.wattsPerGramForce)} W/gf` },
    d.thrustToWeightPct === null ? null : { label: 'Thrust-to-weight', value: `${sig(d.thrustToWeightPct)} %` },
    run.velocityMps === null ? null : { label: 'Velocity (measured)', value: `${sig(run.velocityMps)} m/s` },
    d.momentumVelocityMps === null ? null : { label: 'Velocity from thrust and area', value: `${sig(d.momentumVelocityMps)} m/s` },
    d.airDensityKgM3 === null ? null : { label: 'Air density', value: `${sig(d.airDensityKgM3, 4)} kg/m³` },
  ];
  return lines.filter((l): l is { label: string; value: string } => l !== null);
}
