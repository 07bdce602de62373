import { lazy, Suspense, useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { BackLink } from '@/components/bookings/back-link';
import { DownloadLink } from '@/components/reports/download-link';
import { spacing } from '@/components/theme/tokens';
import { AppText } from '@/components/ui/app-text';
import { Card } from '@/components/ui/card';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { LoadingState } from '@/components/ui/loading-state';
import { Screen } from '@/components/ui/screen';
import { TextLink } from '@/components/ui/text-link';
import { benchRunsCsvUrl, useBenchRunsQuery, useEditRunMutation, useRecordRunMutation, type BenchRun, type BenchRunsResponse } from '@/hooks/use-bench-runs';
import { useBookingQuery, type Booking } from '@/hooks/use-bookings';
import { useBreakpoints } from '@/hooks/use-breakpoints';
import { useCurrentUser } from '@/hooks/use-session';
import type { BenchRunEdit, BenchRunInput } from '@/shared/schemas/bench-runs';

import { FitSummary } from './fit-summary';
import { RunForm } from './run-form';
import { RunList } from './run-list';
import { sig } from './run-figures';

// react-native-svg and d3 arrive only when a log has runs to draw.
const BenchCharts = lazy(() => import('./bench-charts').then((m) => ({ default: m.BenchCharts })));

/** A booking's bench log: add a run (prefilled from the last), the runs with their checks, fits and charts. */
export function BenchLogScreen({ id }: { id: number }) {
  const booking = useBookingQuery(id);
  const log = useBenchRunsQuery(id);
  const { isWide } = useBreakpoints();
  return (
    <Screen testID="bench-log-screen" title={`Bench log, booking ${id}`} width={isWide ? 'wide' : 'regular'}>
      <BackLink href={`/bookings/${id}`} label={`Booking ${id}`} />
      {booking.isPending || log.isPending ? (
        <LoadingState label="Loading the bench log" />
      ) : booking.isError || log.isError ? (
        <ErrorState
          title="The bench log did not load"
          error={booking.error ?? log.error}
          onRetry={() => void Promise.all([booking.refetch(), log.refetch()])}
          retrying={booking.isFetching || log.isFetching}
        />
      ) : (
        <BenchLogBody booking={booking.data} log={log.data} wide={isWide} />
      )}
    </Screen>
  );
}

function BenchLogBody({ booking, log, wide }: { booking: Booking; log: BenchRunsResponse; wide: boolean }) {
  const user = useCurrentUser();
  const record = useRecordRunMutation(booking.id);
  const edit = useEditRunMutation(booking.id);
  const [correcting, setCorrecting] = useState<BenchRun | null>(null);
  const staff = user?.role === 'officer' || user?.role === 'manager';
  const last = log.runs[log.runs.length - 1];

  const form = log.open ? (
    <Card title={correcting ? `Correct run ${correcting.number}` : 'Add run'} testID="bench-add-run">
      {correcting ? (
        <RunForm
          bookingId={booking.id}
          key={`edit-${correcting.id}`}
          mode="edit"
          from={correcting}
          planPolarity={booking.plan.polarity}
          onSubmit={async (values) => {
            await edit.mutateAsync({ runId: correcting.id, edit: values as BenchRunEdit });
            setCorrecting(null);
          }}
          onCancel={() => setCorrecting(null)}
          testID="bench-edit-form"
        />
      ) : (
        <RunForm
          bookingId={booking.id}
          mode="new"
          from={last}
          planPolarity={booking.plan.polarity}
          onSubmit={(values) => record.mutateAsync(values as BenchRunInput)}
          testID="bench-run-form"
        />
      )}
    </Card>
  ) : (
    <AppText testID="bench-log-closed">
      {booking.status === 'returned'
        ? `The gear came back more than ${log.graceHours} h ago: the log is closed. Staff can still remove a run.`
        : 'Runs are recorded once the gear is released.'}
    </AppText>
  );

  const runs =
    log.runs.length === 0 ? (
      <EmptyState title="No runs yet" message="Each run you record appears here with its derived figures and checks." icon="chart-bar" />
    ) : (
      <RunList bookingId={booking.id} runs={log.runs} canCorrect={log.open} canRemove={staff} onCorrect={setCorrecting} />
    );

  const tools = (
    <View style={styles.tools}>
      <AppText variant="small" tone="muted">
        {`Plan: ${sig(booking.plan.plannedKv)} kV ${booking.plan.polarity}, at most ${sig(booking.plan.maxCurrentMa)} mA. ${booking.purpose}`}
      </AppText>
      {log.runs.length > 0 ? (
        <DownloadLink label="Export runs (CSV)" url={benchRunsCsvUrl(booking.id)} fileName={`booking-${booking.id}-runs.csv`} testID="bench-export" />
      ) : null}
      {log.open ? <TextLink label="Import a logger's CSV" href={`/bookings/${booking.id}/runs-import`} icon="upload" testID="bench-import-link" /> : null}
    </View>
  );

  const analysis =
    log.runs.length === 0 ? null : (
      <View style={styles.column}>
        <FitSummary fits={log.fits} />
        <Suspense fallback={<LoadingState label="Loading the charts" />}>
          <BenchCharts runs={log.runs} fits={log.fits} />
        </Suspense>
      </View>
    );

  return wide ? (
    <View style={styles.wide}>
      <View style={styles.wideColumn}>
        {tools}
        {form}
        {runs}
      </View>
      <View style={styles.wideColumn}>{analysis}</View>
    </View>
  ) : (
    <View style={styles.column}>
      {tools}
      {form}
      {runs}
      {analysis}
    </View>
  );
}

const styles = StyleSheet.create({
  column: { gap: spacing.lg },
  tools: { gap: spacing.xs },
  wide: { flexDirection: 'row', gap: spacing.lg, alignItems: 'flex-start' },
  wideColumn: { flex: 1, gap: spacing.lg },
});
