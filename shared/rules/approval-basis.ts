// What an officer's approval covers. The approval stores this basis; any difference between it and
// the booking as it stands now means the officer never reviewed what would be released, so the
// approval no longer counts (the booking goes back to the officer, and release refuses).
import type { AssessedItem, Assessment } from '../schemas/assessment';
import type { ItemKind } from '../schemas/items';
import type { TestPlan } from '../schemas/bookings';
import { canonical } from '../canonical-json';

export interface ApprovalBasisItem {
  id: number;
  tag: string;
  kind: ItemKind;
  ratedKv: number | null;
  ratings: Record<string, unknown>;
}

export interface ApprovalBasis {
  plan: TestPlan;
  startsAt: string;
  endsAt: string;
  location: string;
  purpose: string;
  /** Sorted ascending. */
  itemIds: number[];
  figures: {
    storedEnergyJ: number;
    sourcePeakKv: number;
    outputCapacitanceF: number;
    hazardous: boolean;
    hazardCriterion: string;
    items: ApprovalBasisItem[];
  };
}

export interface BasisBooking {
  plan: TestPlan;
  startsAt: string;
  endsAt: string;
  location: string;
  purpose: string;
}

export function approvalBasisOf(booking: BasisBooking, items: readonly AssessedItem[], assessment: Assessment): ApprovalBasis {
  const sorted = [...items].sort((a, b) => a.id - b.id);
  return {
    plan: {
      plannedKv: booking.plan.plannedKv,
      polarity: booking.plan.polarity,
      maxCurrentMa: booking.plan.maxCurrentMa,
      peoplePresent: booking.plan.peoplePresent,
    },
    startsAt: new Date(booking.startsAt).toISOString(),
    endsAt: new Date(booking.endsAt).toISOString(),
    location: booking.location,
    purpose: booking.purpose,
    itemIds: sorted.map((i) => i.id),
    figures: {
      storedEnergyJ: assessment.storedEnergyJ,
      sourcePeakKv: assessment.sourcePeakKv,
      outputCapacitanceF: assessment.outputCapacitanceF,
      hazardous: assessment.hazard.hazardous,
      hazardCriterion: assessment.hazard.criterion,
      items: sorted.map((i) => ({ id: i.id, tag: i.tag, kind: i.kind, ratedKv: i.ratedKv, ratings: i.ratings })),
    },
  };
}

/**
 * Computed figures may differ in the last bits when recomputed; a part in a billion is not a
 * change anyone reviewed. Inputs (plan, ratings) compare exactly.
 */
function sameFigure(a: number, b: number): boolean {
  return a === b || Math.abs(a - b) <= 1e-9 * Math.max(Math.abs(a), Math.abs(b));
}

const kv = (value: number) => `${value} kV`;

/** What differs between the basis an officer approved and the booking now, in words; empty when nothing does. */
export function basisChanges(approved: ApprovalBasis, now: ApprovalBasis): string[] {
  const changes: string[] = [];
  const a = approved.plan;
  const b = now.plan;
  if (a.plannedKv !== b.plannedKv) changes.push(`Planned voltage ${kv(a.plannedKv)} → ${kv(b.plannedKv)}.`);
  if (a.polarity !== b.polarity) changes.push(`Polarity ${a.polarity} → ${b.polarity}.`);
  if (a.maxCurrentMa !== b.maxCurrentMa) changes.push(`Maximum current ${a.maxCurrentMa} mA → ${b.maxCurrentMa} mA.`);
  if (a.peoplePresent !== b.peoplePresent) changes.push(`People present ${a.peoplePresent} → ${b.peoplePresent}.`);
  if (approved.startsAt !== now.startsAt || approved.endsAt !== now.endsAt) changes.push('The booking window changed.');
  if (approved.location !== now.location) changes.push(`Location “${approved.location}” → “${now.location}”.`);
  if (approved.purpose !== now.purpose) changes.push('The purpose changed.');
  const added = now.figures.items.filter((i) => !approved.itemIds.includes(i.id)).map((i) => i.tag);
  const removed = approved.figures.items.filter((i) => !now.itemIds.includes(i.id)).map((i) => i.tag);
  if (added.length > 0) changes.push(`Gear added: ${added.join(', ')}.`);
  if (removed.length > 0) changes.push(`Gear removed: ${removed.join(', ')}.`);
  for (const item of now.figures.items) {
    const before = approved.figures.items.find((i) => i.id === item.id);
    if (before && (before.ratedKv !== item.ratedKv || before.kind !== item.kind || canonical(before.ratings) !== canonical(item.ratings))) {
      changes.push(`${item.tag}: its ratings changed.`);
    }
  }
  const fa = approved.figures;
  const fb = now.figures;
  if (!sameFigure(fa.storedEnergyJ, fb.storedEnergyJ))
    changes.push(`Stored energy ${fa.storedEnergyJ.toPrecision(3)} J → ${fb.storedEnergyJ.toPrecision(3)} J.`);
  if (!sameFigure(fa.sourcePeakKv, fb.sourcePeakKv)) changes.push(`Highest source voltage ${kv(fa.sourcePeakKv)} → ${kv(fb.sourcePeakKv)}.`);
  if (!sameFigure(fa.outputCapacitanceF, fb.outputCapacitanceF)) changes.push('The output capacitance of the set changed.');
  if (fa.hazardous !== fb.hazardous || fa.hazardCriterion !== fb.hazardCriterion) changes.push('The hazardous-live class changed.');
  return changes;
}
