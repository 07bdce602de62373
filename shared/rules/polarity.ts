// Whether the set's sources can produce the plan's polarity. A supply or multiplier stack built
// for one polarity cannot be turned round at the bench (its rectifiers face one way), so a
// negative-corona plan with only positive sources would either not run or run on gear rigged for
// something it was not built for. Common practice, no source: a "reversible" source produces
// either polarity; a plan marked reversible needs both from the set.
import type { Polarity } from '../schemas/items';
import type { Reason } from '../schemas/assessment';

export interface PolaritySource {
  tag: string;
  polarity: Polarity | null;
}

const CAN_PRODUCE: Record<Polarity, readonly ('positive' | 'negative')[]> = {
  positive: ['positive'],
  negative: ['negative'],
  reversible: ['positive', 'negative'],
};

const WORDS: Record<Polarity, string> = { positive: 'positive only', negative: 'negative only', reversible: 'either polarity' };

/** The reason the set cannot run the plan's polarity, or null when it can (or has no rated source). */
export function polarityProblem(planPolarity: Polarity, sources: readonly PolaritySource[]): Reason | null {
  const rated = sources.filter((s): s is PolaritySource & { polarity: Polarity } => s.polarity !== null);
  if (rated.length === 0) return null;
  const produced = new Set(rated.flatMap((s) => CAN_PRODUCE[s.polarity]));
  const needed = CAN_PRODUCE[planPolarity];
  if (needed.every((p) => produced.has(p))) return null;
  const list = rated.map((s) => `${s.tag} (${WORDS[s.polarity]})`).join(', ');
  const plan = planPolarity === 'reversible' ? 'both polarities' : `${planPolarity} polarity`;
  return {
    code: 'polarity',
    message: `The plan needs ${plan}, but no source in the set can produce it: ${list}. Add a ${planPolarity === 'reversible' ? 'reversible' : `${planPolarity} or reversible`} source, or change the plan.`,
  };
}
