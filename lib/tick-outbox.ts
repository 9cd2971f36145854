import type { TickHolesInput, TravelerDetail } from '@/db/contracts';
import { readJson, storageKeys, writeJson } from './storage';

/**
 * Ticks made at the bench without signal wait here, on the device, until they reach the server: a
 * reload or a closed tab loses none of them. Kept in the order they were made, and sent in that order.
 */
export type PendingTick = TickHolesInput & { id: string; travelerId: string; at: string };

type Listener = (ticks: PendingTick[]) => void;
const listeners = new Set<Listener>();
// One chain of writes, so two ticks queued at the same moment cannot overwrite each other.
let chain: Promise<unknown> = Promise.resolve();

export async function readOutbox(): Promise<PendingTick[]> {
  return (await readJson<PendingTick[]>(storageKeys.tickOutbox)) ?? [];
}

function update(change: (ticks: PendingTick[]) => PendingTick[]): Promise<PendingTick[]> {
  const next = chain.then(async () => {
    const ticks = change(await readOutbox());
    await writeJson(storageKeys.tickOutbox, ticks);
    listeners.forEach((l) => l(ticks));
    return ticks;
  });
  chain = next.catch(() => undefined);
  return next;
}

export function queueTick(travelerId: string, input: TickHolesInput): Promise<PendingTick[]> {
  const tick: PendingTick = {
    ...input,
    travelerId,
    id: `${Date.now()}-${Math.random().toString(36).slice(2, 8)}`,
    at: new Date().toISOString(),
  };
  return update((ticks) => [...ticks, tick]);
}

export const dropTick = (id: string) => update((ticks) => ticks.filter((t) => t.id !== id));

export function onOutboxChange(listener: Listener): () => void {
  listeners.add(listener);
  return () => listeners.delete(listener);
}

/** What the server's copy of a traveler looks like once the ticks still on the device are counted in. */
export function withPendingTicks(
  detail: TravelerDetail,
  pending: PendingTick[],
  apply: (d: TravelerDetail, t: TickHolesInput) => TravelerDetail,
): TravelerDetail {
  return pending.filter((t) => t.travelerId === detail.id).reduce((d, t) => apply(d, t), detail);
}
