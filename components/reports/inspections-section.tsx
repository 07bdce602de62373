import { formatCalendarDate } from '@/components/people/qualification';
import { AppText } from '@/components/ui/app-text';
import { Badge } from '@/components/ui/badge';
import { Card } from '@/components/ui/card';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { ListRow } from '@/components/ui/list-row';
import { LoadingState } from '@/components/ui/loading-state';
import { INSPECTIONS_DUE_LIMIT, reportUrls, useInspectionsDueQuery } from '@/hooks/use-reports';
import { DUE_SOON_DAYS } from '@/shared/schemas/items';

import { DownloadLink } from './download-link';
import { todayIso } from './period';

/** Gear whose inspection is overdue or due within the lab's notice window, soonest first. */
export function InspectionsSection() {
  const due = useInspectionsDueQuery();
  return (
    <Card title="Inspections due" testID="reports-inspections">
      <AppText variant="small" tone="muted">
        Never inspected, overdue, or due within {DUE_SOON_DAYS} days. A missing or overdue inspection blocks release of the item.
      </AppText>
      {due.isPending ? (
        <LoadingState label="Loading inspections due" testID="reports-inspections-loading" />
      ) : due.isError ? (
        <ErrorState
          testID="reports-inspections-error"
          title="Inspections due did not load"
          error={due.error}
          onRetry={() => void due.refetch()}
          retrying={due.isRefetching}
        />
      ) : due.data.items.length === 0 ? (
        <EmptyState
          testID="reports-inspections-empty"
          icon="shield-check"
          title="No inspections due"
          message={`Nothing is overdue or due in the next ${DUE_SOON_DAYS} days.`}
        />
      ) : (
        <>
          {due.data.items.map((item, index) => {
            const overdue = item.state === 'overdue';
            return (
              <ListRow
                key={item.id}
                testID={`reports-inspection-${item.id}`}
                icon="tools"
                title={`${item.tag} · ${item.name}`}
                subtitle={[
                  item.nextInspectionDue ? `${overdue ? 'Was due' : 'Due'} ${formatCalendarDate(item.nextInspectionDue)}` : 'Never inspected: blocks release',
                  item.location,
                ]
                  .filter(Boolean)
                  .join('\n')}
                href={{ pathname: '/gear/[id]', params: { id: String(item.id) } }}
                trailing={
                  item.state === 'never' ? (
                    <Badge label="Never inspected" icon="alert-circle" />
                  ) : overdue ? (
                    <Badge label="Overdue" icon="alert-circle" />
                  ) : (
                    <Badge label="Due soon" tone="muted" />
                  )
                }
                divided={index > 0}
              />
            );
          })}
          {due.data.more ? (
            <AppText variant="small" tone="muted">
              Showing the first {INSPECTIONS_DUE_LIMIT}; the CSV has them all.
            </AppText>
          ) : null}
        </>
      )}
      <DownloadLink
        label="Download CSV"
        url={reportUrls.inspectionsCsv()}
        fileName={`voltcrib-inspections-${todayIso()}.csv`}
        testID="reports-inspections-csv"
      />
    </Card>
  );
}
