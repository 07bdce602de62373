import { lazy, Suspense } from 'react';

import { LoadingState } from '@/components/ui/loading-state';
import { Screen } from '@/components/ui/screen';

// The list with its filters and table comes in its own chunk, keeping the first download (sign-in,
// Today) within the web budget (tests/e2e/bundle-budget.test.ts).
const GearScreen = lazy(() => import('./gear-screen').then((module) => ({ default: module.GearScreen })));

export function LazyGearScreen() {
  return (
    <Suspense
      fallback={
        <Screen testID="gear-screen-loading" title="Gear">
          <LoadingState label="Loading gear" />
        </Screen>
      }
    >
      <GearScreen />
    </Suspense>
  );
}
