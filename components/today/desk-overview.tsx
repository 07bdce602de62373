import { Badge } from '@/components/ui/badge';
import { Card } from '@/components/ui/card';
import { ErrorState } from '@/components/ui/error-state';
import { ListRow } from '@/components/ui/list-row';
import { LoadingState } from '@/components/ui/loading-state';
import { useDeskOverviewQuery } from '@/hooks/use-reports';
import type { Role } from '@/shared/schemas/session';

const plural = (n: number, one: string, many: string) => `${n} ${n === 1 ? one : many}`;

/**
 * The officer's and manager's desk: what in the whole lab needs someone now. Each line says its
 * count in words (never a bare number beside a title) and opens where it can be dealt with.
 */
export function DeskOverview({ role }: { role: Role }) {
  const desk = useDeskOverviewQuery(role !== 'member');
  if (role === 'member') return null;
  return (
    <Card title="The lab now" flush testID="today-desk">
      {desk.isPending ? (
        <LoadingState label="Loading the lab's overview" />
      ) : desk.isError ? (
        <ErrorState title="The overview did not load" error={desk.error} onRetry={() => void desk.refetch()} retrying={desk.isFetching} />
      ) : (
        <>
          <ListRow
            testID="today-desk-gear-out"
            icon="tools"
            href="/bookings"
            title={desk.data.gearOut === 0 ? 'No gear out now' : `${plural(desk.data.gearOut, 'booking has', 'bookings have')} gear out now`}
            trailing={desk.data.overdue > 0 ? <Badge label={`${desk.data.overdue} overdue`} icon="alert-circle" testID="today-desk-overdue" /> : null}
          />
          <ListRow
            testID="today-desk-inspections"
            icon="shield-check"
            href={role === 'manager' ? '/reports' : '/gear'}
            title={inspectionWords(desk.data.inspections)}
            subtitle="Never inspected or overdue gear cannot be released"
            divided
          />
          <ListRow
            testID="today-desk-tagged-out"
            icon="cancel"
            href="/gear"
            title={desk.data.taggedOut === 0 ? 'No gear tagged out' : `${plural(desk.data.taggedOut, 'item', 'items')} tagged out of service`}
            divided
          />
          {/* Officers have the queue's own card below; a manager sees the count here. */}
          {role === 'officer' ? null : (
            <ListRow
              testID="today-desk-approvals"
              icon="clipboard-check"
              title={
                desk.data.approvalsWaiting === 0
                  ? 'No test waits for a safety officer'
                  : `${plural(desk.data.approvalsWaiting, 'test waits', 'tests wait')} for a safety officer`
              }
              divided
            />
          )}
        </>
      )}
    </Card>
  );
}

function inspectionWords(i: { neverDone: number; overdue: number; dueSoon: number }): string {
  const parts = [
    i.neverDone > 0 ? `${i.neverDone} never inspected` : null,
    i.overdue > 0 ? `${i.overdue} overdue` : null,
    i.dueSoon > 0 ? `${i.dueSoon} due soon` : null,
  ].filter(Boolean);
  return parts.length === 0 ? 'No inspection due' : `Inspections: ${parts.join(', ')}`;
}
