// The setup assessment's answer as the API sends it (GET /api/bookings/:id, POST /api/assessments)
// and its inputs: shapes only. shared/rules/assessment.ts computes it; the booking schema embeds it.
import type { ItemKind } from './items';

export interface AssessedItem {
  id: number;
  tag: string;
  name: string;
  kind: ItemKind;
  ratedKv: number | null;
  ratings: Record<string, unknown>;
  status: 'in-service' | 'out-of-service' | 'retired';
  inspectionState: 'current' | 'due-soon' | 'overdue' | 'never';
}

export interface QualificationState {
  authorisedKv: number;
  expiresOn: string;
}

export interface ItemCheck {
  itemId: number;
  tag: string;
  name: string;
  kind: ItemKind;
  ratedKv: number | null;
  requiredKv: number;
  marginKv: number | null;
  ratingOk: boolean;
  inService: boolean;
  inspectionCurrent: boolean;
  notes: string[];
}

export interface Reason {
  code: string;
  message: string;
}

export interface Assessment {
  plannedKv: number;
  /** The highest voltage the sources in the set can produce: boundaries use it, not the setpoint. */
  sourcePeakKv: number;
  requiredKv: number;
  items: ItemCheck[];
  missingCompanions: Reason[];
  /** The sources cannot produce the plan's polarity (shared/rules/polarity.ts); absent on assessments stored before the check. */
  polarity?: Reason | null;
  storedEnergyJ: number;
  outputCapacitanceF: number;
  hazard: { hazardous: boolean; criterion: string; explanation: string; source: string };
  bleedDown: {
    resistanceOhm: number;
    timeS: number;
    timeConstants: number;
    residualAfter5TauV: number;
    fiveTauIsEnough: boolean;
    note: string;
    source: string;
  } | null;
  bleedDownNote: string;
  boundaries: {
    limitedMovableM: number | null;
    limitedFixedM: number | null;
    restrictedM: number | null;
    limitedFixedImperial: string;
    restrictedImperial: string;
    limitedMovableImperial: string;
    rowLabel: string;
    edition: string;
    marker: string;
    source: string;
  } | null;
  multipliers: {
    itemId: number;
    tag: string;
    stages: number;
    drivePeakInputV: number;
    noLoadV: number;
    dropV: number;
    rippleV: number;
    loadedV: number;
    optimumStages: number | null;
    overRating: boolean;
  }[];
  approvalRequired: boolean;
  approvalReasons: Reason[];
  cautions: string[];
}
