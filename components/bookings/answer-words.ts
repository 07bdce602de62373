import { trimNumber } from '@/components/assessment/quantities';
import type { ChecklistAnswerRecord } from '@/shared/schemas/bookings';

/** The answer in words, with a reading's limits so a reviewer sees why it passed or not. */
export function describeAnswer(answer: ChecklistAnswerRecord): string {
  if (answer.kind === 'confirm') return answer.confirmed ? 'Confirmed' : 'Not confirmed (optional)';
  if (answer.kind === 'photo') return answer.fileId !== undefined ? 'Photo taken' : 'No photo (optional)';
  if (answer.value === undefined) return 'No reading (optional)';
  const unit = answer.unit ? ` ${answer.unit}` : '';
  const limits =
    answer.min !== undefined && answer.max !== undefined
      ? `limits ${trimNumber(answer.min, 4)} to ${trimNumber(answer.max, 4)}${unit}`
      : answer.max !== undefined
        ? `at most ${trimNumber(answer.max, 4)}${unit}`
        : answer.min !== undefined
          ? `at least ${trimNumber(answer.min, 4)}${unit}`
          : null;
  const reading = `${trimNumber(answer.value, 4)}${unit}`;
  if (!limits) return reading;
  return `${reading} (${limits}${answer.withinLimits ? '' : ': outside'})`;
}
