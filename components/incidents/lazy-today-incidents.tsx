import { lazy, Suspense } from 'react';

import type { Role } from '@/shared/schemas/session';

// Today is in the first download, which has a size budget (tests/e2e/bundle-budget.test.ts): its
// incident cards arrive in their own chunk, and show nothing while it loads.
const TodayIncidents = lazy(() => import('./today-incidents').then((m) => ({ default: m.TodayIncidents })));

export function LazyTodayIncidents({ role }: { role: Role }) {
  return (
    <Suspense fallback={null}>
      <TodayIncidents role={role} />
    </Suspense>
  );
}
