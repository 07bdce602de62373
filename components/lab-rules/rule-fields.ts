// What each lab rule means, its unit, its default and why that default. Where a standard sets the
// number, the line names it (from shared/hv/data); where none does, it says it is lab practice.
import { HAZARDOUS_LIVE_LEVELS, SAFE_RESIDUAL_VOLTAGE } from '@/shared/hv';
import type { LabRules } from '@/shared/schemas/bookings';

export interface RuleField {
  name: keyof LabRules;
  label: string;
  unit: string;
  integer?: boolean;
  /** The value the lab starts with (migrations/20261202000500_bookings.ts). */
  defaultValue: number;
  /** One line: why the default is what it is. */
  justification: string;
}

export const RULE_FIELDS: readonly RuleField[] = [
  {
    name: 'approvalKv',
    label: 'Officer approval above',
    unit: 'kV',
    defaultValue: 15,
    justification:
      'Lab practice, no single standard: routine teaching and corona work stays below it; above it an officer reviews the barrier, the gear and who is present.',
  },
  {
    name: 'energyThresholdJ',
    label: 'Officer approval when stored energy exceeds',
    unit: 'J',
    defaultValue: 0.35,
    justification: `The energy line of the hazardous-live limits: ${HAZARDOUS_LIVE_LEVELS.energyLimitJ.source}.`,
  },
  {
    name: 'ratingMarginPct',
    label: 'Rating margin over the planned voltage',
    unit: '%',
    defaultValue: 10,
    justification: 'Lab practice: headroom for overshoot, meter error and ageing insulation. No standard sets it, so the lab does.',
  },
  {
    name: 'interlockKv',
    label: 'Interlock or barrier required above',
    unit: 'kV',
    defaultValue: 1.5,
    justification: 'Where low voltage ends for DC (1500 V, IEC 60038): above it the set must include an interlocked enclosure or barrier.',
  },
  {
    name: 'safeResidualV',
    label: 'Safe residual voltage after discharge',
    unit: 'V',
    defaultValue: SAFE_RESIDUAL_VOLTAGE.default.value,
    justification: `${SAFE_RESIDUAL_VOLTAGE.default.source}. The alternative, ${SAFE_RESIDUAL_VOLTAGE.alternative.value} V, follows ${SAFE_RESIDUAL_VOLTAGE.alternative.source}.`,
  },
  {
    name: 'earlyPickupMin',
    label: 'Release opens before the window',
    unit: 'min',
    integer: true,
    defaultValue: 15,
    justification: 'Lab practice: time to scan and run the checklist so the test can start on time.',
  },
  {
    name: 'overdueGraceMin',
    label: 'Overdue reminder after the end',
    unit: 'min',
    integer: true,
    defaultValue: 30,
    justification: 'Lab practice: a test running a little late is not nagged; gear still out after this gets one reminder.',
  },
];
