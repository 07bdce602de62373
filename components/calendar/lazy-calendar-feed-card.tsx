import { lazy, Suspense } from 'react';

import { LoadingState } from '@/components/ui/loading-state';
import type { Role } from '@/shared/schemas/session';

// The account screen is in the first download; the feed card arrives in its own chunk.
const CalendarFeedCard = lazy(() => import('./calendar-feed-card').then((m) => ({ default: m.CalendarFeedCard })));

export function LazyCalendarFeedCard({ role }: { role: Role }) {
  return (
    <Suspense fallback={<LoadingState label="Loading your calendar feed" />}>
      <CalendarFeedCard role={role} />
    </Suspense>
  );
}
