import { lazy, Suspense } from 'react';

import { LoadingState } from '@/components/ui/loading-state';
import { Screen } from '@/components/ui/screen';

// Manager-only: fetched the first time a manager opens it, not with every phone's first download.
const OutboxScreen = lazy(() => import('./outbox-screen').then((m) => ({ default: m.OutboxScreen })));

export function LazyOutboxScreen({ messageId }: { messageId?: string }) {
  return (
    <Suspense
      fallback={
        <Screen testID="outbox-screen" title="Outbox">
          <LoadingState label="Loading messages" />
        </Screen>
      }
    >
      <OutboxScreen messageId={messageId} />
    </Suspense>
  );
}
