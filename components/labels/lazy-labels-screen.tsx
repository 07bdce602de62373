import { lazy, Suspense } from 'react';

import { LoadingState } from '@/components/ui/loading-state';
import { Screen } from '@/components/ui/screen';

const LabelsScreen = lazy(() => import('./labels-screen'));

/** The labels screen, fetched the first time a manager opens it. */
export function LazyLabelsScreen() {
  return (
    <Suspense
      fallback={
        <Screen testID="labels-screen" title="Labels">
          <LoadingState label="Loading labels" />
        </Screen>
      }
    >
      <LabelsScreen />
    </Suspense>
  );
}
