// The reports' charts, each with its text summary, its table and its CSV. In a chunk of its own
// (react-native-svg and d3 stay out of the first download), loaded by reports-screen.tsx.
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import type { ChartModel } from '@/components/bench-log/chart-data';
import { ScatterChart } from '@/components/bench-log/scatter-chart';
import { spacing } from '@/components/theme/tokens';
import { AppText } from '@/components/ui/app-text';
import { Card } from '@/components/ui/card';
import { ChoiceChips } from '@/components/ui/choice-chips';
import { ErrorState } from '@/components/ui/error-state';
import { LoadingState } from '@/components/ui/loading-state';
import { Table, TableCell, TableRow, type TableColumn } from '@/components/ui/table';
import { chartUrls, useChartsReportQuery, type ChartsReport } from '@/hooks/use-report-charts';
import type { ReportPeriod } from '@/hooks/use-reports';
import { incidentKindWords, incidentSeverityWords, type IncidentKind, type IncidentSeverity } from '@/shared/schemas/incidents';
import type { ChartCsvName } from '@/shared/schemas/report-charts';

import { bookedHoursChart, energizedHoursChart, incidentsChart, inspectionsChart, monthLabel, overdueChart, weekLabel } from './chart-models';
import { DownloadLink } from './download-link';

type Row = Record<string, string | number>;

interface ChartCardProps {
  model: ChartModel;
  columns: TableColumn[];
  rows: Row[];
  csv: { name: ChartCsvName; period: ReportPeriod };
}

function ChartCard({ model, columns, rows, csv }: ChartCardProps) {
  return (
    <Card title={model.title} testID={`report-chart-${model.key}`}>
      <AppText testID={`report-chart-${model.key}-summary`}>{model.summary}</AppText>
      {rows.length > 0 ? (
        <View style={styles.body}>
          <ScatterChart model={model} testID={`report-chart-${model.key}-svg`} />
          <Table label={`${model.title}: the figures`} columns={columns}>
            {rows.map((row, index) => (
              <TableRow key={index}>
                {columns.map((column) => (
                  <TableCell key={column.key} column={column}>
                    <AppText variant="small">{String(row[column.key] ?? '')}</AppText>
                  </TableCell>
                ))}
              </TableRow>
            ))}
          </Table>
        </View>
      ) : null}
      <DownloadLink
        label="Download CSV"
        url={chartUrls.csv(csv.name, csv.period)}
        fileName={`voltcrib-${csv.name}.csv`}
        testID={`report-chart-${model.key}-csv`}
      />
    </Card>
  );
}

const col = (key: string, label: string, flex: number, numeric = false): TableColumn => ({ key, label, flex, numeric });
const kindWord = (k: string) => incidentKindWords[k as IncidentKind]?.label ?? k;
const severityWord = (s: string) => incidentSeverityWords[s as IncidentSeverity]?.label ?? s;

function Charts({ report, period }: { report: ChartsReport; period: ReportPeriod }) {
  const c = (name: ChartCsvName) => ({ name, period });
  return (
    <View style={styles.charts} testID="report-charts">
      <ChartCard
        model={bookedHoursChart(report)}
        columns={[col('week', 'Week of', 3), col('groupName', 'Group', 4), col('hours', 'Hours', 2, true)]}
        rows={report.bookedHours.map((b) => ({ ...b, week: weekLabel(b.week) }))}
        csv={c('booked-hours')}
      />
      <ChartCard
        model={energizedHoursChart(report)}
        columns={[col('groupName', 'Group', 5), col('hours', 'Hours out', 3, true)]}
        rows={report.energizedHours}
        csv={c('energized-hours')}
      />
      <ChartCard
        model={overdueChart(report)}
        columns={[col('week', 'Week of', 4), col('count', 'Overdue', 3, true)]}
        rows={report.overdueReturns.map((o) => ({ ...o, week: weekLabel(o.week) }))}
        csv={c('overdue-returns')}
      />
      <ChartCard
        model={inspectionsChart(report)}
        columns={[col('week', 'Week of', 3), col('kind', 'Kind', 3), col('count', 'Due', 2, true), col('blocking', 'Overdue or never', 3, true)]}
        rows={report.inspectionsDue.map((i) => ({ week: weekLabel(i.week), kind: i.kind, count: i.count, blocking: i.overdue + i.never }))}
        csv={c('inspections-due')}
      />
      <ChartCard
        model={incidentsChart(report)}
        columns={[col('month', 'Month', 3), col('kind', 'Kind', 4), col('severity', 'Severity', 3), col('count', 'Count', 2, true)]}
        rows={report.incidents.map((i) => ({ month: monthLabel(i.month), kind: kindWord(i.kind), severity: severityWord(i.severity), count: i.count }))}
        csv={c('incidents')}
      />
    </View>
  );
}

/** The months the summary is offered for: this one so far and the two before, newest first. */
function recentMonths(now = new Date()): string[] {
  return [0, 1, 2].map((back) => new Date(Date.UTC(now.getUTCFullYear(), now.getUTCMonth() - back, 1)).toISOString().slice(0, 7));
}

function SafetySummaryCard() {
  const months = recentMonths();
  const [month, setMonth] = useState(months[1]!);
  return (
    <Card title="Monthly safety summary" testID="report-safety-summary">
      <AppText tone="muted">
        One page for the lab manager: the month&apos;s incidents by kind and severity, reviews, corrective actions, use, overdue returns and inspections that
        block release.
      </AppText>
      <ChoiceChips
        label="Month"
        testID="safety-summary-month"
        choices={months.map((m) => ({ value: m, label: monthLabel(m) }))}
        value={month}
        onChange={setMonth}
      />
      <DownloadLink
        label={`Download the ${monthLabel(month)} summary (PDF)`}
        url={chartUrls.safetySummaryPdf(month)}
        fileName={`voltcrib-safety-summary-${month}.pdf`}
        testID="safety-summary-pdf"
      />
    </Card>
  );
}

export function ReportCharts({ period }: { period: ReportPeriod }) {
  const charts = useChartsReportQuery(period);
  return (
    <View style={styles.charts}>
      <SafetySummaryCard />
      {charts.isPending ? (
        <LoadingState label="Loading the charts" />
      ) : charts.isError ? (
        <ErrorState title="The charts did not load" error={charts.error} onRetry={() => void charts.refetch()} retrying={charts.isRefetching} />
      ) : (
        <Charts report={charts.data} period={period} />
      )}
    </View>
  );
}

const styles = StyleSheet.create({
  charts: { gap: spacing.lg },
  body: { gap: spacing.md },
});
