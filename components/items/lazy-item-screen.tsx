import { lazy, Suspense } from 'react';

import { LoadingState } from '@/components/ui/loading-state';
import { Screen } from '@/components/ui/screen';

// The item page with its cards and staff panels is the registry's largest screen; it comes in its
// own chunk so the first download (sign-in, Today) stays within the web budget.
const ItemScreen = lazy(() => import('./item-screen').then((module) => ({ default: module.ItemScreen })));

export function LazyItemScreen({ id, justRegistered }: { id: number; justRegistered?: boolean }) {
  return (
    <Suspense
      fallback={
        <Screen testID="item-screen-loading" title="Gear item">
          <LoadingState label="Loading the item" />
        </Screen>
      }
    >
      <ItemScreen id={id} justRegistered={justRegistered} />
    </Suspense>
  );
}
