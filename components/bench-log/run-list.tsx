import { useState } from 'react';
import { Image, StyleSheet, View } from 'react-native';

import { formatDateTime } from '@/components/common/format';
import { borders, layout, radii, spacing } from '@/components/theme/tokens';
import { useTheme } from '@/components/theme/use-theme';
import { AppText } from '@/components/ui/app-text';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { HazardBadge } from '@/components/ui/hazard-badge';
import { TextField } from '@/components/ui/text-field';
import { describeError } from '@/components/ui/error-state';
import { bookingPhotoUrl } from '@/hooks/use-booking-photos';
import { useDeleteRunMutation, useRunRevisionsQuery } from '@/hooks/use-bench-runs';
import type { BenchRun } from '@/shared/schemas/bench-runs';

import { FLAG_WORDS } from './flag-words';
import { derivedLines, runHeadline, sig } from './run-figures';

interface RunListProps {
  bookingId: number;
  runs: BenchRun[];
  /** Corrections are offered while the log is open. */
  canCorrect: boolean;
  /** Officers and managers may remove a run. */
  canRemove: boolean;
  onCorrect: (run: BenchRun) => void;
}

/** Newest first: during a sweep the point just taken is the one to check. */
export function RunList({ bookingId, runs, canCorrect, canRemove, onCorrect }: RunListProps) {
  return (
    <View style={styles.list} testID="bench-runs">
      {[...runs].reverse().map((run) => (
        <RunCard key={run.id} bookingId={bookingId} run={run} canCorrect={canCorrect} canRemove={canRemove} onCorrect={onCorrect} />
      ))}
    </View>
  );
}

function RunCard({ bookingId, run, canCorrect, canRemove, onCorrect }: { bookingId: number; run: BenchRun } & Omit<RunListProps, 'runs' | 'bookingId'>) {
  const { colors } = useTheme();
  const [history, setHistory] = useState(false);
  const [removing, setRemoving] = useState(false);
  const testID = `bench-run-${run.number}`;
  return (
    <View style={[styles.card, { borderColor: colors.border, backgroundColor: colors.surface }]} testID={testID}>
      <AppText variant="bodyStrong">{runHeadline(run)}</AppText>
      <AppText variant="small" tone="muted">
        {`${formatDateTime(run.recordedAt)} · ${run.recordedBy.name}${run.stages === null ? '' : ` · ${run.stages} ${run.stages === 1 ? 'stage' : 'stages'}`}${run.revision > 1 ? ` · corrected (revision ${run.revision})` : ''}`}
      </AppText>
      {run.flags.length === 0 ? (
        <Badge label="No flags" icon="check-circle" tone="muted" testID={`${testID}-no-flags`} />
      ) : (
        run.flags.map((flag) => (
          <View key={flag.code} style={styles.flag} testID={`${testID}-flag-${flag.code}`}>
            <HazardBadge level={FLAG_WORDS[flag.code].level} detail={FLAG_WORDS[flag.code].word} />
            <AppText variant="small">{flag.message}</AppText>
          </View>
        ))
      )}
      <View style={styles.figures}>
        {derivedLines(run).map((line) => (
          <AppText key={line.label} variant="small">
            {`${line.label}: `}
            <AppText variant="smallStrong">{line.value}</AppText>
          </AppText>
        ))}
        {run.temperatureC !== null ? (
          <AppText
            variant="small"
            tone="muted"
          >{`Ambient ${sig(run.temperatureC)} °C, ${sig(run.pressureKpa, 4)} kPa, ${run.humidityPct === null ? 'humidity not given (dry air assumed)' : `${sig(run.humidityPct)} % RH`}`}</AppText>
        ) : null}
      </View>
      {run.notes ? <AppText variant="small">{`Notes: ${run.notes}`}</AppText> : null}
      {run.photoFileId !== null ? (
        <Image
          source={{ uri: bookingPhotoUrl(run.photoFileId) }}
          style={[styles.photo, { backgroundColor: colors.surfaceMuted }]}
          resizeMode="cover"
          accessibilityLabel={`Photo of the setup for run ${run.number}`}
          testID={`${testID}-photo`}
        />
      ) : null}
      <View style={styles.actions}>
        {canCorrect ? <Button label="Correct" icon="pencil" variant="secondary" onPress={() => onCorrect(run)} testID={`${testID}-correct`} /> : null}
        {run.revision > 1 ? (
          <Button
            label={history ? 'Hide history' : 'History'}
            variant="secondary"
            icon={history ? 'chevron-up' : 'chevron-down'}
            onPress={() => setHistory((h) => !h)}
            testID={`${testID}-history`}
          />
        ) : null}
        {canRemove ? <Button label="Remove" variant="danger" onPress={() => setRemoving(true)} testID={`${testID}-remove`} /> : null}
      </View>
      {history ? <RunHistory bookingId={bookingId} runId={run.id} /> : null}
      {removing ? <RemoveRun bookingId={bookingId} run={run} onDone={() => setRemoving(false)} /> : null}
    </View>
  );
}

function RunHistory({ bookingId, runId }: { bookingId: number; runId: number }) {
  const revisions = useRunRevisionsQuery(bookingId, runId);
  if (revisions.isPending) return <AppText variant="small">Loading the history…</AppText>;
  if (revisions.isError)
    return (
      <AppText variant="small" tone="error">
        {describeError(revisions.error)}
      </AppText>
    );
  return (
    <View style={styles.figures}>
      {revisions.data.map((r) => (
        <AppText key={r.revision} variant="small">
          {`Revision ${r.revision}, ${r.action} ${formatDateTime(r.editedAt)} by ${r.editedBy}: ${r.reason}. Was ${sig(Number(r.before.applied_kv))} kV, ${sig(Number(r.before.current_ma), 4)} mA, ${sig(Number(r.before.gap_mm))} mm${r.before.thrust_mn === null ? '' : `, ${sig(Number(r.before.thrust_mn))} mN`}.`}
        </AppText>
      ))}
    </View>
  );
}

function RemoveRun({ bookingId, run, onDone }: { bookingId: number; run: BenchRun; onDone: () => void }) {
  const remove = useDeleteRunMutation(bookingId);
  const [reason, setReason] = useState('');
  return (
    <View style={styles.figures}>
      <TextField
        label={`Why remove run ${run.number}`}
        value={reason}
        onChangeText={setReason}
        error={remove.isError ? describeError(remove.error) : undefined}
        testID={`bench-run-${run.number}-remove-reason`}
      />
      <View style={styles.actions}>
        <Button
          label={`Remove run ${run.number}`}
          variant="danger"
          loading={remove.isPending}
          onPress={() => remove.mutate({ runId: run.id, reason }, { onSuccess: onDone })}
          testID={`bench-run-${run.number}-remove-confirm`}
        />
        <Button label="Keep it" variant="secondary" onPress={onDone} />
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  list: { gap: spacing.sm },
  card: { borderWidth: borders.hairline, borderRadius: radii.md, padding: spacing.sm, gap: spacing.xs },
  flag: { gap: spacing.xxs },
  figures: { gap: spacing.xxs },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.xs },
  photo: { width: layout.markSizeLarge * 2, height: layout.markSizeLarge * 2, borderRadius: radii.sm },
});
