import { StyleSheet } from 'react-native';

import { AppText } from '@/components/ui/app-text';
import { Card } from '@/components/ui/card';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { LoadingState } from '@/components/ui/loading-state';
import { Table, TableCell, TableRow } from '@/components/ui/table';
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
        <EmptyState
          testID="reports-usage-empty"
          icon="chart-bar"
          title="No bookings in this period"
          message="Pick a longer period to see how the gear was used."
        />
      ) : (
        <UsageTable groups={usage.data.groups} stale={usage.isPlaceholderData} />
      )}
      <DownloadLink
        label="Download CSV"
        url={reportUrls.usageCsv(period)}
        fileName={`voltcrib-usage-${period.from}-to-${period.to}.csv`}
        testID="reports-usage-csv"
      />
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
  const [groupColumn, bookingsColumn, hoursColumn, peopleColumn] = columns;
  return (
    <Table label="Use per group" columns={columns} testID="reports-usage-table" style={stale && styles.stale}>
      {groups.map((g) => (
        <TableRow key={g.groupName}>
          <TableCell column={groupColumn}>
            <AppText variant="bodyStrong">{g.groupName}</AppText>
          </TableCell>
          <TableCell column={bookingsColumn}>
            <AppText>{String(g.bookings)}</AppText>
          </TableCell>
          <TableCell column={hoursColumn}>
            <AppText>{formatHours(g.hours)}</AppText>
          </TableCell>
          <TableCell column={peopleColumn}>
            <AppText>{String(g.people)}</AppText>
          </TableCell>
        </TableRow>
      ))}
    </Table>
  );
}

const styles = StyleSheet.create({
  stale: { opacity: 0.6 },
});
