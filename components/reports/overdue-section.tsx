import { formatDateTime } from '@/components/common/format';
import { AppText } from '@/components/ui/app-text';
import { Card } from '@/components/ui/card';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { HazardBadge } from '@/components/ui/hazard-badge';
import { ListRow } from '@/components/ui/list-row';
import { LoadingState } from '@/components/ui/loading-state';
import { reportUrls, useOverdueBookingsQuery } from '@/hooks/use-reports';

import { DownloadLink } from './download-link';
import { formatOverdueFor } from './format';
import { todayIso } from './period';

/** Gear still out past its booking's end: the people to chase, and what they have. */
export function OverdueSection() {
  const overdue = useOverdueBookingsQuery();
  return (
    <Card title="Overdue now" testID="reports-overdue">
      {overdue.isPending ? (
        <LoadingState label="Loading overdue bookings" testID="reports-overdue-loading" />
      ) : overdue.isError ? (
        <ErrorState
          testID="reports-overdue-error"
          title="Overdue bookings did not load"
          error={overdue.error}
          onRetry={() => void overdue.refetch()}
          retrying={overdue.isRefetching}
        />
      ) : overdue.data.bookings.length === 0 ? (
        <EmptyState testID="reports-overdue-empty" icon="calendar-check" title="Nothing overdue" message="All released gear is inside its booking window." />
      ) : (
        <>
          <HazardBadge
            level="warning"
            detail={overdue.data.bookings.length === 1 ? '1 booking past its end' : `${overdue.data.bookings.length} bookings past their end`}
          />
          <AppText variant="small" tone="muted">
            Gear past its window may still be set up or charged: ask the person to make it safe and return it.
          </AppText>
          {overdue.data.bookings.map((b, index) => (
            <ListRow
              key={b.id}
              testID={`reports-overdue-${b.id}`}
              icon="clipboard-check"
              title={`#${b.id} · ${b.personName}`}
              subtitle={[
                `Ended ${formatDateTime(b.endsAt)} · ${formatOverdueFor(b.endsAt)} overdue`,
                `${b.plannedKv} kV · ${b.itemTags.join(', ') || 'no items'}`,
                b.location,
              ]
                .filter(Boolean)
                .join('\n')}
              divided={index > 0}
            />
          ))}
          {overdue.data.nextCursor ? (
            <AppText variant="small" tone="muted">
              Showing the newest {overdue.data.bookings.length}; the CSV has them all.
            </AppText>
          ) : null}
        </>
      )}
      <DownloadLink label="Download CSV" url={reportUrls.overdueCsv()} fileName={`voltcrib-overdue-${todayIso()}.csv`} testID="reports-overdue-csv" />
    </Card>
  );
}
