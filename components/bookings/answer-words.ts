import { trimNumber } from '@/components/assessment/quantities';
import { hasRange, limitsPhrase } from '@/components/release/checklist-limits';
import type { ChecklistAnswerRecord } from '@/shared/schemas/bookings';

/** The answer in words, with a reading's limits so a reviewer sees why it passed or not. */
export function describeAnswer(answer: ChecklistAnswerRecord): string {
  if (answer.kind === 'confirm') return answer.confirmed ? 'Confirmed' : 'Not confirmed (optional)';
  if (answer.kind === 'photo') return answer.fileId !== undefined ? 'Photo taken' : 'No photo (optional)';
  if (answer.value === undefined) return 'No reading (optional)';
  const reading = `${trimNumber(answer.value, 4)}${answer.unit ? ` ${answer.unit}` : ''}`;
  const limits = limitsPhrase(answer);
  if (limits === null) return reading;
  return `${reading} (${hasRange(answer) ? `limits ${limits}` : limits}${answer.withinLimits ? '' : ': outside'})`;
}
