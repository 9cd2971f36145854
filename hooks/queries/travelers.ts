import {
  keepPreviousData,
  matchMutation,
  queryOptions,
  useInfiniteQuery,
  useMutation,
  useMutationState,
  useQuery,
  useQueryClient,
  type Mutation,
  type MutateOptions,
  type QueryClient,
} from '@tanstack/react-query';
import { useCallback, useMemo } from 'react';
import {
  holesAwaitingInspectorStatuses,
  holesDoneStatuses,
  tickHolesInput,
  type Hole,
  type LabelsQuery,
  type MoveRevisionInput,
  type PartLabel,
  type StepInput,
  type TickHolesInput,
  type TravelerDetail,
  type Page,
  type TravelerListShow,
  type TravelerSummary,
  type WithdrawSignOffInput,
  type WorkHoursInput,
  type WorkPhotosInput,
  type WorkStartInput,
  type WorkStopInput,
} from '@/db/contracts';
import { api, ApiError, errorMessage } from '@/lib/api-client';
import { workPhotosFormData, type DraftPhoto } from '@/lib/photo-form-data';
import { readJson, removeKey, storageKeys } from '@/lib/storage';
import { buildKeys } from './builds';
import { invalidateAll, useRecordMutation } from './mutations';
import { pagedQueryOptions } from './paged';

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
  /** Mutation keys of ticks: every part's (their defaults; what is kept on the device), and one part's. */
  ticks: () => [...travelerKeys.all, 'tick'] as const,
  tick: (id: string) => [...travelerKeys.ticks(), id] as const,
};

/** GET of one part's traveler: its query's, and components/navigation/early-arrival.web.ts's when the app opens at the part. */
export const travelerDetailPath = (id: string) => `/api/travelers/${encodeURIComponent(id)}`;

export const travelerQueries = {
  /** The parts in pages, live ones first, by serial; the server's filters go with every page. */
  list: (f: TravelerFilters = {}) =>
    pagedQueryOptions<Page<TravelerSummary>>(travelerKeys.list(f), '/api/travelers', {
      show: f.show && f.show !== 'all' ? f.show : undefined,
      q: f.q?.trim() || undefined,
    }),
  detail: (id: string) =>
    queryOptions({
      queryKey: travelerKeys.detail(id),
      // Ticks not yet through to the server are shown as made, whatever the server has seen so far.
      queryFn: async ({ signal, client }) =>
        withUnsentTicks(await api.get<TravelerDetail>(travelerDetailPath(id), signal), client),
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

/** A tick as it travels: the holes and their new state, the part, and the moment it was made on the device. */
export type TickVariables = TickHolesInput & { travelerId: string; at: string };
type TickResult = { holes: Hole[] };
/** The holes a tick touched as they were before it, to undo it alone if refused (kept small: it is stored with the tick). */
type TickContext = { before: Hole[] };

/**
 * Sends one tick: exactly what the API's contract takes (`tickHolesInput`). The moment it was made on
 * the device (`at`) stays with the tick while it waits and goes as `doneAt`; `sentAt`, read as it
 * leaves, lets the server tell a late tick from a device clock that is off.
 */
const postTick = (t: TickVariables) =>
  api.post<TickResult>(`/api/travelers/${encodeURIComponent(t.travelerId)}/holes`, {
    holeIds: t.holeIds,
    status: t.status,
    doneAt: t.at,
    sentAt: new Date().toISOString(),
  } satisfies TickHolesInput);

/** Worth another try later: no signal, the server down, or a sign-in to renew first. A refusal is final. */
const worthWaiting = (e: unknown) => e instanceof ApiError && (e.isNetwork || e.status >= 500 || e.status === 401);
/** Tries while the browser says there is signal but the server cannot be reached are spaced up to this. */
const TICK_RETRY_CAP_MS = 15_000;
/** How long a refused tick's message stays for the bench to read, unless dismissed. */
const REFUSAL_KEPT_MS = 30 * 60_000;

/** A tick not yet through to the server: on its way, waiting for signal, or for a new sign-in. */
export const isUnsentTick = (m: Mutation) => matchMutation({ mutationKey: travelerKeys.ticks(), status: 'pending' }, m);

function unsentTicks(qc: QueryClient, travelerId: string): TickVariables[] {
  return qc
    .getMutationCache()
    .findAll({ mutationKey: travelerKeys.tick(travelerId), status: 'pending' })
    .map((m) => m.state.variables as TickVariables | undefined)
    .filter((v): v is TickVariables => !!v);
}

/** The server's copy of a part with the ticks not yet through counted in, oldest first. */
export function withUnsentTicks(detail: TravelerDetail, qc: QueryClient): TravelerDetail {
  return unsentTicks(qc, detail.id).reduce((d, t) => applyTick(d, t), detail);
}

/**
 * Ticking holes, registered once on the query client under the ticks' key, so a tick kept on the device
 * (lib/query-client.ts persists the unsent ones) finds its way to the server after a reload too. Shown at
 * once (optimistic); refused, only that tick is taken back. Without signal TanStack Query pauses it (its
 * online manager) and sends it when the signal returns; with signal but no server it tries again, spaced out.
 */
export function registerTickMutations(qc: QueryClient): void {
  qc.setMutationDefaults(travelerKeys.ticks(), tickMutationOptions(qc));
}

function tickMutationOptions(qc: QueryClient) {
  return {
    mutationFn: (t: TickVariables) => postTick(t),
    // One queue for every part: ticks reach the server in the order they were made.
    scope: { id: 'ticks' },
    retry: (_count: number, e: unknown) => worthWaiting(e),
    retryDelay: (n: number) => Math.min(TICK_RETRY_CAP_MS, 1000 * 2 ** n),
    gcTime: REFUSAL_KEPT_MS,
    onMutate: async (t: TickVariables): Promise<TickContext> => {
      const key = travelerKeys.detail(t.travelerId);
      await qc.cancelQueries({ queryKey: key });
      const now = qc.getQueryData<TravelerDetail>(key);
      if (!now) return { before: [] };
      const ids = new Set(t.holeIds);
      qc.setQueryData<TravelerDetail>(key, applyTick(now, t));
      return { before: now.holes.filter((h) => ids.has(h.holeId)) };
    },
    onError: (_e: unknown, t: TickVariables, ctx: TickContext | undefined) => {
      // Undo only this tick, keeping any other tick made meanwhile.
      const key = travelerKeys.detail(t.travelerId);
      const now = qc.getQueryData<TravelerDetail>(key);
      if (now && ctx?.before.length) qc.setQueryData<TravelerDetail>(key, mergeHoles(now, ctx.before));
    },
    onSuccess: (data: unknown, t: TickVariables) => {
      const res = data as TickResult | undefined;
      const key = travelerKeys.detail(t.travelerId);
      const now = qc.getQueryData<TravelerDetail>(key);
      if (now && res?.holes) qc.setQueryData<TravelerDetail>(key, mergeHoles(now, res.holes));
    },
    // A burst of taps refetches once, after the last one.
    onSettled: (_d: unknown, _e: unknown, t: TickVariables) => {
      if (qc.isMutating({ mutationKey: travelerKeys.tick(t.travelerId) }) > 1) return undefined;
      return invalidateAll(qc, [travelerKeys.detail(t.travelerId), travelerKeys.list(), buildKeys.all]);
    },
  };
}

/** Sends the unsent ticks restored from the device, in their order (paused or not when they were kept). */
export function resumeUnsentTicks(qc: QueryClient): Promise<unknown> {
  const cache = qc.getMutationCache();
  const notPaused = cache.getAll().filter((m) => isUnsentTick(m) && !m.state.isPaused);
  return Promise.all([qc.resumePausedMutations(), ...notPaused.map((m) => m.continue().catch(() => undefined))]);
}

/** Ticks an earlier version of the app kept under a key of its own: handed to the query client once, in order. */
export async function adoptEarlierTicks(qc: QueryClient): Promise<void> {
  const old = await readJson<unknown[]>(storageKeys.oldOfflineTicks);
  if (!Array.isArray(old)) return;
  for (const x of old.slice(0, 5000)) {
    const t = x as Partial<TickVariables>;
    const parsed = tickHolesInput.safeParse(t);
    if (!parsed.success || typeof t.travelerId !== 'string' || typeof t.at !== 'string') continue;
    void qc
      .getMutationCache()
      .build(qc, { mutationKey: travelerKeys.tick(t.travelerId) })
      .execute({ ...parsed.data, travelerId: t.travelerId, at: t.at })
      .catch(() => undefined);
  }
  await removeKey(storageKeys.oldOfflineTicks);
}

/** Ticking holes on one part: `mutate` takes the holes and their new state and stamps the tick with the device's time. */
export function useTravelerTickMutation(travelerId: string) {
  const qc = useQueryClient();
  // The same options as the registered defaults, so the hook works on any client (tests make their own).
  const options = useMemo(() => tickMutationOptions(qc), [qc]);
  const m = useMutation<TickResult, Error, TickVariables, TickContext>({
    ...options,
    mutationKey: travelerKeys.tick(travelerId),
  });
  const send = m.mutate;
  const mutate = useCallback(
    (input: TickHolesInput, opts?: MutateOptions<TickResult, Error, TickVariables, TickContext>) =>
      send({ holeIds: input.holeIds, status: input.status, travelerId, at: new Date().toISOString() }, opts),
    [send, travelerId],
  );
  return { ...m, mutate };
}

/**
 * The ticks of one part that could not get through yet (no signal, the server down, a sign-in to
 * renew), and the last refusal of one, for the bench to show; dismissing forgets the refusals.
 */
export function useTickQueue(travelerId: string): {
  waiting: TickVariables[];
  refused: string | null;
  dismissRefused: () => void;
} {
  const qc = useQueryClient();
  const key = travelerKeys.tick(travelerId);
  const waiting = useMutationState({
    filters: { mutationKey: key, status: 'pending', predicate: (m) => m.state.isPaused || m.state.failureCount > 0 },
    select: (m) => m.state.variables as TickVariables,
  });
  const refused = useMutationState({
    filters: { mutationKey: key, status: 'error' },
    select: (m) => {
      const t = m.state.variables as TickVariables;
      return `Not saved: ${errorMessage(m.state.error)} The tick of ${t.holeIds.join(', ')} was taken back.`;
    },
  });
  const dismissRefused = useCallback(() => {
    const cache = qc.getMutationCache();
    for (const m of cache.findAll({ mutationKey: travelerKeys.tick(travelerId), status: 'error' })) cache.remove(m);
  }, [qc, travelerId]);
  return { waiting, refused: refused.at(-1) ?? null, dismissRefused };
}

/** A step done or undone, saying whose work it was: shown done at once, the part as the server answers it after. */
export function useTravelerStepMutation(travelerId: string) {
  const qc = useQueryClient();
  const key = travelerKeys.detail(travelerId);
  return useMutation({
    // A step goes at once (it is not kept for later like a tick): done and sent are the same moment on the device.
    mutationFn: ({ stepId, ...input }: { stepId: string } & Omit<StepInput, 'doneAt' | 'sentAt'>) => {
      const now = new Date().toISOString();
      return api.post<TravelerDetail>(
        `/api/travelers/${encodeURIComponent(travelerId)}/steps/${encodeURIComponent(stepId)}`,
        { ...input, doneAt: now, sentAt: now } satisfies StepInput,
      );
    },
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
    onSuccess: (part) => qc.setQueryData(key, part),
    // A step done can make the part ready to sign off: the build's count and the lists come from the server.
    onSettled: () => invalidateAll(qc, [travelerKeys.list(), buildKeys.all]),
  });
}

/** An inspector's stamp on an inspection point; the answer is the part as it now stands. */
export function useTravelerStampMutation(travelerId: string) {
  return usePartChange(travelerId, (stepId: string) =>
    api.post<TravelerDetail>(
      `/api/travelers/${encodeURIComponent(travelerId)}/steps/${encodeURIComponent(stepId)}/stamp`,
    ),
  );
}

/** A change that answers with the part as it now stands (sign-off, stamp, hours); its lists and builds are asked again. */
function usePartChange<V>(travelerId: string, send: (v: V) => Promise<TravelerDetail>) {
  return useRecordMutation({
    record: travelerKeys.detail(travelerId),
    send,
    refresh: [travelerKeys.list(), buildKeys.all],
  });
}

const signOffPath = (travelerId: string) => `/api/travelers/${encodeURIComponent(travelerId)}/sign-off`;

export function useTravelerSignOffMutation(travelerId: string) {
  return usePartChange(travelerId, () => api.post<TravelerDetail>(signOffPath(travelerId)));
}

/** Takes a part's sign-off back, with the inspector's reason; the answer is the part as it now stands. */
export function useTravelerWithdrawSignOffMutation(travelerId: string) {
  return usePartChange(travelerId, (input: WithdrawSignOffInput) =>
    api.post<TravelerDetail>(`${signOffPath(travelerId)}/withdraw`, input),
  );
}

/**
 * Moves a part on which no work is recorded to its design's newest revision (its holes and steps are
 * made again); the answer is the part as it now stands, and its lists are asked again.
 */
export function useTravelerMoveRevisionMutation(travelerId: string) {
  return usePartChange(travelerId, () => {
    const now = new Date().toISOString();
    return api.post<TravelerDetail>(`/api/travelers/${encodeURIComponent(travelerId)}/revision`, {
      doneAt: now,
      sentAt: now,
    } satisfies MoveRevisionInput);
  });
}

const workPath = (travelerId: string, what: 'start' | 'stop' | 'hours') =>
  `/api/travelers/${encodeURIComponent(travelerId)}/work/${what}`;

/** Starts a work session on the part now (the device's time), as the builder's or the named help's work. */
export function useWorkStartMutation(travelerId: string) {
  return usePartChange(travelerId, (input: Omit<WorkStartInput, 'doneAt' | 'sentAt'>) => {
    const now = new Date().toISOString();
    return api.post<TravelerDetail>(workPath(travelerId, 'start'), { ...input, doneAt: now, sentAt: now });
  });
}

/** Stops the person's running session now. */
export function useWorkStopMutation(travelerId: string) {
  return usePartChange(travelerId, () => {
    const now = new Date().toISOString();
    return api.post<TravelerDetail>(workPath(travelerId, 'stop'), { doneAt: now, sentAt: now } satisfies WorkStopInput);
  });
}

/** Hours worked entered afterwards. */
export function useWorkHoursMutation(travelerId: string) {
  return usePartChange(travelerId, (input: WorkHoursInput) =>
    api.post<TravelerDetail>(workPath(travelerId, 'hours'), input),
  );
}

/** Photos of the work (of a step, or the part), sent once as picked; the answer is the part as it now stands. */
export function useWorkPhotosMutation(travelerId: string) {
  return usePartChange(travelerId, async ({ input, photos }: { input: WorkPhotosInput; photos: DraftPhoto[] }) =>
    api.upload<TravelerDetail>(
      `/api/travelers/${encodeURIComponent(travelerId)}/photos`,
      await workPhotosFormData(input, photos),
    ),
  );
}
