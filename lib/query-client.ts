import AsyncStorage from '@react-native-async-storage/async-storage';
import { createAsyncStoragePersister } from '@tanstack/query-async-storage-persister';
import { onlineManager, QueryClient } from '@tanstack/react-query';
import type { PersistQueryClientProviderProps } from '@tanstack/react-query-persist-client';
import { Platform } from 'react-native';
import { adoptEarlierTicks, isUnsentTick, registerTickMutations, resumeUnsentTicks } from '@/hooks/queries/travelers';
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
  registerTickMutations(qc);
  return qc;
}

let persister: ReturnType<typeof createAsyncStoragePersister> | null = null;

/**
 * What the device keeps between visits: the ticks not yet through to the server, and nothing else.
 * Answers are the service worker's business (kept per person and emptied at sign-out); keeping them here
 * too would show one person's data to the next. No age limit: a tick waits as long as the signal is away.
 */
export function persistOptions(): PersistQueryClientProviderProps['persistOptions'] {
  persister ??= createAsyncStoragePersister({ storage: AsyncStorage, key: storageKeys.queryCache, throttleTime: 200 });
  return {
    persister,
    maxAge: Infinity,
    dehydrateOptions: { shouldDehydrateQuery: () => false, shouldDehydrateMutation: isUnsentTick },
  };
}

/**
 * Once the kept ticks are back in the client: take over any an earlier version kept, and send them all.
 * Not waited for: queries hold until this returns, and a tick may wait long for signal.
 */
export async function afterRestore(qc: QueryClient): Promise<void> {
  await adoptEarlierTicks(qc);
  void resumeUnsentTicks(qc);
}

/**
 * At sign-out nothing cached for one person may show to the next. Ticks not yet through stay: they are
 * work done at the bench, sent once someone is signed in again (a 401 keeps them waiting).
 */
export function clearForNextPerson(qc: QueryClient): void {
  qc.getQueryCache().clear();
  const mutations = qc.getMutationCache();
  for (const m of mutations.getAll()) if (!isUnsentTick(m)) mutations.remove(m);
}
