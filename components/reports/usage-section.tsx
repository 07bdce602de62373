import { StyleSheet, View } from 'react-native';

import { borders, spacing } from '@/components/theme/tokens';
import { useTheme } from '@/components/theme/use-theme';
import { AppText } from '@/components/ui/app-text';
import { Card } from '@/components/ui/card';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { LoadingState } from '@/components/ui/loading-state';
import { reportUrls, useUsageReportQuery, type GroupUsage, type ReportPeriod } from '@/hooks/use-reports';

import { DownloadLink } from './download-link';
import { formatHours } from './format';
import { PeriodPicker } from './period-picker';

interface UsageSectionProps {
  period: ReportPeriod;
  onPeriodChange: (period: ReportPeriod) => void;
}

/** Bookings, hours and people per research group over a period. */
export function UsageSection({ period, onPeriodChange }: UsageSectionProps) {
  const usage = useUsageReportQuery(period);
  return (
    <Card title="Use per group" testID="reports-usage">
      <PeriodPicker period={period} onChange={onPeriodChange} />
      {usage.isPending ? (
        <LoadingState label="Loading use per group" testID="reports-usage-loading" />
      ) : usage.isError ? (
        <ErrorState
          testID="reports-usage-error"
          title="Use per group did not load"
          error={usage.error}
          onRetry={() => void usage.refetch()}
          retrying={usage.isRefetching}
        />
      ) : usage.data.groups.length === 0 ? (
        <EmptyState testID="reports-usage-empty" icon="chart-bar" title="No bookings in this period" message="Pick a longer period to see how the gear was used." />
      ) : (
        <UsageTable groups={usage.data.groups} stale={usage.isPlaceholderData} />
      )}
      <DownloadLink label="Download CSV" url={reportUrls.usageCsv(period)} fileName={`voltcrib-usage-${period.from}-to-${period.to}.csv`} testID="reports-usage-csv" />
    </Card>
  );
}

const columns = [
  { key: 'group', label: 'Group', flex: 4, numeric: false },
  { key: 'bookings', label: 'Bookings', flex: 3, numeric: true },
  { key: 'hours', label: 'Hours', flex: 3, numeric: true },
  { key: 'people', label: 'People', flex: 3, numeric: true },
] as const;

function UsageTable({ groups, stale }: { groups: GroupUsage[]; stale: boolean }) {
  const { colors } = useTheme();
  const cell = (flex: number, numeric: boolean) => [styles.cell, { flex }, numeric && styles.numeric];
  return (
    <View role="table" accessibilityLabel="Use per group" testID="reports-usage-table" style={stale && styles.stale}>
      <View role="row" style={[styles.row, { backgroundColor: colors.surfaceMuted }]}>
        {columns.map((c) => (
          <View key={c.key} role="columnheader" style={cell(c.flex, c.numeric)}>
            <AppText variant="smallStrong" tone="muted">
              {c.label}
            </AppText>
          </View>
        ))}
      </View>
      {groups.map((g) => (
        <View key={g.groupName} role="row" style={[styles.row, { borderTopColor: colors.border, borderTopWidth: borders.hairline }]}>
          <View role="cell" style={cell(columns[0].flex, false)}>
            <AppText variant="bodyStrong">{g.groupName}</AppText>
          </View>
          <View role="cell" style={cell(columns[1].flex, true)}>
            <AppText>{String(g.bookings)}</AppText>
          </View>
          <View role="cell" style={cell(columns[2].flex, true)}>
            <AppText>{formatHours(g.hours)}</AppText>
          </View>
          <View role="cell" style={cell(columns[3].flex, true)}>
            <AppText>{String(g.people)}</AppText>
          </View>
        </View>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', alignItems: 'center' },
  cell: { paddingHorizontal: spacing.xs, paddingVertical: spacing.sm, minWidth: 0 },
  numeric: { alignItems: 'flex-end' },
  stale: { opacity: 0.6 },
});
