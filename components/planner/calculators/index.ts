// The Planner's calculators, in tab order.
import { boundariesCalculator } from './boundaries';
import { coronaCalculator } from './corona';
import { energyCalculator } from './energy';
import { hazardCalculator } from './hazard';
import { multiplierCalculator } from './multiplier';
import type { CalcState, CalculatorDef } from './types';

export const CALCULATORS: readonly CalculatorDef[] = [energyCalculator, hazardCalculator, boundariesCalculator, multiplierCalculator, coronaCalculator];

export function initialState(calc: CalculatorDef): CalcState {
  return {
    fields: Object.fromEntries(calc.fields.map((f) => [f.key, { text: f.defaultText ?? '', unit: f.defaultUnit }])),
    choices: Object.fromEntries(calc.choices.map((c) => [c.key, c.defaultValue])),
  };
}

export type { CalcState, CalculatorDef, CalculatorName } from './types';
