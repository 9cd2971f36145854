import { keepPreviousData, queryOptions, useInfiniteQuery, useQuery, type QueryClient } from '@tanstack/react-query';
import type {
  LabelsQuery,
  MoveRevisionInput,
  PartLabel,
  TravelerDetail,
  Page,
  TravelerListShow,
  TravelerSummary,
  WithdrawSignOffInput,
  WorkHoursInput,
  WorkPhotosInput,
} from '@/db/contracts';
import { api } from '@/lib/api-client';
import { workPhotosFormData, type DraftPhoto } from '@/lib/photo-form-data';
import { withUnsentActions } from './bench-actions';
import { buildKeys } from './builds';
import { useRecordMutation } from './mutations';
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
  /**
   * Mutation keys of the bench's actions kept on the device until sent (ticks, steps, work started and
   * stopped): every part's (their defaults; what is kept), and one part's. The word stays 'tick', the
   * key under which an earlier version kept its ticks on the phone.
   */
  benchActions: () => [...travelerKeys.all, 'tick'] as const,
  benchActionsOf: (id: string) => [...travelerKeys.benchActions(), id] as const,
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
      // Bench actions not yet through to the server are shown as made, whatever the server has seen so far.
      queryFn: async ({ signal, client }) =>
        withUnsentActions(await api.get<TravelerDetail>(travelerDetailPath(id), signal), client),
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

/** Hours worked entered afterwards (sent at once: typed at a desk, not at the bench). */
export function useWorkHoursMutation(travelerId: string) {
  return usePartChange(travelerId, (input: WorkHoursInput) =>
    api.post<TravelerDetail>(`/api/travelers/${encodeURIComponent(travelerId)}/work/hours`, input),
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
