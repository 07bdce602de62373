// Each bench-run flag as a hazard level (safety colour + signal word + icon, never colour alone)
// and a short word for lists. Beyond the plan or the supply is danger: the officer approved less.
import type { HazardLevel } from '@/components/theme/tokens';
import type { BenchFlagCode } from '@/shared/hv/bench-run';

export const FLAG_WORDS: Record<BenchFlagCode, { level: HazardLevel; word: string }> = {
  'above-plan-kv': { level: 'danger', word: 'Above planned kV' },
  'above-plan-current': { level: 'danger', word: 'Above planned current' },
  'above-supply-rating': { level: 'danger', word: 'Beyond supply rating' },
  'near-sparkover': { level: 'warning', word: 'Near sparkover' },
  'thrust-above-ehd-bound': { level: 'caution', word: 'Thrust above 1-D bound' },
  'momentum-mismatch': { level: 'caution', word: 'Velocity and thrust disagree' },
};
