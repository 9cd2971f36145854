import { useCallback, useSyncExternalStore } from 'react';

/**
 * One-time messages handed from one screen to the next (e.g. "finding sent" back on the traveler),
 * without putting them in the URL where a reload would show them again.
 */
const store = new Map<string, string>();
const listeners = new Set<() => void>();

export function setFlash(key: string, value: string): void {
  store.set(key, value);
  listeners.forEach((l) => l());
}

export function useFlash(key: string): [string | null, () => void] {
  const value = useSyncExternalStore(
    (l) => {
      listeners.add(l);
      return () => listeners.delete(l);
    },
    () => store.get(key) ?? null,
    () => null,
  );
  const clear = useCallback(() => {
    store.delete(key);
    listeners.forEach((l) => l());
  }, [key]);
  return [value, clear];
}
