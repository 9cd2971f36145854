import {
  infiniteQueryOptions,
  keepPreviousData,
  queryOptions,
  useInfiniteQuery,
  useMutation,
  useQuery,
  useQueryClient,
  type QueryClient,
} from '@tanstack/react-query';
import {
  holesAwaitingInspectorStatuses,
  holesDoneStatuses,
  type Hole,
  type LabelsQuery,
  type PartLabel,
  type TickHolesInput,
  type TravelerDetail,
  type Page,
  type TravelerListShow,
  type TravelerSummary,
  type WithdrawSignOffInput,
} from '@/db/contracts';
import { api, ApiError } from '@/lib/api-client';
import { queueTick, readOutbox, withPendingTicks } from '@/lib/tick-outbox';
import { buildKeys } from './builds';
import { pageParams, pagePath } from './paged';

/** The server's filters of GET /api/travelers (db/contracts/travelers.ts `travelerListQuery`). */
export type TravelerFilters = { show?: TravelerListShow; q?: string };

export type TravelerStep = TravelerDetail['steps'][number];

export const travelerKeys = {
  all: ['travelers'] as const,
  lists: () => [...travelerKeys.all, 'list'] as const,
  /** One list's key with its filters; with none, the prefix of every list (what a change invalidates). */
  list: (f?: TravelerFilters) =>
    f ? ([...travelerKeys.lists(), { show: f.show ?? 'all', q: f.q?.trim() ?? '' }] as const) : travelerKeys.lists(),
  details: () => [...travelerKeys.all, 'detail'] as const,
  detail: (id: string) => [...travelerKeys.details(), id] as const,
  lookup: (code: string) => [...travelerKeys.all, 'lookup', code] as const,
  labels: (q: LabelsQuery) => [...travelerKeys.all, 'labels', q.buildId ?? null, q.travelerId ?? null] as const,
  /** Mutation key for ticks, so a burst of taps refetches only once, after the last one. */
  tick: (id: string) => [...travelerKeys.all, 'tick', id] as const,
};

export const travelerQueries = {
  /** The parts in pages, live ones first, by serial; the server's filters go with every page. */
  list: (f: TravelerFilters = {}) =>
    infiniteQueryOptions({
      queryKey: travelerKeys.list(f),
      queryFn: ({ pageParam, signal }) =>
        api.get<Page<TravelerSummary>>(
          pagePath('/api/travelers', pageParam, {
            show: f.show && f.show !== 'all' ? f.show : undefined,
            q: f.q?.trim() || undefined,
          }),
          signal,
        ),
      ...pageParams,
    }),
  detail: (id: string) =>
    queryOptions({
      queryKey: travelerKeys.detail(id),
      // Ticks still waiting on the device are shown as made, whatever the server has seen so far.
      queryFn: async ({ signal }) =>
        withPendingTicks(
          await api.get<TravelerDetail>(`/api/travelers/${encodeURIComponent(id)}`, signal),
          await readOutbox(),
          applyTick,
        ),
    }),
  lookup: (code: string) =>
    queryOptions({
      queryKey: travelerKeys.lookup(code),
      queryFn: ({ signal }) =>
        api.get<{ id: string }>(`/api/travelers/lookup?code=${encodeURIComponent(code)}`, signal),
      staleTime: 60_000,
      retry: false,
    }),
  labels: (q: LabelsQuery) =>
    queryOptions({
      queryKey: travelerKeys.labels(q),
      queryFn: ({ signal }) => {
        const qs = q.travelerId
          ? `travelerId=${encodeURIComponent(q.travelerId)}`
          : `buildId=${encodeURIComponent(q.buildId ?? '')}`;
        return api.get<PartLabel[]>(`/api/travelers/labels?${qs}`, signal);
      },
      // A refusal (loopback address, not allowed) will not change by asking again.
      retry: false,
    }),
};

/** QR labels of a whole build or of one part. */
export function useLabelsQuery(q: LabelsQuery) {
  return useQuery({ ...travelerQueries.labels(q), enabled: !!(q.buildId || q.travelerId) });
}

/**
 * The parts list, a page at a time: `pagedItems(q.data)` are the rows so far, `fetchNextPage` asks for
 * more. `keepPrevious` shows the last filters' rows while the new ones load (typing does not blank the list).
 */
export function useTravelersQuery(filters: TravelerFilters = {}, opts: { keepPrevious?: boolean } = {}) {
  return useInfiniteQuery({
    ...travelerQueries.list(filters),
    placeholderData: opts.keepPrevious ? keepPreviousData : undefined,
  });
}

export function useTravelerQuery(id: string) {
  return useQuery({ ...travelerQueries.detail(id), enabled: !!id });
}

export function useTravelerLookupQuery(code: string) {
  return useQuery({ ...travelerQueries.lookup(code), enabled: code.trim().length >= 4 });
}

/** Imperative look-up for the scanner and the short-code box. */
export function lookupTraveler(qc: QueryClient, code: string): Promise<{ id: string }> {
  return qc.fetchQuery(travelerQueries.lookup(code.trim()));
}

/** Holes done for good and holes waiting for the inspector, by the rules module's groupings. */
export function countHoles(holes: readonly Pick<Hole, 'status'>[]): { done: number; awaiting: number } {
  let done = 0;
  let awaiting = 0;
  for (const h of holes) {
    if (holesDoneStatuses.includes(h.status)) done++;
    else if (holesAwaitingInspectorStatuses.includes(h.status)) awaiting++;
  }
  return { done, awaiting };
}

function recount(detail: TravelerDetail, holes: Hole[]): TravelerDetail {
  const c = countHoles(holes);
  return { ...detail, holes, holesDone: c.done, holesAwaitingInspector: c.awaiting };
}

/** The change a tick makes on the client before the server answers: only pending ↔ installed move. */
export function applyTick(detail: TravelerDetail, input: TickHolesInput): TravelerDetail {
  const ids = new Set(input.holeIds);
  const holes = detail.holes.map((h) =>
    ids.has(h.holeId) && (h.status === 'pending' || h.status === 'installed') ? { ...h, status: input.status } : h,
  );
  return recount(detail, holes);
}

function mergeHoles(detail: TravelerDetail, changed: Hole[]): TravelerDetail {
  const byId = new Map(changed.map((h) => [h.holeId, h]));
  const holes = detail.holes.map((h) => byId.get(h.holeId) ?? h);
  return recount(detail, holes);
}

export const postTick = (travelerId: string, input: TickHolesInput) =>
  api.post<{ holes: Hole[] }>(`/api/travelers/${encodeURIComponent(travelerId)}/holes`, {
    holeIds: input.holeIds,
    status: input.status,
  });

/**
 * Ticking holes: shown at once (optimistic), rolled back with a message if the server refuses. With no
 * signal the tick is not rolled back: it waits on the device and is sent when the signal returns.
 */
export function useTravelerTickMutation(travelerId: string) {
  const qc = useQueryClient();
  const key = travelerKeys.detail(travelerId);
  return useMutation({
    mutationKey: travelerKeys.tick(travelerId),
    // Run even when the browser says it is offline: the tick then goes to the device's outbox at once
    // instead of waiting in memory, where a reload would lose it.
    networkMode: 'always',
    retry: false,
    mutationFn: async (input: TickHolesInput): Promise<{ holes: Hole[]; queued?: true }> => {
      try {
        return await postTick(travelerId, input);
      } catch (e) {
        if (!(e instanceof ApiError && e.isNetwork)) throw e;
        await queueTick(travelerId, input);
        return { holes: [], queued: true };
      }
    },
    onMutate: async (input) => {
      await qc.cancelQueries({ queryKey: key });
      const previous = qc.getQueryData<TravelerDetail>(key);
      if (previous) qc.setQueryData<TravelerDetail>(key, applyTick(previous, input));
      return { previous };
    },
    onError: (_e, input, ctx) => {
      // Undo only this tick, keeping any other tick made meanwhile.
      const now = qc.getQueryData<TravelerDetail>(key);
      const before = ctx?.previous;
      if (!now || !before) return;
      const prior = new Map(before.holes.map((h) => [h.holeId, h]));
      qc.setQueryData<TravelerDetail>(
        key,
        mergeHoles(
          now,
          input.holeIds.map((id) => prior.get(id)).filter((h): h is Hole => !!h),
        ),
      );
    },
    onSuccess: (res) => {
      const now = qc.getQueryData<TravelerDetail>(key);
      if (now && res?.holes) qc.setQueryData<TravelerDetail>(key, mergeHoles(now, res.holes));
    },
    onSettled: () => {
      if (qc.isMutating({ mutationKey: travelerKeys.tick(travelerId) }) > 1) return undefined;
      return Promise.all([
        qc.invalidateQueries({ queryKey: key }),
        qc.invalidateQueries({ queryKey: travelerKeys.list() }),
        qc.invalidateQueries({ queryKey: buildKeys.all }),
      ]);
    },
  });
}

export function useTravelerStepMutation(travelerId: string) {
  const qc = useQueryClient();
  const key = travelerKeys.detail(travelerId);
  return useMutation({
    mutationFn: ({ stepId, done }: { stepId: string; done: boolean }) =>
      api.post<TravelerStep>(`/api/travelers/${encodeURIComponent(travelerId)}/steps/${encodeURIComponent(stepId)}`, {
        done,
      }),
    onMutate: async ({ stepId, done }) => {
      await qc.cancelQueries({ queryKey: key });
      const previous = qc.getQueryData<TravelerDetail>(key);
      if (previous) {
        qc.setQueryData<TravelerDetail>(key, {
          ...previous,
          steps: previous.steps.map((s) =>
            s.id === stepId ? { ...s, doneAt: done ? new Date().toISOString() : null } : s,
          ),
        });
      }
      return { previous };
    },
    onError: (_e, _v, ctx) => {
      if (ctx?.previous) qc.setQueryData(key, ctx.previous);
    },
    // A step done can make the part ready to sign off: the readiness and the build's count come from the server.
    onSettled: () =>
      Promise.all([qc.invalidateQueries({ queryKey: key }), qc.invalidateQueries({ queryKey: buildKeys.all })]),
  });
}

export function useTravelerSignOffMutation(travelerId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => api.post<TravelerDetail>(`/api/travelers/${encodeURIComponent(travelerId)}/sign-off`),
    onSuccess: (detail) => {
      qc.setQueryData(travelerKeys.detail(travelerId), detail);
      return Promise.all([
        qc.invalidateQueries({ queryKey: travelerKeys.list() }),
        qc.invalidateQueries({ queryKey: buildKeys.all }),
      ]);
    },
  });
}

/** Takes a part's sign-off back, with the inspector's reason; the answer is the part as it now stands. */
export function useTravelerWithdrawSignOffMutation(travelerId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: WithdrawSignOffInput) =>
      api.post<TravelerDetail>(`/api/travelers/${encodeURIComponent(travelerId)}/sign-off/withdraw`, input),
    onSuccess: (detail) => {
      qc.setQueryData(travelerKeys.detail(travelerId), detail);
      return Promise.all([
        qc.invalidateQueries({ queryKey: travelerKeys.list() }),
        qc.invalidateQueries({ queryKey: buildKeys.all }),
      ]);
    },
  });
}
