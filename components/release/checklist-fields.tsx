import { StyleSheet, View } from 'react-native';

import { spacing } from '@/components/theme/tokens';
import { Badge } from '@/components/ui/badge';
import { Checkbox } from '@/components/ui/checkbox';
import { HazardBadge } from '@/components/ui/hazard-badge';
import { NumberField } from '@/components/ui/number-field';
import { isApiError } from '@/hooks/api-client';
import type { ChecklistEntry, ChecklistSubmitInput } from '@/shared/schemas/bookings';

import { hasRange, limitsPhrase } from './checklist-limits';
import { PhotoLine } from './photo-line';

export type ChecklistAnswer = ChecklistSubmitInput['answers'][number];

/** One answer per line, nothing confirmed or read yet. */
export function blankAnswers(entries: ChecklistEntry[]): ChecklistAnswer[] {
  return entries.map((entry) => (entry.kind === 'confirm' ? { itemId: entry.id, confirmed: false } : { itemId: entry.id }));
}

/** A line's message goes once the line is answered again (the next submit checks it anew). */
export function withoutLine(lines: Record<number, string>, lineId: number): Record<number, string> {
  if (!(lineId in lines)) return lines;
  const { [lineId]: _answered, ...rest } = lines;
  return rest;
}

/** The server names incomplete lines `answers.<line id>`: turn them into per-line messages. */
export function serverLineErrors(error: unknown): Record<number, string> {
  const fieldErrors = isApiError(error) ? error.fieldErrors : undefined;
  const lines: Record<number, string> = {};
  for (const [key, messages] of Object.entries(fieldErrors ?? {})) {
    const match = /^answers\.(\d+)$/.exec(key);
    if (match) lines[Number(match[1])] = messages.join(' ');
  }
  return lines;
}

export function limitsText(entry: ChecklistEntry, limitSource?: string): string | null {
  const phrase = limitsPhrase(entry);
  if (phrase === null) return null;
  return `${hasRange(entry) ? 'Limits' : 'Limit'}: ${phrase}${limitSource ? ` (${limitSource})` : ''}`;
}

export function insideLimits(entry: ChecklistEntry, value: number): boolean {
  return (entry.min === undefined || value >= entry.min) && (entry.max === undefined || value <= entry.max);
}

interface ChecklistFieldsProps {
  /** The booking the answers are for: photo lines upload to it. */
  bookingId: number;
  entries: ChecklistEntry[];
  value: ChecklistAnswer[];
  onChange: (answers: ChecklistAnswer[]) => void;
  /** Messages per line id (the server's, or the form's). */
  lineErrors: Record<number, string | undefined>;
  /** Each line gets `<testID>-<line id>`. */
  testID: string;
  /** Where a reading's limits come from, per line id, e.g. "the lab's safe residual voltage". */
  limitSources?: Record<number, string>;
  /** Called with a line's id whenever its answer changes (to drop that line's old message). */
  onLineAnswered?: (lineId: number) => void;
}

/**
 * A checklist's lines: confirmations as large toggles, readings with their unit and limits (and
 * whether the typed value is inside them), photo lines with a button that takes or chooses a photo.
 */
export function ChecklistFields({ bookingId, entries, value, onChange, lineErrors, testID, limitSources = {}, onLineAnswered }: ChecklistFieldsProps) {
  const answerFor = (id: number) => value.find((a) => a.itemId === id) ?? { itemId: id };
  const set = (id: number, patch: Partial<ChecklistAnswer>) => {
    onChange(value.some((a) => a.itemId === id) ? value.map((a) => (a.itemId === id ? { ...a, ...patch } : a)) : [...value, { itemId: id, ...patch }]);
    onLineAnswered?.(id);
  };

  return (
    <View style={styles.root} testID={testID}>
      {entries.map((entry) => {
        const answer = answerFor(entry.id);
        const lineTestID = `${testID}-${entry.id}`;
        const error = lineErrors[entry.id];
        if (entry.kind === 'confirm') {
          return (
            <Checkbox
              key={entry.id}
              testID={lineTestID}
              label={entry.text}
              detail={entry.required ? undefined : 'Optional'}
              checked={answer.confirmed === true}
              onChange={(confirmed) => set(entry.id, { confirmed })}
              error={error}
            />
          );
        }
        if (entry.kind === 'reading') {
          const reading = answer.value;
          const typed = reading !== undefined && !Number.isNaN(reading);
          return (
            <View key={entry.id} style={styles.reading}>
              <NumberField
                testID={lineTestID}
                // The unit follows in brackets: drop the sentence's own full stop before it.
                label={entry.text.replace(/\.\s*$/, '')}
                unit={entry.unit ?? 'value'}
                value={reading}
                onChange={(next) => set(entry.id, { value: next })}
                hint={limitsText(entry, limitSources[entry.id]) ?? undefined}
                error={error}
              />
              {typed ? (
                insideLimits(entry, reading) ? (
                  <Badge label="Within the limits" icon="check-circle" testID={`${lineTestID}-inside`} />
                ) : (
                  <HazardBadge level="warning" detail="Outside the limits" testID={`${lineTestID}-outside`} />
                )
              ) : null}
            </View>
          );
        }
        return (
          <PhotoLine
            key={entry.id}
            bookingId={bookingId}
            entry={entry}
            fileId={answer.fileId}
            onChange={(fileId) => set(entry.id, { fileId })}
            error={error}
            testID={lineTestID}
          />
        );
      })}
    </View>
  );
}

const styles = StyleSheet.create({
  root: { gap: spacing.md },
  reading: { gap: spacing.xs },
});
