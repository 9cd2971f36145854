import AsyncStorage from '@react-native-async-storage/async-storage';
import { createAsyncStoragePersister } from '@tanstack/query-async-storage-persister';
import { onlineManager, QueryClient } from '@tanstack/react-query';
import type { PersistQueryClientProviderProps } from '@tanstack/react-query-persist-client';
import { Platform } from 'react-native';
import {
  adoptEarlierTicks,
  isUnsentAction,
  registerBenchActions,
  resumeUnsentActions,
} from '@/hooks/queries/bench-actions';
import { ApiError } from './api-client';
import { storageKeys } from './storage';

/** Retry only what another try can fix: no signal or a server hiccup, never a refusal. */
function retryable(e: unknown): boolean {
  return e instanceof ApiError && (e.isNetwork || e.status >= 500);
}

export function makeQueryClient(): QueryClient {
  // TanStack's online manager starts out "online" and hears only changes: a page reloaded without signal
  // would first try to send a tick instead of keeping it. The browser's own word serves at start.
  if (Platform.OS === 'web' && typeof navigator !== 'undefined' && navigator.onLine === false) {
    onlineManager.setOnline(false);
  }
  const qc = new QueryClient({
    defaultOptions: {
      queries: {
        // Ask even when the browser says there is no signal: on the web the service worker answers from
        // what the phone kept (lib/service-worker.web.ts), so a part opens at the bench without signal.
        // Retries still wait for the signal.
        networkMode: 'offlineFirst',
        staleTime: 15_000,
        retry: (count, e) => retryable(e) && count < 2,
        refetchOnWindowFocus: true,
      },
      mutations: {
        // A change survives a moment without signal.
        retry: (count, e) => e instanceof ApiError && e.isNetwork && count < 3,
        retryDelay: (n) => Math.min(8000, 1000 * 2 ** n),
      },
    },
  });
  // Mutations kept on the device need their work registered before they are restored.
  registerBenchActions(qc);
  return qc;
}

let persister: ReturnType<typeof createAsyncStoragePersister> | null = null;

/**
 * What the device keeps between visits: the bench actions not yet through to the server, and nothing else.
 * Answers are the service worker's business (kept per person and emptied at sign-out); keeping them here
 * too would show one person's data to the next. No age limit: an action waits as long as the signal is away.
 */
export function persistOptions(): PersistQueryClientProviderProps['persistOptions'] {
  persister ??= createAsyncStoragePersister({ storage: AsyncStorage, key: storageKeys.queryCache, throttleTime: 200 });
  return {
    persister,
    maxAge: Infinity,
    dehydrateOptions: { shouldDehydrateQuery: () => false, shouldDehydrateMutation: isUnsentAction },
  };
}

/**
 * Once the kept actions are back in the client: take over ticks an earlier version kept, and send them all.
 * Not waited for: queries hold until this returns, and an action may wait long for signal.
 */
export async function afterRestore(qc: QueryClient): Promise<void> {
  await adoptEarlierTicks(qc);
  void resumeUnsentActions(qc);
}

/**
 * At sign-out nothing cached for one person may show to the next. Bench actions not yet through stay:
 * they are work done at the bench, sent once their maker signs in again on this device (bench-actions.ts).
 */
export function clearForNextPerson(qc: QueryClient): void {
  qc.getQueryCache().clear();
  const mutations = qc.getMutationCache();
  for (const m of mutations.getAll()) if (!isUnsentAction(m)) mutations.remove(m);
}
