// The polarity rule (shared/rules/polarity.ts) and how it reaches the assessment and the gate.
// Expected values are common practice, no source: a DC supply or multiplier stack built for one
// polarity produces only that polarity (its rectifier diodes face one way); one sold as
// "reversible" produces either.
import { assessSetup } from '../../../shared/rules/assessment';
import type { AssessedItem } from '../../../shared/schemas/assessment';
import { polarityProblem } from '../../../shared/rules/polarity';
import { gearFailures, releaseFailures } from '../../../shared/rules/release';
import type { LabRules, TestPlan } from '../../../shared/schemas/bookings';
import type { Polarity } from '../../../shared/schemas/items';
import { zonedTimeWords } from '../../../shared/zoned-time';

const RULES: LabRules = {
  approvalKv: 15,
  energyThresholdJ: 0.35,
  ratingMarginPct: 10,
  interlockKv: 1.5,
  safeResidualV: 50,
  earlyPickupMin: 15,
  overdueGraceMin: 30,
};
const item = (id: number, kind: AssessedItem['kind'], ratedKv: number, ratings: Record<string, unknown> = {}): AssessedItem => ({
  id,
  tag: `KH-${id}`,
  name: `Item ${id}`,
  kind,
  ratedKv,
  ratings,
  status: 'in-service',
  inspectionState: 'current',
});
const set = (supplyPolarity: Polarity) => [
  item(1, 'hv-supply', 30, { maxKv: 30, maxMa: 2, polarity: supplyPolarity, outputCapacitanceNf: 1, bleederMohm: 300 }),
  item(2, 'grounding-stick', 100),
  item(3, 'isolation-stand', 100),
  item(4, 'interlock', 100),
];
const plan = (polarity: Polarity): TestPlan => ({ plannedKv: 10, polarity, maxCurrentMa: 1, peoplePresent: 2 });
const assess = (supply: Polarity, planned: Polarity) =>
  assessSetup({ items: set(supply), plan: plan(planned), rules: RULES, qualification: { authorisedKv: 100, expiresOn: '2027-12-31' }, today: '2026-12-03' });

describe('polarityProblem (common practice, no source)', () => {
  it.each([
    ['negative', 'positive', true],
    ['positive', 'negative', true],
    ['negative', 'negative', false],
    ['positive', 'positive', false],
    ['negative', 'reversible', false],
    ['positive', 'reversible', false],
    ['reversible', 'positive', true],
    ['reversible', 'reversible', false],
  ] as const)('a %s plan with a %s source fails: %s', (planned, source, fails) => {
    expect(polarityProblem(planned, [{ tag: 'SUP-1', polarity: source }]) !== null).toBe(fails);
  });

  it('a reversible plan is met by a positive and a negative source together', () => {
    expect(
      polarityProblem('reversible', [
        { tag: 'SUP-1', polarity: 'positive' },
        { tag: 'SUP-2', polarity: 'negative' },
      ]),
    ).toBeNull();
  });

  it('a set with no rated source (a probe and a stick only) has nothing to check', () => {
    expect(polarityProblem('negative', [])).toBeNull();
    expect(polarityProblem('negative', [{ tag: 'X', polarity: null }])).toBeNull();
  });

  it('names each source and what it can produce', () => {
    expect(polarityProblem('negative', [{ tag: 'SUP-0002', polarity: 'positive' }])?.message).toBe(
      'The plan needs negative polarity, but no source in the set can produce it: SUP-0002 (positive only). Add a negative or reversible source, or change the plan.',
    );
  });
});

describe('polarity in the assessment and the gate', () => {
  it('a negative plan with a positive-only supply fails the gear rules and the release', () => {
    const a = assess('positive', 'negative');
    expect(a.polarity?.code).toBe('polarity');
    expect(gearFailures(a, []).map((f) => f.rule)).toEqual(['polarity']);
    const failures = releaseFailures({
      status: 'approved',
      bookerActive: true,
      now: new Date('2026-12-03T10:05:00Z'),
      startsAt: new Date('2026-12-03T10:00:00Z'),
      endsAt: new Date('2026-12-03T12:00:00Z'),
      earlyPickupMin: 15,
      planVersion: 1,
      scannedItemIds: [1, 2, 3, 4],
      assessment: a,
      basis: {} as never,
      approval: null,
      checklistEntries: [],
      checklist: { planVersion: 1, answers: [] },
      clashingTags: [],
    });
    expect(failures.map((f) => f.rule)).toEqual(['polarity']);
    expect(failures[0]!.message).toMatch(/^The plan needs negative polarity/);
  });

  it('the same plan with a matching supply passes', () => {
    expect(assess('negative', 'negative').polarity).toBeNull();
    expect(gearFailures(assess('reversible', 'negative'), [])).toEqual([]);
  });

  it('gearFailures names clashes, inspections and ratings, each once', () => {
    const items = set('negative');
    items[0] = { ...items[0]!, inspectionState: 'overdue' };
    items[1] = { ...items[1]!, ratedKv: 5 };
    const a = assessSetup({ items, plan: plan('negative'), rules: RULES, qualification: null, today: '2026-12-03' });
    expect(gearFailures(a, ['KH-3']).map((f) => f.rule)).toEqual(['clash', 'inspection', 'rating', 'grounding-stick']);
  });
});

describe('zonedTimeWords', () => {
  // Europe/London is UTC+0 in December, Europe/Berlin UTC+1 (EU summer-time rules, Directive 2000/84/EC).
  it('writes the lab clock and names it, never a raw UTC timestamp', () => {
    expect(zonedTimeWords('2026-12-04T08:45:00.000Z', 'Europe/London')).toBe('08:45 on Fri 4 Dec 2026 (Europe/London time)');
    expect(zonedTimeWords('2026-12-04T08:45:00.000Z', 'Europe/Berlin')).toBe('09:45 on Fri 4 Dec 2026 (Europe/Berlin time)');
  });
  it('falls back to UTC, named, for a zone the engine does not know', () => {
    expect(zonedTimeWords('2026-12-04T08:45:00.000Z', 'Mars/Olympus')).toBe('08:45 on Fri 4 Dec 2026 (UTC time)');
  });
});
