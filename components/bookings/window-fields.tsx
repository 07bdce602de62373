import { useEffect, useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { spacing } from '@/components/theme/tokens';
import { ChoiceChips } from '@/components/ui/choice-chips';
import { TextField } from '@/components/ui/text-field';

import { addHours, parseLocalText, toLocalText } from './booking-time';

const FORMAT_HINT = 'Local time, written YYYY-MM-DD HH:MM';
const LENGTHS = [1, 2, 4, 8] as const;

/** The shared schema speaks of ISO times; at the counter the fields take local date and time. */
function friendly(error: string | undefined): string | undefined {
  if (error === undefined) return undefined;
  return /ISO date/i.test(error) ? 'Write it as YYYY-MM-DD HH:MM, for example 2026-12-03 14:15' : error;
}

interface TimeFieldProps {
  label: string;
  /** ISO 8601, or '' while the text is not a time. */
  value: string;
  onChange: (iso: string) => void;
  onBlur?: () => void;
  error?: string;
  testID: string;
}

function TimeField({ label, value, onChange, onBlur, error, testID }: TimeFieldProps) {
  const [text, setText] = useState(value ? toLocalText(new Date(value)) : '');
  // A length chip or a reset moves the value: show it, unless it is what is typed already.
  useEffect(() => {
    if (value === '' || parseLocalText(text)?.toISOString() === value) return;
    setText(toLocalText(new Date(value)));
    // Keyed on the value only, so typing is never overwritten mid-word.
  }, [value]);
  return (
    <TextField
      label={label}
      value={text}
      onChangeText={(next) => {
        setText(next);
        onChange(parseLocalText(next)?.toISOString() ?? '');
      }}
      onBlur={onBlur}
      error={friendly(error)}
      hint={FORMAT_HINT}
      testID={testID}
      autoCorrect={false}
      autoCapitalize="none"
      inputMode="text"
    />
  );
}

interface WindowFieldsProps {
  startsAt: string;
  endsAt: string;
  onStartsAt: (iso: string) => void;
  onEndsAt: (iso: string) => void;
  startsAtError?: string;
  endsAtError?: string;
}

/** Start, end, and one-tap lengths from the start (most tests run a couple of hours). */
export function WindowFields({ startsAt, endsAt, onStartsAt, onEndsAt, startsAtError, endsAtError }: WindowFieldsProps) {
  const start = startsAt ? new Date(startsAt) : null;
  const hours = start && endsAt ? (new Date(endsAt).getTime() - start.getTime()) / 3600_000 : undefined;
  const current = LENGTHS.find((h) => h === hours);
  return (
    <View style={styles.root}>
      <TimeField label="Starts" value={startsAt} onChange={onStartsAt} error={startsAtError} testID="book-starts-at" />
      <ChoiceChips
        label="Length"
        testID="book-length"
        choices={LENGTHS.map((h) => ({ value: String(h), label: `${h} h` }))}
        value={current === undefined ? undefined : String(current)}
        onChange={(h) => {
          if (start) onEndsAt(addHours(start, Number(h)).toISOString());
        }}
      />
      <TimeField label="Ends" value={endsAt} onChange={onEndsAt} error={endsAtError} testID="book-ends-at" />
    </View>
  );
}

const styles = StyleSheet.create({
  root: { gap: spacing.md },
});
