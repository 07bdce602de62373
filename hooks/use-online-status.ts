// Whether the app can reach the network, from the browser's own online/offline signal, shared
// with react-query's onlineManager so queries and mutations pause while offline instead of failing
// one by one. On devices without that signal the app counts as online.
import { onlineManager } from '@tanstack/react-query';
import { useSyncExternalStore } from 'react';

function browserOnline(): boolean | null {
  return typeof navigator !== 'undefined' && typeof navigator.onLine === 'boolean' ? navigator.onLine : null;
}

// react-query starts out assuming it is online and only listens for changes; a page opened
// without a network (from the service worker's cache) must start out offline.
const initial = browserOnline();
if (initial !== null) onlineManager.setOnline(initial);

function subscribe(onChange: () => void): () => void {
  return onlineManager.subscribe(() => onChange());
}

/** True while online; re-renders when the connection drops or comes back. */
export function useOnlineStatus(): boolean {
  return useSyncExternalStore(
    subscribe,
    () => onlineManager.isOnline(),
    () => true,
  );
}
