// The calculators' names on their own: the screen shell reads them from the URL without pulling
// the physics into the main bundle.
export const CALCULATOR_NAMES = ['energy', 'hazard', 'boundaries', 'multiplier', 'corona'] as const;
export type CalculatorName = (typeof CALCULATOR_NAMES)[number];

export function isCalculatorName(value: unknown): value is CalculatorName {
  return typeof value === 'string' && (CALCULATOR_NAMES as readonly string[]).includes(value);
}
