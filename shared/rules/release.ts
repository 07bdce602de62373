// The release rules. The server runs them inside the release transaction and refuses with every
// failed rule; the app runs the same code to show the member what still stands in the way.
import type { Assessment, Reason } from './assessment';
import type { BookingStatus } from '../schemas/bookings';

export const RELEASE_RULES = {
  status: 'The booking is not in a state that can be released.',
  approval: 'A safety officer must approve this test plan first.',
  window: 'It is not yet time, or the booking window has ended.',
  scanned: 'Scan every item at the counter.',
  'in-service': 'Every item must be in service.',
  inspection: 'Every item must have a current inspection.',
  rating: 'Every item must be rated for the planned voltage with the lab margin.',
  'grounding-stick': 'A grounding stick rated for the planned voltage must be in the set.',
  'isolation-stand': 'An isolation stand rated for the planned voltage must be in the set.',
  interlock: 'An interlock rated for the planned voltage must be in the set above the lab interlock voltage.',
  checklist: 'Complete the pre-energize checklist with every reading inside its limits.',
  qualification: 'The member must be qualified for the planned voltage, or the test approved by an officer.',
} as const;
export type ReleaseRule = keyof typeof RELEASE_RULES;

export interface ReleaseContext {
  status: BookingStatus;
  approvalRequired: boolean;
  /** An approval that is not voided and was given for the booking's current plan version. */
  approvalCurrent: boolean;
  now: Date;
  startsAt: Date;
  endsAt: Date;
  earlyPickupMin: number;
  itemIds: number[];
  scannedItemIds: number[];
  assessment: Assessment;
  /** The latest pre-energize checklist run for the current plan version. */
  checklist: { complete: boolean; withinLimits: boolean } | null;
}

export function releaseFailures(ctx: ReleaseContext): { rule: ReleaseRule; message: string }[] {
  const failures: { rule: ReleaseRule; message: string }[] = [];
  const fail = (rule: ReleaseRule, detail?: string) => failures.push({ rule, message: detail ? `${RELEASE_RULES[rule]} ${detail}` : RELEASE_RULES[rule] });
  const a = ctx.assessment;

  if (!['requested', 'approved', 'awaiting-approval'].includes(ctx.status)) fail('status', `It is ${ctx.status}.`);
  if (ctx.approvalRequired && !ctx.approvalCurrent) {
    fail('approval', a.approvalReasons.map((r: Reason) => r.message).join(' '));
  }
  const opensAt = ctx.startsAt.getTime() - ctx.earlyPickupMin * 60_000;
  if (ctx.now.getTime() < opensAt) fail('window', `Release opens at ${new Date(opensAt).toISOString()}.`);
  else if (ctx.now.getTime() >= ctx.endsAt.getTime()) fail('window', `The booking ended at ${ctx.endsAt.toISOString()}.`);

  const missing = a.items.filter((i) => !ctx.scannedItemIds.includes(i.itemId)).map((i) => i.tag);
  if (missing.length > 0) fail('scanned', `Not scanned: ${missing.join(', ')}.`);
  const outOfService = a.items.filter((i) => !i.inService).map((i) => i.tag);
  if (outOfService.length > 0) fail('in-service', `Out of service: ${outOfService.join(', ')}.`);
  const notInspected = a.items.filter((i) => !i.inspectionCurrent).map((i) => i.tag);
  if (notInspected.length > 0) fail('inspection', `Inspection not current: ${notInspected.join(', ')}.`);
  const underRated = a.items.filter((i) => !i.ratingOk).map((i) => `${i.tag} (${i.ratedKv} kV)`);
  if (underRated.length > 0) fail('rating', `Under-rated: ${underRated.join(', ')}; required ${a.requiredKv.toFixed(1)} kV.`);
  for (const companion of a.missingCompanions) {
    fail(companion.code as ReleaseRule, companion.message);
  }
  if (!ctx.checklist || !ctx.checklist.complete) fail('checklist', 'Not completed for the current plan.');
  else if (!ctx.checklist.withinLimits) fail('checklist', 'A reading is outside its limits.');
  const qualification = a.approvalReasons.find((r) => r.code === 'qualification');
  if (qualification && !ctx.approvalCurrent) fail('qualification', qualification.message);
  return failures;
}
