// Whether a completed checklist still answers the checklist as it stands now. Lines change (an
// officer adds a line, tightens a limit, makes a line required) and limits follow lab rules; a
// run answered before such a change did not answer the line now in force.
import type { ChecklistAnswerRecord, ChecklistEntry } from '../schemas/bookings';

export interface ChecklistCoverage {
  /** Every line that applies now was on the run, worded and limited the same, and required ones were answered. */
  complete: boolean;
  /** Every reading given is inside the limits in force now. */
  withinLimits: boolean;
  /** One sentence per line that stops the run from counting. */
  gaps: string[];
}

const sameLine = (entry: ChecklistEntry, answer: ChecklistAnswerRecord) =>
  entry.kind === answer.kind &&
  entry.text === answer.text &&
  (entry.unit ?? null) === (answer.unit ?? null) &&
  (entry.min ?? null) === (answer.min ?? null) &&
  (entry.max ?? null) === (answer.max ?? null) &&
  // Runs recorded before answers kept `required` count as required-at-the-time only if answered.
  (answer.required === undefined ? !entry.required || isAnswered(answer) : entry.required === answer.required);

function isAnswered(answer: ChecklistAnswerRecord): boolean {
  if (answer.kind === 'confirm') return answer.confirmed === true;
  if (answer.kind === 'reading') return answer.value !== undefined && answer.value !== null;
  return answer.fileId !== undefined && answer.fileId !== null;
}

export function limitsText(entry: Pick<ChecklistEntry, 'min' | 'max' | 'unit'>): string {
  const unit = entry.unit ? ` ${entry.unit}` : '';
  if (entry.min !== undefined && entry.max !== undefined) return `${entry.min} to ${entry.max}${unit}`;
  if (entry.min !== undefined) return `at least ${entry.min}${unit}`;
  if (entry.max !== undefined) return `at most ${entry.max}${unit}`;
  return 'no limits';
}

export function isWithinLimits(entry: Pick<ChecklistEntry, 'min' | 'max'>, value: number): boolean {
  return (entry.min === undefined || value >= entry.min) && (entry.max === undefined || value <= entry.max);
}

export function checklistCoverage(entries: readonly ChecklistEntry[], answers: readonly ChecklistAnswerRecord[]): ChecklistCoverage {
  const gaps: string[] = [];
  let complete = true;
  let withinLimits = true;
  for (const entry of entries) {
    const answer = answers.find((a) => a.id === entry.id);
    if (!answer || !sameLine(entry, answer)) {
      complete = false;
      gaps.push(
        answer
          ? `“${entry.text}” changed after the checklist was answered: answer it again.`
          : `“${entry.text}” was added after the checklist was answered: answer it.`,
      );
      continue;
    }
    if (entry.required && !isAnswered(answer)) {
      complete = false;
      gaps.push(`“${entry.text}” is required and was not answered.`);
      continue;
    }
    if (entry.kind === 'reading' && answer.value !== undefined && answer.value !== null && !isWithinLimits(entry, answer.value)) {
      withinLimits = false;
      gaps.push(`“${entry.text}” read ${answer.value}${entry.unit ? ` ${entry.unit}` : ''}, outside ${limitsText(entry)}.`);
    }
  }
  return { complete, withinLimits, gaps };
}
