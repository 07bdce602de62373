// The bench log's three charts, each with its table and a text summary. In a chunk of its own
// (react-native-svg and d3 stay out of the first download), loaded by bench-log-screen.tsx.
import { StyleSheet, View } from 'react-native';

import { spacing } from '@/components/theme/tokens';
import { AppText } from '@/components/ui/app-text';
import { Card } from '@/components/ui/card';
import { Table, TableCell, TableRow, type TableColumn } from '@/components/ui/table';
import type { BenchRun, CoronaFitSummary } from '@/shared/schemas/bench-runs';

import { currentChart, thrustChart, velocityChart, type ChartModel } from './chart-data';
import { sig } from './run-figures';
import { ScatterChart } from './scatter-chart';

function ChartCard({ model }: { model: ChartModel }) {
  const columns: TableColumn[] = [
    { key: 'run', label: 'Run', flex: 1, numeric: true },
    { key: 'series', label: 'Gap', flex: 2 },
    { key: 'x', label: model.xLabel, flex: 3, numeric: true },
    { key: 'y', label: model.yLabel, flex: 3, numeric: true },
  ];
  const rows = model.series.flatMap((s) => s.points.map((p) => ({ ...p, series: s.label })));
  return (
    <Card title={model.title} testID={`bench-chart-${model.key}`}>
      <AppText testID={`bench-chart-${model.key}-summary`}>{model.summary}</AppText>
      {rows.length > 0 ? (
        <View style={styles.body}>
          <ScatterChart model={model} testID={`bench-chart-${model.key}-svg`} />
          <Table label={`${model.title}: the plotted points`} columns={columns} testID={`bench-chart-${model.key}-table`}>
            {rows.map((r) => (
              <TableRow key={`${r.series}-${r.run}`}>
                <TableCell column={columns[0]!}>
                  <AppText variant="small">{r.flagged ? `${r.run} (flagged)` : String(r.run)}</AppText>
                </TableCell>
                <TableCell column={columns[1]!}>
                  <AppText variant="small">{r.series}</AppText>
                </TableCell>
                <TableCell column={columns[2]!}>
                  <AppText variant="small">{sig(r.x)}</AppText>
                </TableCell>
                <TableCell column={columns[3]!}>
                  <AppText variant="small">{sig(r.y, 4)}</AppText>
                </TableCell>
              </TableRow>
            ))}
          </Table>
        </View>
      ) : null}
    </Card>
  );
}

export function BenchCharts({ runs, fits }: { runs: BenchRun[]; fits: CoronaFitSummary[] }) {
  return (
    <View style={styles.charts} testID="bench-charts">
      <ChartCard model={velocityChart(runs)} />
      <ChartCard model={currentChart(runs, fits)} />
      <ChartCard model={thrustChart(runs)} />
    </View>
  );
}

const styles = StyleSheet.create({
  charts: { gap: spacing.lg },
  body: { gap: spacing.md },
});
