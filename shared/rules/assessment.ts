// The setup assessment: what a planned test with a set of gear means in volts, joules, seconds and
// metres, and whether a safety officer must approve it. Pure: the app runs it as the member types;
// the server runs the same code and stores the result with the booking.
import {
  approachBoundaries,
  classifyHazardousLive,
  dischargePlan,
  HvInputError,
  multiplierOutput,
  ratingMargin,
  storedEnergyJ as capacitorEnergyJ,
} from '../hv';
import type { AssessedItem, Assessment, ItemCheck, QualificationState, Reason } from '../schemas/assessment';
import type { LabRules, TestPlan } from '../schemas/bookings';
import type { ItemKind, Polarity } from '../schemas/items';
import { polarityProblem } from './polarity';

const num = (value: unknown): number | null => (typeof value === 'number' && Number.isFinite(value) ? value : null);

function qualificationReason(plannedKv: number, qualification: QualificationState | null, today: string): Reason | null {
  if (!qualification) return { code: 'qualification', message: 'No HV qualification is on record for this person.' };
  if (qualification.expiresOn < today) return { code: 'qualification', message: `The HV qualification expired on ${qualification.expiresOn}.` };
  if (qualification.authorisedKv < plannedKv) {
    return { code: 'qualification', message: `Authorised up to ${qualification.authorisedKv} kV; the plan is ${plannedKv} kV.` };
  }
  return null;
}

export function assessSetup(input: {
  items: AssessedItem[];
  plan: TestPlan;
  rules: LabRules;
  qualification: QualificationState | null;
  today: string;
}): Assessment {
  const { items, plan, rules, today } = input;
  const plannedV = plan.plannedKv * 1000;
  // One comparison for every rating in the set, with the margin and tolerance of shared/hv.
  const marginFor = (ratedKv: number) => ratingMargin({ ratedKv, plannedKv: plan.plannedKv, marginPct: rules.ratingMarginPct });
  const requiredKv = marginFor(0).requiredKv;
  const cautions: string[] = [];

  const itemChecks: ItemCheck[] = items.map((item) => {
    const notes: string[] = [];
    let ratingOk = true;
    let marginKv: number | null = null;
    if (item.ratedKv === null) {
      notes.push('No voltage rating: keep it out of the high-voltage circuit.');
    } else {
      const margin = marginFor(item.ratedKv);
      ratingOk = margin.ok;
      marginKv = margin.marginKv;
      if (!margin.ok)
        notes.push(`Rated ${item.ratedKv} kV; the plan needs at least ${margin.requiredKv.toFixed(1)} kV with the lab's ${rules.ratingMarginPct} % margin.`);
    }
    const inService = item.status === 'in-service';
    if (!inService) notes.push(item.status === 'retired' ? 'Retired.' : 'Tagged out of service.');
    const inspectionCurrent = item.inspectionState === 'current' || item.inspectionState === 'due-soon';
    if (!inspectionCurrent) notes.push(item.inspectionState === 'never' ? 'Never inspected.' : 'Inspection overdue.');
    return {
      itemId: item.id,
      tag: item.tag,
      name: item.name,
      kind: item.kind,
      ratedKv: item.ratedKv,
      requiredKv,
      marginKv,
      ratingOk,
      inService,
      inspectionCurrent,
      notes,
    };
  });

  // Companions the set must carry, rated for the plan with the margin.
  const ratedFor = (kind: ItemKind) => items.some((i) => i.kind === kind && i.ratedKv !== null && marginFor(i.ratedKv).ok);
  const missingCompanions: Reason[] = [];
  if (!ratedFor('grounding-stick'))
    missingCompanions.push({ code: 'grounding-stick', message: `Add a grounding stick rated for at least ${requiredKv.toFixed(1)} kV.` });
  if (!ratedFor('isolation-stand'))
    missingCompanions.push({ code: 'isolation-stand', message: `Add an isolation stand rated for at least ${requiredKv.toFixed(1)} kV.` });
  if (plan.plannedKv > rules.interlockKv && !ratedFor('interlock')) {
    missingCompanions.push({
      code: 'interlock',
      message: `Above ${rules.interlockKv} kV the lab requires an interlocked enclosure or barrier rated for at least ${requiredKv.toFixed(1)} kV.`,
    });
  }

  const polaritySources = items
    .filter((i) => i.kind === 'hv-supply' || i.kind === 'multiplier')
    .map((i) => ({ tag: i.tag, polarity: typeof i.ratings.polarity === 'string' ? (i.ratings.polarity as Polarity) : null }));
  const polarity = polarityProblem(plan.polarity, polaritySources);

  // Stored energy and output capacitance of the sources at the planned voltage.
  let storedEnergyJ = 0;
  let outputCapacitanceF = 0;
  let availableA = plan.maxCurrentMa / 1000;
  let sourcePeakKv = plan.plannedKv;
  const bleedersOhm: number[] = [];
  let sourceWithoutBleeder = false;
  const multipliers: Assessment['multipliers'] = [];
  for (const item of items) {
    const r = item.ratings;
    if (item.kind === 'hv-supply') {
      const c = (num(r.outputCapacitanceNf) ?? 0) * 1e-9;
      storedEnergyJ += capacitorEnergyJ({ capacitanceF: c, voltageV: plannedV });
      outputCapacitanceF += c;
      availableA = Math.max(availableA, (num(r.maxMa) ?? 0) / 1000);
      sourcePeakKv = Math.max(sourcePeakKv, num(r.maxKv) ?? 0);
      const bleeder = num(r.bleederMohm);
      if (bleeder) bleedersOhm.push(bleeder * 1e6);
      else sourceWithoutBleeder = true;
    }
    if (item.kind === 'multiplier') {
      const stages = num(r.stages) ?? 1;
      const stageC = (num(r.stageCapacitanceNf) ?? 0) * 1e-9;
      const frequency = num(r.driveFrequencyHz) ?? 0;
      sourcePeakKv = Math.max(sourcePeakKv, num(r.maxOutputKv) ?? 0);
      availableA = Math.max(availableA, (num(r.maxMa) ?? 0) / 1000);
      sourceWithoutBleeder = true; // a bare stack bleeds only through its load; ground it
      if (stageC > 0 && frequency > 0) {
        const drivePeakInputV = plannedV / (2 * stages);
        const out = multiplierOutput({
          stages,
          peakInputV: drivePeakInputV,
          frequencyHz: frequency,
          stageCapacitanceF: stageC,
          loadCurrentA: plan.maxCurrentMa / 1000,
        });
        storedEnergyJ += out.stackEnergyJ;
        outputCapacitanceF += out.outputCapacitanceF;
        multipliers.push({
          itemId: item.id,
          tag: item.tag,
          stages,
          drivePeakInputV,
          noLoadV: out.noLoadV,
          dropV: out.dropV,
          rippleV: out.rippleV,
          loadedV: out.loadedV,
          optimumStages: out.optimumStages,
          overRating: drivePeakInputV > (num(r.maxInputKvPeak) ?? Infinity) * 1000,
        });
      }
    }
  }

  const hazardRaw = classifyHazardousLive({ voltageV: plannedV, currentA: availableA, capacitanceF: outputCapacitanceF });
  const hazard = { hazardous: hazardRaw.hazardous, criterion: hazardRaw.criterion, explanation: hazardRaw.explanation, source: hazardRaw.source };

  let bleedDown: Assessment['bleedDown'] = null;
  let bleedDownNote: string;
  if (outputCapacitanceF === 0) {
    bleedDownNote = 'No source capacitance in the set; still ground every terminal before touching it.';
  } else if (bleedersOhm.length === 0 || sourceWithoutBleeder) {
    bleedDownNote = 'Part of the set has no bleeder: after switching off, ground the output with the grounding stick and leave it attached.';
  } else if (plannedV <= rules.safeResidualV) {
    bleedDownNote = `The plan is at or below the lab's safe residual voltage (${rules.safeResidualV} V).`;
  } else {
    const resistanceOhm = 1 / bleedersOhm.reduce((sum, r) => sum + 1 / r, 0);
    const d = dischargePlan({ resistanceOhm, capacitanceF: outputCapacitanceF, initialV: plannedV, safeV: rules.safeResidualV });
    bleedDown = {
      resistanceOhm,
      timeS: d.timeS,
      timeConstants: d.timeConstants,
      residualAfter5TauV: d.residualAfter5TauV,
      fiveTauIsEnough: d.fiveTauIsEnough,
      note: d.note,
      source: d.source,
    };
    bleedDownNote = `Through the bleeder the output falls below ${rules.safeResidualV} V in ${d.timeS.toFixed(1)} s. Ground it anyway before touching.`;
  }

  let boundaries: Assessment['boundaries'] = null;
  try {
    const b = approachBoundaries({ voltageV: sourcePeakKv * 1000, system: 'dc' });
    boundaries = {
      limitedMovableM: b.limitedMovableM,
      limitedFixedM: b.limitedFixedM,
      restrictedM: b.restrictedM,
      limitedMovableImperial: b.limitedMovableImperial,
      limitedFixedImperial: b.limitedFixedImperial,
      restrictedImperial: b.restrictedImperial,
      rowLabel: b.rowLabel,
      edition: b.edition,
      marker: b.marker,
      source: b.source,
    };
  } catch (error) {
    if (!(error instanceof HvInputError)) throw error;
    cautions.push('The source voltage is beyond the approach-boundary table: set up the bay with the lab’s licensed HV engineer.');
  }

  const approvalReasons: Reason[] = [];
  if (plan.plannedKv > rules.approvalKv)
    approvalReasons.push({ code: 'planned-kv', message: `The plan (${plan.plannedKv} kV) is above the lab's approval voltage (${rules.approvalKv} kV).` });
  if (storedEnergyJ > rules.energyThresholdJ) {
    approvalReasons.push({
      code: 'stored-energy',
      message: `Stored energy ${storedEnergyJ.toFixed(3)} J is above the lab's threshold (${rules.energyThresholdJ} J).`,
    });
  }
  const qualification = qualificationReason(plan.plannedKv, input.qualification, today);
  if (qualification) approvalReasons.push(qualification);

  if (hazard.hazardous) cautions.push('Hazardous live: treat every ungrounded terminal as energised and ground it before touching.');
  if (sourcePeakKv > plan.plannedKv) cautions.push(`Barriers follow the highest voltage the sources can reach (${sourcePeakKv} kV), not the setpoint.`);
  if (bleedDown && !bleedDown.fiveTauIsEnough)
    cautions.push('Waiting five time constants is not enough at this voltage; wait the computed bleed-down time and then ground.');
  if (plan.peoplePresent < 2 && plan.plannedKv > 1) cautions.push('Do not work alone on a high-voltage test: a second person should be present.');

  return {
    plannedKv: plan.plannedKv,
    sourcePeakKv,
    requiredKv,
    items: itemChecks,
    missingCompanions,
    polarity,
    storedEnergyJ,
    outputCapacitanceF,
    hazard,
    bleedDown,
    bleedDownNote,
    boundaries,
    multipliers,
    approvalRequired: approvalReasons.length > 0,
    approvalReasons,
    cautions,
  };
}

/** Words every screen that plans or releases a test shows. */
export const SAFETY_CAUTION =
  'These numbers support, and never replace, your lab’s licensed practice and local codes. De-energise, discharge and ground before touching; keep unqualified people outside the limited approach boundary.';
