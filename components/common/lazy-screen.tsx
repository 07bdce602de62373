import { lazy, Suspense, type ComponentType } from 'react';

import { LoadingState } from '@/components/ui/loading-state';
import { Screen } from '@/components/ui/screen';

/**
 * A screen that arrives in its own chunk, so the first download (sign-in, Today, the shell) stays
 * within the web budget. While the chunk loads, a plain loading screen stands in.
 */
export function lazyScreen<P extends object>(load: () => Promise<ComponentType<P>>, loading: { title: string; label: string }): ComponentType<P> {
  const Loaded = lazy(async () => ({ default: await load() }));
  function LazyScreen(props: P) {
    return (
      <Suspense
        fallback={
          <Screen testID="screen-loading" title={loading.title}>
            <LoadingState label={loading.label} />
          </Screen>
        }
      >
        <Loaded {...props} />
      </Suspense>
    );
  }
  return LazyScreen;
}
