import { useEffect, useEffectEvent, useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { spacing } from '@/components/theme/tokens';
import { ChoiceChips } from '@/components/ui/choice-chips';
import { PlatformDateTime } from '@/components/ui/platform-date-time';
import { TextField } from '@/components/ui/text-field';
import { useLabTimeZone } from '@/hooks/use-session';

import { formatUtcOffset, offsetMinutesAt, resolveLocalText, wallTextOf, type LocalTimeResolution } from '@/shared/local-time';

import { addHours } from './booking-time';

/** Times are the lab's wall clock, named, whatever zone the device at the counter is set to. */
const formatHint = (zone: string) => `Lab time (${zone}, now ${formatUtcOffset(offsetMinutesAt(new Date(), zone))}), written YYYY-MM-DD HH:MM`;
const LENGTHS = [1, 2, 4, 8] as const;

/** The shared schema speaks of ISO times; at the counter the fields take local date and time. */
function friendly(error: string | undefined): string | undefined {
  if (error === undefined) return undefined;
  return /ISO date/i.test(error) ? 'Write it as YYYY-MM-DD HH:MM, for example 2026-12-03 14:15' : error;
}

/** The one instant a typed time names, or '' (not a time, skipped by the clocks, or not yet chosen). */
function instantOf(resolution: LocalTimeResolution): string {
  return resolution.kind === 'exact' ? resolution.candidate.instant.toISOString() : '';
}

/** What to say about a time the clocks skip or repeat; undefined for an ordinary one. */
function clockChangeError(text: string, resolution: LocalTimeResolution, chosen: boolean): string | undefined {
  if (resolution.kind === 'nonexistent') {
    return `${text.trim()} does not exist here: the clocks go forward from ${formatUtcOffset(resolution.offsetBeforeMinutes)} to ${formatUtcOffset(resolution.offsetAfterMinutes)} over that hour. Choose a time outside it.`;
  }
  if (resolution.kind === 'ambiguous' && !chosen) return `${text.trim()} happens twice here (the clocks go back). Choose which one below.`;
  return undefined;
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
  const zone = useLabTimeZone();
  const [text, setText] = useState(value ? wallTextOf(new Date(value), zone) : '');
  const resolution = resolveLocalText(text, zone);
  const candidates = resolution.kind === 'ambiguous' ? [resolution.earlier, resolution.later] : resolution.kind === 'exact' ? [resolution.candidate] : [];
  // A length chip or a reset moves the value: show it, unless it is what is typed already.
  // Keyed on the value only (the typed text is read as it is then), so typing is never overwritten mid-word.
  const followValue = useEffectEvent((next: string) => {
    if (next === '' || candidates.some((c) => c.instant.toISOString() === next)) return;
    setText(wallTextOf(new Date(next), zone));
  });
  useEffect(() => followValue(value), [value]);
  const typed = (next: string) => {
    setText(next);
    onChange(instantOf(resolveLocalText(next, zone)));
  };
  const chosen =
    resolution.kind === 'ambiguous' ? (['earlier', 'later'] as const).find((which) => resolution[which].instant.toISOString() === value) : undefined;
  return (
    <View style={styles.field}>
      <TextField
        label={label}
        value={text}
        onChangeText={typed}
        onBlur={onBlur}
        error={clockChangeError(text, resolution, chosen !== undefined) ?? friendly(error)}
        hint={formatHint(zone)}
        testID={testID}
        autoCorrect={false}
        autoCapitalize="none"
        inputMode="text"
      />
      <PlatformDateTime text={text} onText={typed} label={label} testID={testID} />
      {resolution.kind === 'ambiguous' ? (
        <ChoiceChips
          label={`Which ${text.trim()}?`}
          testID={`${testID}-instant`}
          choices={[
            { value: 'earlier', label: `First, ${formatUtcOffset(resolution.earlier.offsetMinutes)}` },
            { value: 'later', label: `Second, ${formatUtcOffset(resolution.later.offsetMinutes)}` },
          ]}
          value={chosen}
          onChange={(which) => onChange(resolution[which].instant.toISOString())}
        />
      ) : null}
    </View>
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
  field: { gap: spacing.sm },
});
