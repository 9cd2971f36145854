import { QueryClient } from '@tanstack/react-query';
import { ApiError } from './api-client';

/** Retry only what another try can fix: no signal or a server hiccup, never a refusal. */
function retryable(e: unknown): boolean {
  return e instanceof ApiError && (e.isNetwork || e.status >= 500);
}

export function makeQueryClient(): QueryClient {
  return new QueryClient({
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
        // A tick at the bench survives a moment without signal.
        retry: (count, e) => e instanceof ApiError && e.isNetwork && count < 3,
        retryDelay: (n) => Math.min(8000, 1000 * 2 ** n),
      },
    },
  });
}
