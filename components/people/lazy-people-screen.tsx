import { lazy, Suspense } from 'react';

import { LoadingState } from '@/components/ui/loading-state';
import { Screen } from '@/components/ui/screen';

// Manager-only: fetched the first time a manager opens it, not with every phone's first download.
const PeopleScreen = lazy(() => import('./people-screen').then((m) => ({ default: m.PeopleScreen })));

export function LazyPeopleScreen({ personId }: { personId?: string }) {
  return (
    <Suspense
      fallback={
        <Screen testID="people-screen" title="People">
          <LoadingState label="Loading people" />
        </Screen>
      }
    >
      <PeopleScreen personId={personId} />
    </Suspense>
  );
}
