// The shape every Planner calculator shares: what it asks for, and what it shows back. The screen
// renders these generically, and the notebook text is built from the same data, so what is copied
// is exactly what is on screen.
import type { HazardLevel } from '@/components/theme/tokens';

import type { CalculatorName } from './names';
import type { UnitOption } from './units';

export type { CalculatorName };

/** What the member typed into one field, and the unit chosen beside it. */
export interface FieldInput {
  text: string;
  unit: string;
}

export interface CalcState {
  fields: Record<string, FieldInput>;
  choices: Record<string, string>;
}

export interface FieldSpec {
  key: string;
  label: string;
  /** Lower-case name for sentences ("enter the capacitance"). */
  noun: string;
  units: readonly UnitOption[];
  defaultUnit: string;
  defaultText?: string;
  hint?: string;
  /** Below zero is meaningful (°C): phone keypads for decimals have no minus sign. */
  signed?: boolean;
}

export interface ChoiceSpec {
  key: string;
  label: string;
  options: readonly { value: string; label: string }[];
  defaultValue: string;
}

export interface ResultLine {
  /** Becomes the value's testID: `planner-result-<key>`. */
  key: string;
  label: string;
  value: string;
  /** How the value was computed, e.g. "E = ½CV²". */
  formula?: string;
}

export interface Notice {
  /** Becomes `planner-notice-<key>`. */
  key: string;
  level: HazardLevel;
  title: string;
  text: string;
}

export interface ResultSection {
  key: string;
  title: string;
  /** Set while inputs are missing or invalid: what to enter to see this section. */
  waiting: string | null;
  lines: ResultLine[];
  notices: Notice[];
  /** Where the numbers come from; the functions in shared/hv supply it. */
  source: string | null;
  /** Extra provenance (standard edition, how far the values are confirmed). */
  facts: string[];
}

export interface CalcView {
  /** Message per field key; shown under the field. */
  errors: Record<string, string>;
  sections: ResultSection[];
}

export interface CalculatorDef {
  name: CalculatorName;
  /** Short label for the tab. */
  label: string;
  /** Heading above the inputs, and the notebook block's title. */
  title: string;
  intro: string;
  fields: readonly FieldSpec[];
  choices: readonly ChoiceSpec[];
  compute(state: CalcState): CalcView;
}
