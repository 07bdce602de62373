import { lazy, Suspense } from 'react';

import { LoadingState } from '@/components/ui/loading-state';
import { Screen } from '@/components/ui/screen';

// Manager-only: fetched the first time a manager opens it, not with every phone's first download.
const ReportsScreen = lazy(() => import('./reports-screen').then((m) => ({ default: m.ReportsScreen })));

export function LazyReportsScreen() {
  return (
    <Suspense
      fallback={
        <Screen testID="reports-screen" title="Reports">
          <LoadingState label="Loading reports" />
        </Screen>
      }
    >
      <ReportsScreen />
    </Suspense>
  );
}
