import { lazy, Suspense } from 'react';

import { LoadingState } from '@/components/ui/loading-state';
import { Screen } from '@/components/ui/screen';

import type { ItemFormScreenProps } from './item-form-screen';

const ItemFormScreen = lazy(() => import('./item-form-screen'));

/** The item form, fetched the first time a manager opens it. */
export function LazyItemFormScreen(props: ItemFormScreenProps) {
  return (
    <Suspense
      fallback={
        <Screen testID="item-form-screen" title="Gear form" width="form">
          <LoadingState label="Loading the form" />
        </Screen>
      }
    >
      <ItemFormScreen {...props} />
    </Suspense>
  );
}
