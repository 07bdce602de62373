// The release and return rules (shared/rules), one case per rule, per boundary and per
// combination that must refuse. Pure: the same functions run in the release transaction and in the app.
import { approvalBasisOf, basisChanges, type ApprovalBasis } from '../../../shared/rules/approval-basis';
import { assessSetup } from '../../../shared/rules/assessment';
import type { AssessedItem } from '../../../shared/schemas/assessment';
import { bookingWindowErrors, BOOKING_WINDOW } from '../../../shared/rules/booking-window';
import { checklistCoverage } from '../../../shared/rules/checklist-coverage';
import { rulesForPerson, strictestRules } from '../../../shared/rules/lab-rules';
import { releaseFailures, returnFailures, type ReleaseContext } from '../../../shared/rules/release';
import {
  bookingCreateSchema,
  labRulesSchema,
  testPlanSchema,
  type ChecklistAnswerRecord,
  type ChecklistEntry,
  type LabRules,
  type TestPlan,
} from '../../../shared/schemas/bookings';

const RULES: LabRules = {
  approvalKv: 15,
  energyThresholdJ: 0.35,
  ratingMarginPct: 10,
  interlockKv: 1.5,
  safeResidualV: 50,
  earlyPickupMin: 15,
  overdueGraceMin: 30,
};
const TODAY = '2026-12-03';
const qualified = { authorisedKv: 100, expiresOn: '2027-12-31' };

function item(
  id: number,
  kind: AssessedItem['kind'],
  ratedKv: number | null,
  ratings: Record<string, unknown> = {},
  extra: Partial<AssessedItem> = {},
): AssessedItem {
  return { id, tag: `KH-${id}`, name: `Item ${id}`, kind, ratedKv, ratings, status: 'in-service', inspectionState: 'current', ...extra };
}

/** A complete set for a 10 kV plan: stick, stand and interlock rated 100 kV, a 30 kV supply of 1 nF. */
function kit(overrides: Partial<Record<'supply' | 'stick' | 'stand' | 'interlock', Partial<AssessedItem>>> = {}): AssessedItem[] {
  return [
    { ...item(1, 'hv-supply', 30, { maxKv: 30, maxMa: 2, outputCapacitanceNf: 1, bleederMohm: 300 }), ...overrides.supply },
    { ...item(2, 'grounding-stick', 100), ...overrides.stick },
    { ...item(3, 'isolation-stand', 100), ...overrides.stand },
    { ...item(4, 'interlock', 100), ...overrides.interlock },
  ];
}

const PLAN: TestPlan = { plannedKv: 10, polarity: 'negative', maxCurrentMa: 1, peoplePresent: 2 };
const start = new Date('2026-12-03T10:00:00Z');
const end = new Date('2026-12-03T12:00:00Z');
const PRE: ChecklistEntry[] = [
  { id: 11, kind: 'confirm', text: 'Interlock tested', required: true },
  { id: 12, kind: 'reading', text: 'Bleeder resistance', unit: 'MΩ', min: 10, max: 2000, required: true },
];
const answered = (entries: ChecklistEntry[], values: Record<number, number> = {}): ChecklistAnswerRecord[] =>
  entries.map((e) => ({
    id: e.id,
    kind: e.kind,
    text: e.text,
    unit: e.unit,
    min: e.min,
    max: e.max,
    required: e.required,
    confirmed: e.kind === 'confirm' ? true : undefined,
    value: e.kind === 'reading' ? (values[e.id] ?? 100) : undefined,
    withinLimits: true,
  }));

function basisFor(
  items: AssessedItem[],
  plan = PLAN,
  details: Partial<{ location: string; purpose: string; startsAt: string; endsAt: string }> = {},
): ApprovalBasis {
  const assessment = assessSetup({ items, plan, rules: RULES, qualification: qualified, today: TODAY });
  return approvalBasisOf(
    { plan, startsAt: start.toISOString(), endsAt: end.toISOString(), location: 'Bay 1', purpose: 'Corona sweep', ...details },
    items,
    assessment,
  );
}

/** A context in which every rule holds; each case changes one thing. */
function context(
  overrides: Partial<ReleaseContext> & { items?: AssessedItem[]; plan?: TestPlan; rules?: LabRules; qualification?: typeof qualified | null } = {},
): ReleaseContext {
  const items = overrides.items ?? kit();
  const plan = overrides.plan ?? PLAN;
  const assessment = assessSetup({
    items,
    plan,
    rules: overrides.rules ?? RULES,
    qualification: overrides.qualification === undefined ? qualified : overrides.qualification,
    today: TODAY,
  });
  const basis = basisFor(items, plan);
  return {
    status: 'requested',
    bookerActive: true,
    now: new Date('2026-12-03T10:05:00Z'),
    startsAt: start,
    endsAt: end,
    earlyPickupMin: 15,
    planVersion: 1,
    scannedItemIds: items.map((i) => i.id),
    assessment,
    basis,
    approval: null,
    checklistEntries: PRE,
    checklist: { planVersion: 1, answers: answered(PRE) },
    clashingTags: [],
    ...overrides,
  };
}
const rulesOf = (ctx: ReleaseContext) => releaseFailures(ctx).map((f) => f.rule);

describe('releaseFailures', () => {
  it('passes a complete, scanned, checked set under the approval voltage', () => {
    expect(releaseFailures(context())).toEqual([]);
  });

  it.each(['released', 'returned', 'cancelled', 'refused'] as const)('rule "status": a %s booking is refused', (status) => {
    expect(rulesOf(context({ status }))).toEqual(['status']);
  });

  it('rule "booker": a deactivated booker', () => {
    expect(rulesOf(context({ bookerActive: false }))).toEqual(['booker']);
  });

  describe('rule "window" (early pick-up 15 min)', () => {
    it.each([
      ['15 min before the start: open', '2026-12-03T09:45:00Z', []],
      ['15 min 1 ms before the start: not yet', '2026-12-03T09:44:59.999Z', ['window']],
      ['1 ms before the end: open', '2026-12-03T11:59:59.999Z', []],
      ['at the end: closed', '2026-12-03T12:00:00Z', ['window']],
    ])('%s', (_case, now, expected) => {
      expect(rulesOf(context({ now: new Date(now as string) }))).toEqual(expected);
    });
  });

  it('rule "clash": another live booking holds an item in the window', () => {
    const failures = releaseFailures(context({ clashingTags: ['KH-2'] }));
    expect(failures.map((f) => f.rule)).toEqual(['clash']);
    expect(failures[0]!.message).toContain('KH-2');
  });

  it('rule "scanned": one item not scanned', () => {
    expect(rulesOf(context({ scannedItemIds: [1, 2, 3] }))).toEqual(['scanned']);
  });

  it('rule "in-service" and "inspection"', () => {
    expect(rulesOf(context({ items: kit({ stand: { status: 'out-of-service' } }) }))).toEqual(['in-service']);
    expect(rulesOf(context({ items: kit({ stand: { inspectionState: 'overdue' } }) }))).toEqual(['inspection']);
    expect(rulesOf(context({ items: kit({ stand: { inspectionState: 'never' } }) }))).toEqual(['inspection']);
    // Due soon is still current (the inspection has not lapsed).
    expect(rulesOf(context({ items: kit({ stand: { inspectionState: 'due-soon' } }) }))).toEqual([]);
  });

  // 10 kV with the lab's 10 % margin needs 11 kV (ratingMargin, shared/hv): exactly 11 passes.
  describe('rule "rating" at the margin (plan 10 kV, margin 10 %: 11 kV required)', () => {
    it.each([
      ['exactly at the margin', 11, []],
      ['just over', 11.01, []],
      ['just under', 10.99, ['rating']],
    ])('a probe rated %s', (_case, ratedKv, expected) => {
      const items = [...kit(), item(5, 'probe', ratedKv as number, { maxKv: ratedKv })];
      expect(rulesOf(context({ items }))).toEqual(expected);
    });
    // The same comparison decides whether a companion counts: a stick just under is missing.
    it.each([
      ['exactly at the margin', 11, []],
      ['just under', 10.99, ['rating', 'grounding-stick']],
    ])('a grounding stick rated %s', (_case, ratedKv, expected) => {
      expect(rulesOf(context({ items: kit({ stick: { ratedKv: ratedKv as number } }) }))).toEqual(expected);
    });
  });

  it('rules "grounding-stick", "isolation-stand" and "interlock": each companion missing', () => {
    const [supply, stick, stand, interlock] = kit();
    expect(rulesOf(context({ items: [supply!, stand!, interlock!], scannedItemIds: [1, 3, 4] }))).toEqual(['grounding-stick']);
    expect(rulesOf(context({ items: [supply!, stick!, interlock!], scannedItemIds: [1, 2, 4] }))).toEqual(['isolation-stand']);
    expect(rulesOf(context({ items: [supply!, stick!, stand!], scannedItemIds: [1, 2, 3] }))).toEqual(['interlock']);
  });

  it('rule "interlock" only above the lab interlock voltage (1.5 kV): at 1.5 kV none is needed', () => {
    const [supply, stick, stand] = kit();
    const plan = { ...PLAN, plannedKv: 1.5 };
    expect(rulesOf(context({ items: [supply!, stick!, stand!], plan, scannedItemIds: [1, 2, 3], basis: basisFor([supply!, stick!, stand!], plan) }))).toEqual(
      [],
    );
    const above = { ...PLAN, plannedKv: 1.51 };
    expect(
      rulesOf(context({ items: [supply!, stick!, stand!], plan: above, scannedItemIds: [1, 2, 3], basis: basisFor([supply!, stick!, stand!], above) })),
    ).toEqual(['interlock']);
  });

  describe('rule "checklist"', () => {
    it('no run, or a run for an earlier plan version', () => {
      expect(rulesOf(context({ checklist: null }))).toEqual(['checklist']);
      expect(rulesOf(context({ checklist: { planVersion: 1, answers: answered(PRE) }, planVersion: 2 }))).toEqual(['checklist']);
    });
    it('a reading outside its limits names the line, the value and the limits', () => {
      const failures = releaseFailures(context({ checklist: { planVersion: 1, answers: answered(PRE, { 12: 5 }) } }));
      expect(failures.map((f) => f.rule)).toEqual(['checklist']);
      expect(failures[0]!.message).toContain('Bleeder resistance');
      expect(failures[0]!.message).toContain('5 MΩ');
      expect(failures[0]!.message).toContain('10 to 2000 MΩ');
    });
    it.each([
      ['at the lower limit', 10, []],
      ['at the upper limit', 2000, []],
      ['just below the lower limit', 9.999, ['checklist']],
    ])('a reading %s', (_case, value, expected) => {
      expect(rulesOf(context({ checklist: { planVersion: 1, answers: answered(PRE, { 12: value as number }) } }))).toEqual(expected);
    });
    it('a line added after the run makes it incomplete', () => {
      const added: ChecklistEntry = { id: 13, kind: 'confirm', text: 'Barrier at the approach distance', required: true };
      const failures = releaseFailures(context({ checklistEntries: [...PRE, added] }));
      expect(failures.map((f) => f.rule)).toEqual(['checklist']);
      expect(failures[0]!.message).toContain('Barrier at the approach distance');
    });
    it('a line reworded, re-limited or made required after the run makes it incomplete', () => {
      const reworded = [PRE[0]!, { ...PRE[1]!, text: 'Bleeder resistance, measured at the output' }];
      const relimited = [PRE[0]!, { ...PRE[1]!, min: 50 }];
      const optional: ChecklistEntry = { id: 14, kind: 'reading', text: 'Room humidity', unit: '%', required: false };
      const runWithOptional = { planVersion: 1, answers: [...answered(PRE), { ...answered([optional])[0]!, value: undefined }] };
      expect(rulesOf(context({ checklistEntries: reworded }))).toEqual(['checklist']);
      expect(rulesOf(context({ checklistEntries: relimited }))).toEqual(['checklist']);
      expect(rulesOf(context({ checklistEntries: [...PRE, optional], checklist: runWithOptional }))).toEqual([]);
      expect(rulesOf(context({ checklistEntries: [...PRE, { ...optional, required: true }], checklist: runWithOptional }))).toEqual(['checklist']);
    });
    it('a line retired after the run does not stop it', () => {
      expect(rulesOf(context({ checklistEntries: [PRE[0]!] }))).toEqual([]);
    });
  });

  describe('rules "approval" and "qualification"', () => {
    const high = { ...PLAN, plannedKv: 20 };
    const highItems = kit();
    const approvedAt = (basis: ApprovalBasis, planVersion = 1) => ({ decision: 'approve' as const, planVersion, voided: false, basis });

    it('above the approval voltage (15 kV) without a decision: refused; exactly at 15 kV: no approval needed', () => {
      expect(rulesOf(context({ plan: high, basis: basisFor(highItems, high) }))).toEqual(['approval']);
      const at = { ...PLAN, plannedKv: 15 };
      expect(rulesOf(context({ plan: at, basis: basisFor(highItems, at) }))).toEqual([]);
    });
    it('an approval of exactly this basis and version lets it through', () => {
      const basis = basisFor(highItems, high);
      expect(rulesOf(context({ plan: high, basis, approval: approvedAt(basis) }))).toEqual([]);
    });
    it.each([
      ['voided', (b: ApprovalBasis) => ({ ...approvedAt(b), voided: true })],
      ['for another plan version', (b: ApprovalBasis) => approvedAt(b, 2)],
      ['a refusal', (b: ApprovalBasis) => ({ ...approvedAt(b), decision: 'refuse' as const })],
      ['without a recorded basis', (b: ApprovalBasis) => ({ ...approvedAt(b), basis: null })],
    ])('an approval %s does not count', (_case, approval) => {
      const basis = basisFor(highItems, high);
      expect(rulesOf(context({ plan: high, basis, approval: approval(basis) }))).toEqual(['approval']);
    });
    it('a hundredfold output capacitance since the approval: refused, naming the stored energy', () => {
      const approved = basisFor(highItems, high);
      const bigger = kit({ supply: { ratings: { maxKv: 30, maxMa: 2, outputCapacitanceNf: 100, bleederMohm: 300 } } });
      const failures = releaseFailures(context({ plan: high, items: bigger, basis: basisFor(bigger, high), approval: approvedAt(approved) }));
      expect(failures.map((f) => f.rule)).toEqual(['approval']);
      expect(failures[0]!.message).toContain('Stored energy');
      expect(failures[0]!.message).toContain('KH-1: its ratings changed');
    });
    it('unqualified: both rules, and an approval covers both', () => {
      const basis = basisFor(kit());
      expect(rulesOf(context({ qualification: null }))).toEqual(['approval', 'qualification']);
      expect(rulesOf(context({ qualification: null, approval: approvedAt(basis) }))).toEqual([]);
    });
    it('several failures at once are all named', () => {
      const basis = basisFor(highItems, high);
      expect(
        rulesOf(context({ plan: high, basis, status: 'awaiting-approval', bookerActive: false, scannedItemIds: [], checklist: null, qualification: null })),
      ).toEqual(['booker', 'approval', 'scanned', 'checklist', 'qualification']);
    });
  });
});

describe('basisChanges', () => {
  const basis = basisFor(kit());
  it.each([
    ['plan voltage', basisFor(kit(), { ...PLAN, plannedKv: 12 }), 'Planned voltage 10 kV → 12 kV.'],
    ['people present', basisFor(kit(), { ...PLAN, peoplePresent: 1 }), 'People present 2 → 1.'],
    ['location', basisFor(kit(), PLAN, { location: 'Bay 3' }), 'Location “Bay 1” → “Bay 3”.'],
    ['purpose', basisFor(kit(), PLAN, { purpose: 'Other' }), 'The purpose changed.'],
    ['window', basisFor(kit(), PLAN, { endsAt: '2026-12-03T13:00:00.000Z' }), 'The booking window changed.'],
    ['gear', basisFor(kit().slice(0, 3)), 'Gear removed: KH-4.'],
  ])('names a change of %s', (_case, now, message) => {
    expect(basisChanges(basis, now)).toContain(message);
  });
  it('sees nothing when nothing changed, whatever the key order of the ratings', () => {
    const reordered = kit({ supply: { ratings: { bleederMohm: 300, outputCapacitanceNf: 1, maxMa: 2, maxKv: 30 } } });
    expect(basisChanges(basis, basisFor(reordered))).toEqual([]);
  });
});

describe('returnFailures', () => {
  const RETURN: ChecklistEntry[] = [{ id: 21, kind: 'reading', text: 'Residual voltage', unit: 'V', max: 50, required: true }];
  it('needs a released booking and a make-safe run inside the limits', () => {
    expect(
      returnFailures({ status: 'released', planVersion: 1, checklistEntries: RETURN, checklist: { planVersion: 1, answers: answered(RETURN, { 21: 50 }) } }),
    ).toEqual([]);
    expect(returnFailures({ status: 'approved', planVersion: 1, checklistEntries: RETURN, checklist: null }).map((f) => f.rule)).toEqual(['status']);
    expect(returnFailures({ status: 'released', planVersion: 1, checklistEntries: RETURN, checklist: null }).map((f) => f.rule)).toEqual([
      'make-safe-checklist',
    ]);
    const high = returnFailures({
      status: 'released',
      planVersion: 1,
      checklistEntries: RETURN,
      checklist: { planVersion: 1, answers: answered(RETURN, { 21: 50.1 }) },
    });
    expect(high.map((f) => f.rule)).toEqual(['make-safe-checklist']);
    expect(high[0]!.message).toContain('50.1 V');
  });
});

describe('checklistCoverage', () => {
  it('counts a run answered for exactly the lines in force', () => {
    expect(checklistCoverage(PRE, answered(PRE))).toEqual({ complete: true, withinLimits: true, gaps: [] });
  });
});

describe('booking window (shared by create and change)', () => {
  const now = new Date('2026-12-03T10:00:00Z');
  const at = (iso: string) => new Date(iso);
  it.each([
    ['a normal window', '2026-12-04T09:00:00Z', '2026-12-04T11:00:00Z', {}],
    ['exactly 14 days', '2026-12-04T09:00:00Z', '2026-12-18T09:00:00Z', {}],
    ['14 days and 1 ms', '2026-12-04T09:00:00Z', '2026-12-18T09:00:00.001Z', { endsAt: ['A booking can last at most 14 days'] }],
    ['an end in year 9999', '2026-12-04T09:00:00Z', '9999-12-31T00:00:00Z', { endsAt: ['A booking can last at most 14 days'] }],
    ['a start 10 minutes ago (counter slack)', '2026-12-03T09:50:00Z', '2026-12-03T11:00:00Z', {}],
    ['a start 11 minutes ago', '2026-12-03T09:49:00Z', '2026-12-03T11:00:00Z', { startsAt: ['Pick a start from now on'] }],
    ['a start past the horizon', '2027-12-04T10:00:00Z', '2027-12-04T11:00:00Z', { startsAt: [`Book at most ${BOOKING_WINDOW.horizonDays} days ahead`] }],
    ['an end before the start', '2026-12-04T11:00:00Z', '2026-12-04T10:00:00Z', { endsAt: ['The end must be after the start'] }],
  ])('%s', (_case, s, e, expected) => {
    expect(bookingWindowErrors(at(s as string), at(e as string), now)).toEqual(expected);
  });
});

describe('plan and rule precision (columns DECIMAL(7,2) kV, DECIMAL(10,3) mA)', () => {
  it('refuses more decimals than the column stores instead of rounding after assessing', () => {
    expect(testPlanSchema.safeParse({ ...PLAN, plannedKv: 15.004 }).success).toBe(false);
    expect(testPlanSchema.safeParse({ ...PLAN, plannedKv: 15.01 }).success).toBe(true);
    expect(testPlanSchema.safeParse({ ...PLAN, maxCurrentMa: 0.0015 }).success).toBe(false);
    expect(testPlanSchema.safeParse({ ...PLAN, maxCurrentMa: 0.015 }).success).toBe(true);
    expect(labRulesSchema.safeParse({ ...RULES, approvalKv: 15.004 }).success).toBe(false);
  });
  it('the create schema refuses a window longer than 14 days', () => {
    const body = { itemIds: [1], startsAt: '2026-12-04T09:00:00Z', endsAt: '9999-01-01T00:00:00Z', location: 'Bay 1', purpose: 'Sweep', plan: PLAN };
    expect(bookingCreateSchema.safeParse(body).success).toBe(false);
  });
});

describe('lab rules an officer changed apply to their own bookings only once another officer confirms', () => {
  const loosened: LabRules = { ...RULES, approvalKv: 50, energyThresholdJ: 10, ratingMarginPct: 0 };
  it('the editor gets the stricter of the confirmed and the new rules, field by field; others get the new ones', () => {
    const state = { rules: loosened, confirmed: RULES, pendingEditors: [7] };
    expect(rulesForPerson(state, 7)).toEqual(RULES);
    expect(rulesForPerson(state, 8)).toEqual(loosened);
    const tightened: LabRules = { ...RULES, approvalKv: 10 };
    expect(strictestRules(RULES, tightened)).toEqual(tightened);
  });
});
