// A change of the lab's rules made by an officer does not apply to that officer's own tests until
// another officer confirms it: until then, their bookings are assessed under whichever of the
// confirmed and the new rules is stricter, field by field. (Chosen over "never": a confirmed
// change should reach everyone, and a second officer's confirmation is the usual two-person check.)
import type { LabRules } from '../schemas/bookings';

/** The stricter of two rule sets, field by field. */
export function strictestRules(a: LabRules, b: LabRules): LabRules {
  return {
    approvalKv: Math.min(a.approvalKv, b.approvalKv),
    energyThresholdJ: Math.min(a.energyThresholdJ, b.energyThresholdJ),
    ratingMarginPct: Math.max(a.ratingMarginPct, b.ratingMarginPct),
    interlockKv: Math.min(a.interlockKv, b.interlockKv),
    safeResidualV: Math.min(a.safeResidualV, b.safeResidualV),
    earlyPickupMin: Math.min(a.earlyPickupMin, b.earlyPickupMin),
    overdueGraceMin: Math.min(a.overdueGraceMin, b.overdueGraceMin),
  };
}

export interface LabRulesState {
  rules: LabRules;
  /** The rules as last confirmed by an officer who did not edit them since. */
  confirmed: LabRules;
  /** Officers who changed the rules since they were last confirmed. */
  pendingEditors: readonly number[];
}

/** The rules that apply to one person's bookings. */
export function rulesForPerson(state: LabRulesState, personId: number): LabRules {
  return state.pendingEditors.includes(personId) ? strictestRules(state.confirmed, state.rules) : state.rules;
}
