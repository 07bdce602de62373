// What the bench log's charts draw, worked out from the runs and fits alone, so each chart's
// table and text summary say exactly what its picture shows.
import type { BenchRun, CoronaFitSummary } from '@/shared/schemas/bench-runs';

import { sig } from './run-figures';

export interface ChartPoint {
  x: number;
  y: number;
  run: number;
  /** The run carries a flag: drawn hollow, named in the table, left out of "best" figures. */
  flagged: boolean;
}

export interface ChartSeries {
  key: string;
  label: string;
  points: ChartPoint[];
  /** A fitted curve, drawn as a line through these points. */
  curve?: { x: number; y: number }[];
  /** A marked x position (the fitted onset V₀). */
  markX?: { x: number; label: string };
}

export interface ChartModel {
  key: string;
  title: string;
  xLabel: string;
  yLabel: string;
  /** Named x positions (weeks, months, groups) in place of numeric ticks. */
  xTicks?: { x: number; label: string }[];
  series: ChartSeries[];
  summary: string;
}

function byGap(runs: readonly BenchRun[]): Map<number, BenchRun[]> {
  const groups = new Map<number, BenchRun[]>();
  for (const run of [...runs].sort((a, b) => a.gapMm - b.gapMm || a.appliedKv - b.appliedKv)) groups.set(run.gapMm, [...(groups.get(run.gapMm) ?? []), run]);
  return groups;
}

const gapLabel = (gapMm: number) => `${sig(gapMm)} mm gap`;

function rangeSentence(points: ChartPoint[], x: (v: number) => string, y: (v: number) => string): string {
  if (points.length === 0) return 'no points';
  const first = points[0]!;
  const last = points[points.length - 1]!;
  return points.length === 1 ? `${y(first.y)} at ${x(first.x)}` : `${y(first.y)} at ${x(first.x)} to ${y(last.y)} at ${x(last.x)} (${points.length} runs)`;
}

export function velocityChart(runs: readonly BenchRun[]): ChartModel {
  const series = [...byGap(runs)].map(([gapMm, group]) => ({
    key: `gap-${gapMm}`,
    label: gapLabel(gapMm),
    points: group.filter((r) => r.velocityMps !== null).map((r) => ({ x: r.appliedKv, y: r.velocityMps!, run: r.number, flagged: r.flags.length > 0 })),
  }));
  const drawn = series.filter((s) => s.points.length > 0);
  return {
    key: 'velocity',
    title: 'Airflow velocity against voltage, per gap',
    xLabel: 'Applied voltage (kV)',
    yLabel: 'Velocity (m/s)',
    series: drawn,
    summary:
      drawn.length === 0
        ? 'No run has an airflow velocity yet.'
        : drawn
            .map(
              (s) =>
                `At ${s.label}: ${rangeSentence(
                  s.points,
                  (v) => `${sig(v)} kV`,
                  (v) => `${sig(v)} m/s`,
                )}.`,
            )
            .join(' '),
  };
}

export function currentChart(runs: readonly BenchRun[], fits: readonly CoronaFitSummary[]): ChartModel {
  const series = [...byGap(runs)].map(([gapMm, group]) => {
    const fit = fits.find((f) => f.gapMm === gapMm && f.polarity === group[group.length - 1]!.polarity);
    const top = Math.max(...group.map((r) => r.appliedKv));
    const curve =
      fit && top > fit.onsetKv
        ? Array.from({ length: 25 }, (_, i) => {
            const kv = fit.onsetKv + ((top - fit.onsetKv) * i) / 24;
            return { x: kv, y: fit.c * kv * (kv - fit.onsetKv) };
          })
        : undefined;
    return {
      key: `gap-${gapMm}`,
      label: gapLabel(gapMm),
      points: group.map((r) => ({ x: r.appliedKv, y: r.currentMa, run: r.number, flagged: r.flags.length > 0 })),
      curve,
      markX: fit ? { x: fit.onsetKv, label: `V₀ ${sig(fit.onsetKv)} kV` } : undefined,
    };
  });
  const sentences = series.map((s) => {
    const fit = fits.find((f) => `gap-${f.gapMm}` === s.key);
    const fitText = fit
      ? ` Fitted I = C·V·(V − V₀): V₀ = ${sig(fit.onsetKv)} ± ${sig(fit.onsetKvStdErr, 2)} kV, C = ${sig(fit.c)} mA/kV², R² = ${fit.r2.toFixed(3)}${fit.peekOnsetKv === null ? '' : `; Peek's onset for the entered geometry ${sig(fit.peekOnsetKv)} kV`}.`
      : ' Too few runs above onset for a fit (four needed).';
    return `At ${s.label}: ${rangeSentence(
      s.points,
      (v) => `${sig(v)} kV`,
      (v) => `${sig(v)} mA`,
    )}.${fitText}`;
  });
  return {
    key: 'current',
    title: 'Corona current against voltage, with the fitted curve',
    xLabel: 'Applied voltage (kV)',
    yLabel: 'Current (mA)',
    series,
    summary: series.length === 0 ? 'No runs yet.' : sentences.join(' '),
  };
}

export function thrustChart(runs: readonly BenchRun[]): ChartModel {
  const series = [...byGap(runs)]
    .map(([gapMm, group]) => ({
      key: `gap-${gapMm}`,
      label: gapLabel(gapMm),
      points: group.filter((r) => r.thrustMn !== null).map((r) => ({ x: r.derived.powerW, y: r.thrustMn!, run: r.number, flagged: r.flags.length > 0 })),
    }))
    .filter((s) => s.points.length > 0);
  return {
    key: 'thrust',
    title: 'Thrust against electrical power',
    xLabel: 'Power (W)',
    yLabel: 'Thrust (mN)',
    series,
    summary:
      series.length === 0
        ? 'No run has a thrust yet.'
        : series
            .map((s) => {
              const clean = s.points.filter((p) => !p.flagged && p.x > 0);
              const best = clean.reduce<ChartPoint | null>((a, p) => (a === null || p.y / p.x > a.y / a.x ? p : a), null);
              const flagged = s.points.filter((p) => p.flagged).map((p) => p.run);
              const bestText = best ? `; best ${sig(best.y / best.x)} mN/W (run ${best.run})` : '';
              const flaggedText = flagged.length > 0 ? `; flagged, drawn hollow and left out of the best: run ${flagged.join(', ')}` : '';
              return `At ${s.label}: ${rangeSentence(
                s.points,
                (v) => `${sig(v)} W`,
                (v) => `${sig(v)} mN`,
              )}${bestText}${flaggedText}.`;
            })
            .join(' '),
  };
}
