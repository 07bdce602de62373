// The person's choice of colours: follow the system (the default, so a lab dimmed for corona
// work turns dark with the device) or keep light or dark whatever the system says. Kept in this
// browser's storage on the web; for the session only elsewhere.
import { useSyncExternalStore } from 'react';

export type ThemePreference = 'system' | 'light' | 'dark';

const KEY = 'voltcrib.theme';
const listeners = new Set<() => void>();

function storage(): Storage | null {
  try {
    return typeof globalThis.localStorage === 'undefined' ? null : globalThis.localStorage;
  } catch {
    return null;
  }
}

function read(): ThemePreference {
  const stored = storage()?.getItem(KEY);
  return stored === 'light' || stored === 'dark' ? stored : 'system';
}

let current: ThemePreference = read();

export function setThemePreference(next: ThemePreference): void {
  current = next;
  if (next === 'system') storage()?.removeItem(KEY);
  else storage()?.setItem(KEY, next);
  for (const listener of listeners) listener();
}

function subscribe(listener: () => void): () => void {
  listeners.add(listener);
  return () => listeners.delete(listener);
}

export function useThemePreference(): ThemePreference {
  return useSyncExternalStore(
    subscribe,
    () => current,
    () => 'system',
  );
}
