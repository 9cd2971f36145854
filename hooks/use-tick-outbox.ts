import { useQueryClient, type QueryClient } from '@tanstack/react-query';
import { useEffect, useState } from 'react';
import { ApiError, errorMessage } from '@/lib/api-client';
import { postTick, travelerKeys } from './queries/travelers';
import { dropTick, onOutboxChange, readOutbox, type PendingTick } from '@/lib/tick-outbox';

const RETRY_MS = 5000;
let flushing = false;
const refusals = new Set<(text: string) => void>();

/** Whether trying again later can help: no signal, the server down, or a sign-in to renew first. */
const worthRetrying = (e: unknown) => e instanceof ApiError && (e.isNetwork || e.status >= 500 || e.status === 401);

/** Sends the waiting ticks in the order they were made; stops at the first that cannot get through. */
export async function flushOutbox(qc: QueryClient): Promise<void> {
  if (flushing) return;
  flushing = true;
  try {
    for (const t of await readOutbox()) {
      try {
        await postTick(t.travelerId, t);
        await dropTick(t.id);
      } catch (e) {
        if (worthRetrying(e)) break;
        // Refused for good (the hole went under a finding meanwhile, say): say so rather than keep it.
        await dropTick(t.id);
        refusals.forEach((r) =>
          r(`A tick made without signal (${t.holeIds.join(', ')}) was not saved: ${errorMessage(e)}`),
        );
      }
      await qc.invalidateQueries({ queryKey: travelerKeys.detail(t.travelerId) });
    }
  } finally {
    flushing = false;
  }
}

/** Mounted once for a signed-in person: keeps trying the waiting ticks, and at once when the signal returns. */
export function useTickOutboxSender(): void {
  const qc = useQueryClient();
  useEffect(() => {
    const run = () => void flushOutbox(qc);
    run();
    const timer = setInterval(run, RETRY_MS);
    const w = typeof window !== 'undefined' && typeof window.addEventListener === 'function' ? window : null;
    w?.addEventListener('online', run);
    return () => {
      clearInterval(timer);
      w?.removeEventListener('online', run);
    };
  }, [qc]);
}

/** The ticks of one traveler still on the device, and the last refusal of one, for the bench to show. */
export function usePendingTicks(travelerId: string): {
  pending: PendingTick[];
  refused: string | null;
  clearRefused: () => void;
} {
  const [all, setAll] = useState<PendingTick[]>([]);
  const [refused, setRefused] = useState<string | null>(null);
  useEffect(() => {
    let live = true;
    void readOutbox().then((t) => live && setAll(t));
    const off = onOutboxChange(setAll);
    refusals.add(setRefused);
    return () => {
      live = false;
      off();
      refusals.delete(setRefused);
    };
  }, []);
  return { pending: all.filter((t) => t.travelerId === travelerId), refused, clearRefused: () => setRefused(null) };
}
