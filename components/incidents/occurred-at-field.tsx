import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { spacing } from '@/components/theme/tokens';
import { ChoiceChips } from '@/components/ui/choice-chips';
import { TextField } from '@/components/ui/text-field';
import { deviceTimeZone, resolveLocalText, wallTextOf } from '@/shared/local-time';

const AGO = [
  { value: '0', label: 'Just now' },
  { value: '15', label: '15 min ago' },
  { value: '60', label: 'An hour ago' },
  { value: 'other', label: 'Another time' },
] as const;

type Choice = (typeof AGO)[number]['value'];

interface OccurredAtFieldProps {
  /** ISO 8601, or '' while the typed text is not a time. */
  value: string;
  onChange: (iso: string) => void;
  error?: string;
}

/**
 * When it happened: one tap for the usual answers (a report is written soon after), or the
 * local date and time typed, on the device's clock with its zone named.
 */
export function OccurredAtField({ value, onChange, error }: OccurredAtFieldProps) {
  const zone = deviceTimeZone();
  const [choice, setChoice] = useState<Choice>('0');
  const [text, setText] = useState(() => wallTextOf(value ? new Date(value) : new Date(), zone));
  const pick = (next: Choice) => {
    setChoice(next);
    if (next === 'other') return;
    const at = new Date(Date.now() - Number(next) * 60_000);
    setText(wallTextOf(at, zone));
    onChange(at.toISOString());
  };
  const type = (typed: string) => {
    setText(typed);
    const resolution = resolveLocalText(typed, zone);
    // A time the clocks repeat takes the earlier of the two: a report is about the first moment.
    onChange(
      resolution.kind === 'exact'
        ? resolution.candidate.instant.toISOString()
        : resolution.kind === 'ambiguous'
          ? resolution.earlier.instant.toISOString()
          : '',
    );
  };
  const message = error
    ? /date and time|ISO/i.test(error) && choice === 'other'
      ? 'Write it as YYYY-MM-DD HH:MM, for example 2026-12-03 14:15'
      : error
    : undefined;
  return (
    <View style={styles.root}>
      <ChoiceChips label="When" testID="incident-when" choices={AGO} value={choice} onChange={pick} error={choice === 'other' ? undefined : message} />
      {choice === 'other' ? (
        <TextField
          label="Date and time"
          hint={`Local time (${zone}), written YYYY-MM-DD HH:MM`}
          value={text}
          onChangeText={type}
          error={message}
          testID="incident-occurred-at"
        />
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  root: { gap: spacing.sm },
});
