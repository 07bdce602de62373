// The plain-text block "Copy as text" puts on the clipboard, for a lab notebook: inputs with their
// units, every result with its formula, the notices, the sources and the caution.
import type { CalcState, CalcView, CalculatorDef } from './calculators/types';
import { findUnit } from './calculators/units';

export function notebookText(calc: CalculatorDef, state: CalcState, view: CalcView, caution: string, at: Date): string {
  const lines: string[] = [`Voltcrib planner: ${calc.title}`, `Computed ${at.toISOString().slice(0, 16).replace('T', ' ')} UTC`, '', 'Inputs'];
  for (const field of calc.fields) {
    const input = state.fields[field.key];
    const text = input?.text.trim() ?? '';
    if (text === '') continue;
    const unit = findUnit(field.units, input?.unit ?? field.defaultUnit).symbol;
    lines.push(`  ${field.label}: ${text}${unit ? ` ${unit}` : ''}${view.errors[field.key] ? ` (invalid: ${view.errors[field.key]})` : ''}`);
  }
  for (const choice of calc.choices) {
    const chosen = choice.options.find((o) => o.value === state.choices[choice.key]);
    if (chosen) lines.push(`  ${choice.label}: ${chosen.label}`);
  }
  for (const section of view.sections) {
    lines.push('', section.title);
    if (section.waiting) {
      lines.push(`  ${section.waiting}`);
      continue;
    }
    for (const line of section.lines) lines.push(`  ${line.label}: ${line.value}${line.formula ? `   [${line.formula}]` : ''}`);
    for (const notice of section.notices) lines.push(`  ! ${notice.title}: ${notice.text}`);
    if (section.source) lines.push(`  Source: ${section.source}`);
    for (const fact of section.facts) lines.push(`  ${fact}`);
  }
  lines.push('', `Caution: ${caution}`);
  return lines.join('\n');
}
