// The release and return rules. The server runs them inside the release (or return) transaction
// on the rows it has locked and refuses with every failed rule; the app runs the same code to show
// the member what still stands in the way.
import { basisChanges, type ApprovalBasis } from './approval-basis';
import type { Assessment, Reason } from '../schemas/assessment';
import { checklistCoverage } from './checklist-coverage';
import { PRE_RELEASE_STATUSES, type BookingStatus, type ChecklistAnswerRecord, type ChecklistEntry } from '../schemas/bookings';
import type { RuleFailure } from '../errors';
import { zonedTimeWords } from '../zoned-time';

export const RELEASE_RULES = {
  status: 'The booking is not in a state that can be released.',
  booker: 'The person who booked must have an active account.',
  approval: 'A safety officer must approve this test plan first.',
  window: 'It is not yet time, or the booking window has ended.',
  clash: 'Another booking holds some of this gear in the same window.',
  scanned: 'Scan every item at the counter.',
  'in-service': 'Every item must be in service.',
  inspection: 'Every item must have a current inspection.',
  rating: 'Every item must be rated for the planned voltage with the lab margin.',
  'grounding-stick': 'A grounding stick rated for the planned voltage must be in the set.',
  'isolation-stand': 'An isolation stand rated for the planned voltage must be in the set.',
  interlock: 'An interlock rated for the planned voltage must be in the set above the lab interlock voltage.',
  polarity: 'A source in the set must produce the planned polarity.',
  checklist: 'Complete the pre-energize checklist with every reading inside its limits.',
  qualification: 'The member must be qualified for the planned voltage, or the test approved by an officer.',
} as const;
export type ReleaseRule = keyof typeof RELEASE_RULES;

export const RETURN_RULES = {
  status: 'Only released gear can be returned.',
  'make-safe-checklist': 'Complete the make-safe checklist with every reading inside its limits.',
} as const;
export type ReturnRule = keyof typeof RETURN_RULES;

/** The latest officer decision on a booking, as stored. */
export interface ApprovalRecord {
  decision: 'approve' | 'refuse';
  planVersion: number;
  voided: boolean;
  /** What the officer reviewed; null for decisions recorded before approvals kept it. */
  basis: ApprovalBasis | null;
}

export interface CompletedChecklist {
  planVersion: number;
  answers: readonly ChecklistAnswerRecord[];
}

/** Whether an approval covers the booking as it stands, and if not, what changed since. */
export function approvalStanding(approval: ApprovalRecord | null, planVersion: number, basis: ApprovalBasis): { current: boolean; changes: string[] } {
  if (!approval || approval.decision !== 'approve' || approval.voided || approval.planVersion !== planVersion) return { current: false, changes: [] };
  if (!approval.basis) return { current: false, changes: ['The approval does not record what it was based on: ask an officer to review the plan again.'] };
  const changes = basisChanges(approval.basis, basis);
  return { current: changes.length === 0, changes };
}

export interface ReleaseContext {
  status: BookingStatus;
  bookerActive: boolean;
  now: Date;
  startsAt: Date;
  endsAt: Date;
  earlyPickupMin: number;
  planVersion: number;
  scannedItemIds: readonly number[];
  /** Recomputed from the gear, the person and the lab's rules as they are now. */
  assessment: Assessment;
  /** The booking now, in the form an approval records. */
  basis: ApprovalBasis;
  approval: ApprovalRecord | null;
  /** The pre-energize lines that apply to the booking now. */
  checklistEntries: readonly ChecklistEntry[];
  /** The latest pre-energize run for the current plan version. */
  checklist: CompletedChecklist | null;
  /** Tags of this booking's gear that another live booking holds in an overlapping window. */
  clashingTags: readonly string[];
  /** The lab's clock (IANA name) the window's times are worded on; UTC, so named, when not given. */
  timeZone?: string;
}

/**
 * The rules the gear itself fails for this plan: nothing done at the counter, by an officer or by
 * the clock can make them hold; only other gear, another window or another plan. The booking form
 * shows them before "Request booking" and the booking page instead of "Go to release".
 */
export function gearFailures(a: Assessment, clashingTags: readonly string[]): RuleFailure<ReleaseRule>[] {
  const failures: RuleFailure<ReleaseRule>[] = [];
  const fail = (rule: ReleaseRule, detail: string) => failures.push({ rule, message: `${RELEASE_RULES[rule]} ${detail}` });
  if (clashingTags.length > 0) fail('clash', `Held elsewhere: ${clashingTags.join(', ')}.`);
  const outOfService = a.items.filter((i) => !i.inService).map((i) => i.tag);
  if (outOfService.length > 0) fail('in-service', `Out of service: ${outOfService.join(', ')}.`);
  const notInspected = a.items.filter((i) => !i.inspectionCurrent).map((i) => i.tag);
  if (notInspected.length > 0) fail('inspection', `Inspection not current: ${notInspected.join(', ')}.`);
  const underRated = a.items.filter((i) => !i.ratingOk).map((i) => `${i.tag} (${i.ratedKv ?? 'no'} kV)`);
  if (underRated.length > 0) fail('rating', `Under-rated: ${underRated.join(', ')}; required ${a.requiredKv.toFixed(1)} kV.`);
  for (const companion of a.missingCompanions) failures.push({ rule: companion.code as ReleaseRule, message: companion.message });
  if (a.polarity) failures.push({ rule: 'polarity', message: a.polarity.message });
  return failures;
}

/** The rules gearFailures checks: a release-check failure on one of these means the booking must change first. */
export const GEAR_RULES: readonly ReleaseRule[] = [
  'clash',
  'in-service',
  'inspection',
  'rating',
  'grounding-stick',
  'isolation-stand',
  'interlock',
  'polarity',
];

export function releaseFailures(ctx: ReleaseContext): RuleFailure<ReleaseRule>[] {
  const failures: RuleFailure<ReleaseRule>[] = [];
  const fail = (rule: ReleaseRule, detail?: string) => failures.push({ rule, message: detail ? `${RELEASE_RULES[rule]} ${detail}` : RELEASE_RULES[rule] });
  const a = ctx.assessment;

  if (!PRE_RELEASE_STATUSES.includes(ctx.status)) fail('status', `It is ${ctx.status}.`);
  if (!ctx.bookerActive) fail('booker', 'The account was deactivated.');
  const standing = approvalStanding(ctx.approval, ctx.planVersion, ctx.basis);
  if (a.approvalRequired && !standing.current) {
    const changed = standing.changes.length > 0 ? ` Changed since the approval: ${standing.changes.join(' ')}` : '';
    fail('approval', `${a.approvalReasons.map((r: Reason) => r.message).join(' ')}${changed}`);
  }
  const opensAt = ctx.startsAt.getTime() - ctx.earlyPickupMin * 60_000;
  const zone = ctx.timeZone ?? 'UTC';
  if (ctx.now.getTime() < opensAt) fail('window', `Release opens at ${zonedTimeWords(new Date(opensAt), zone)}.`);
  else if (ctx.now.getTime() >= ctx.endsAt.getTime()) fail('window', `The booking ended at ${zonedTimeWords(ctx.endsAt, zone)}.`);
  const missing = a.items.filter((i) => !ctx.scannedItemIds.includes(i.itemId)).map((i) => i.tag);
  // In the order the counter meets them: held elsewhere, scans, then the gear's own state.
  const gear = gearFailures(a, ctx.clashingTags);
  failures.push(...gear.filter((f) => f.rule === 'clash'));
  if (missing.length > 0) fail('scanned', `Not scanned: ${missing.join(', ')}.`);
  failures.push(...gear.filter((f) => f.rule !== 'clash'));

  if (!ctx.checklist || ctx.checklist.planVersion !== ctx.planVersion) fail('checklist', 'Not completed for the current plan.');
  else {
    const coverage = checklistCoverage(ctx.checklistEntries, ctx.checklist.answers);
    if (!coverage.complete || !coverage.withinLimits) fail('checklist', coverage.gaps.join(' '));
  }
  const qualification = a.approvalReasons.find((r) => r.code === 'qualification');
  if (qualification && !standing.current) fail('qualification', qualification.message);
  return failures;
}

export interface ReturnContext {
  status: BookingStatus;
  /** The make-safe lines that apply to the booking now. */
  checklistEntries: readonly ChecklistEntry[];
  /** The latest make-safe run for the current plan version. */
  checklist: CompletedChecklist | null;
  planVersion: number;
}

export function returnFailures(ctx: ReturnContext): RuleFailure<ReturnRule>[] {
  if (ctx.status !== 'released') return [{ rule: 'status', message: `${RETURN_RULES.status} This booking is ${ctx.status}.` }];
  if (!ctx.checklist || ctx.checklist.planVersion !== ctx.planVersion)
    return [{ rule: 'make-safe-checklist', message: 'Complete the make-safe checklist first.' }];
  const coverage = checklistCoverage(ctx.checklistEntries, ctx.checklist.answers);
  if (coverage.complete && coverage.withinLimits) return [];
  const detail = coverage.withinLimits ? '' : ' Ground the output again and measure.';
  return [{ rule: 'make-safe-checklist', message: `${coverage.gaps.join(' ')}${detail}` }];
}
