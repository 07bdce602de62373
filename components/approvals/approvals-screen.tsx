import { useState } from 'react';

import { Badge } from '@/components/ui/badge';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { LoadingState } from '@/components/ui/loading-state';
import { Screen } from '@/components/ui/screen';
import { AppText } from '@/components/ui/app-text';
import { LoadMore } from '@/components/ui/load-more';
import { useBookingsInfiniteQuery } from '@/hooks/use-bookings';
import { useCurrentUser } from '@/hooks/use-session';

import { ApprovalCard } from './approval-card';

/** The officer's queue: tests above the lab's limits, oldest request last (newest first). */
export function ApprovalsScreen() {
  const user = useCurrentUser();
  const queue = useBookingsInfiniteQuery({ mine: false, status: 'awaiting-approval' });
  const [openId, setOpenId] = useState<number | null>(null);
  const [lastDecision, setLastDecision] = useState<string | null>(null);
  const rows = queue.data?.pages.flatMap((page) => page.bookings) ?? [];
  // The first booking someone else made is the one to decide: open it without a tap.
  const firstDecidable = rows.find((b) => b.personId !== user?.id)?.id ?? null;
  const open = openId ?? firstDecidable;

  return (
    <Screen testID="approvals-screen" title="Approvals">
      <AppText tone="muted">
        Tests above the lab&apos;s approval voltage or energy threshold, or beyond the member&apos;s qualification. An approval covers the plan as it stands;
        any change voids it.
      </AppText>
      {lastDecision ? <Badge label={lastDecision} icon="check-circle" tone="primary" testID="approvals-last-decision" /> : null}
      {queue.isPending ? (
        <LoadingState label="Loading the queue" />
      ) : queue.isError ? (
        <ErrorState title="The queue did not load" error={queue.error} onRetry={() => void queue.refetch()} retrying={queue.isFetching} />
      ) : rows.length === 0 ? (
        <EmptyState
          testID="approvals-empty"
          icon="clipboard-check"
          title="Nothing waiting"
          message="No test is waiting for a decision. New requests arrive here and by e-mail."
        />
      ) : (
        rows.map((summary) => (
          <ApprovalCard
            key={summary.id}
            summary={summary}
            own={summary.personId === user?.id}
            open={open === summary.id}
            onOpen={() => setOpenId(summary.id)}
            onDecided={(decision) => {
              setOpenId(null);
              setLastDecision(`${decision === 'approve' ? 'Approved' : 'Refused'}: booking ${summary.id} (${summary.personName})`);
            }}
          />
        ))
      )}
      <LoadMore query={queue} failedText="More bookings did not load. Try again." testID="approvals-more" />
    </Screen>
  );
}
