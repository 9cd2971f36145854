import {
  keepPreviousData,
  queryOptions,
  useInfiniteQuery,
  useMutation,
  useQuery,
  useQueryClient,
  type InfiniteData,
  type QueryClient,
} from '@tanstack/react-query';
import {
  findingActionInput,
  findingActions,
  type FindingAction,
  type FindingActionInput,
  type FindingDetail,
  type FindingInput,
  type FindingStatus,
  type FindingSummary,
  type Page,
} from '@/db/contracts';
import type { RepairCheckResult } from '@/lib/engineering-results';
import { api, ApiError } from '@/lib/api-client';
import { invalidateAll } from './mutations';
import { pagedQueryOptions } from './paged';
import { findingActionFormData, findingFormData, type DraftPhoto } from '@/lib/photo-form-data';
import { buildKeys } from './builds';
import { travelerKeys } from './travelers';

/** The server's filters and order of GET /api/findings (db/contracts/findings.ts `findingListQuery`). */
export type FindingFilters = {
  status?: FindingStatus | 'open';
  buildId?: string;
  travelerId?: string;
  order?: 'newest' | 'oldest';
};

export const findingKeys = {
  all: ['findings'] as const,
  lists: () => [...findingKeys.all, 'list'] as const,
  list: (f: FindingFilters = {}) =>
    [
      ...findingKeys.lists(),
      {
        status: f.status ?? null,
        buildId: f.buildId ?? null,
        travelerId: f.travelerId ?? null,
        order: f.order ?? 'newest',
      },
    ] as const,
  details: () => [...findingKeys.all, 'detail'] as const,
  detail: (id: string) => [...findingKeys.details(), id] as const,
  /** Under the detail, so a finding's checks go with it; `spec` null is the server's choice (next size up). */
  repairCheck: (id: string, spec: string | null) =>
    [...findingKeys.detail(id), 'repair-check', spec ?? 'next'] as const,
};

/** The engine's repair check as the server sends it (server/engineering/repair-check.ts), one definition for both sides. */
export type { RepairAlternative, RepairCheckResult, RepairHoleResult } from '@/lib/engineering-results';

const findingPath = (id: string, rest = '') => `/api/findings/${encodeURIComponent(id)}${rest}`;

export const findingQueries = {
  /** The findings in pages, newest first unless `order` says oldest; the server's filters go with every page. */
  list: (f: FindingFilters = {}) =>
    pagedQueryOptions<Page<FindingSummary>>(findingKeys.list(f), '/api/findings', {
      status: f.status,
      buildId: f.buildId,
      travelerId: f.travelerId,
      order: f.order === 'oldest' ? 'oldest' : undefined,
    }),
  detail: (id: string) =>
    queryOptions({
      queryKey: findingKeys.detail(id),
      queryFn: ({ signal }) => api.get<FindingDetail>(findingPath(id), signal),
    }),
  /**
   * A question asked of the engine, nothing stored: a POST, but cached like a read so the check panel
   * and the disposition form show the same answer for the same rivet.
   */
  repairCheck: (id: string, spec: string | null) =>
    queryOptions({
      queryKey: findingKeys.repairCheck(id, spec),
      queryFn: () => api.post<RepairCheckResult>(findingPath(id, '/repair-check'), spec ? { proposedSpec: spec } : {}),
      staleTime: Infinity,
      retry: false,
    }),
};

/**
 * The findings list, a page at a time: `pagedItems(q.data)` are the rows so far, `fetchNextPage` asks
 * for more. `keepPrevious` shows the rows of the last filters while the new ones load (a filter change
 * does not blank the screen).
 */
export function useFindingsQuery(
  filters: FindingFilters = {},
  opts: { enabled?: boolean; keepPrevious?: boolean } = {},
) {
  return useInfiniteQuery({
    ...findingQueries.list(filters),
    enabled: opts.enabled ?? true,
    placeholderData: opts.keepPrevious ? keepPreviousData : undefined,
  });
}

/**
 * A finding as it now stands, written into every loaded page that shows it (the pages keep their
 * shape and order), so the row changes at once; the lists are then fetched again to move or drop it.
 */
export function patchFindingInLists(qc: QueryClient, f: FindingSummary) {
  qc.setQueriesData<InfiniteData<Page<FindingSummary>>>({ queryKey: findingKeys.lists() }, (data) => {
    if (!data?.pages) return data;
    let changed = false;
    const pages = data.pages.map((p) => {
      if (!p.items.some((r) => r.id === f.id)) return p;
      changed = true;
      return { ...p, items: p.items.map((r) => (r.id === f.id ? { ...r, ...summaryOf(f) } : r)) };
    });
    return changed ? { ...data, pages } : data;
  });
}

/** The list row's fields, each named once: the compiler refuses a field of FindingSummary left out or one too many. */
const summaryFields: Record<keyof FindingSummary, true> = {
  id: true,
  travelerId: true,
  serial: true,
  partNumber: true,
  kitSerial: true,
  buildId: true,
  holeIds: true,
  kind: true,
  status: true,
  disposition: true,
  closure: true,
  raisedByName: true,
  createdAt: true,
  updatedAt: true,
  photoCount: true,
  thumbUrl: true,
};

/** The list row's fields of a finding's detail. */
function summaryOf(f: FindingSummary): FindingSummary {
  return Object.fromEntries(Object.keys(summaryFields).map((k) => [k, f[k as keyof FindingSummary]])) as FindingSummary;
}

export function useFindingQuery(id: string) {
  return useQuery({ ...findingQueries.detail(id), enabled: !!id });
}

/** The repair check for one rivet: run on demand (`refetch`), never by itself. */
export function useRepairCheckQuery(findingId: string, spec: string | null) {
  return useQuery({ ...findingQueries.repairCheck(findingId, spec), enabled: false });
}

/** A finding's change shows on its traveler (hole statuses, findings list, readiness), its build and every list. */
function refreshAround(qc: QueryClient, f: FindingDetail) {
  qc.setQueryData(findingKeys.detail(f.id), f);
  patchFindingInLists(qc, f);
  return invalidateAll(qc, [
    findingKeys.lists(),
    travelerKeys.detail(f.travelerId),
    // Scrap and return to supplier add a traveler to the build.
    travelerKeys.list(),
    buildKeys.all,
  ]);
}

export function useFindingCreateMutation() {
  const qc = useQueryClient();
  return useMutation({
    // Not retried nor paused here: without signal it fails at once, and the form hands the finding to the
    // bench's queue (useQueueFinding), which waits for the signal.
    retry: false,
    networkMode: 'always',
    mutationFn: async ({ input, photos }: { input: FindingInput; photos: DraftPhoto[] }) =>
      api.upload<FindingDetail>('/api/findings', await findingFormData(input, photos)),
    onSuccess: (f) => refreshAround(qc, f),
  });
}

export type FindingActionVars = { action: FindingAction; input: FindingActionInput; photos?: DraftPhoto[] };

/** The URL segment of each action is its name in the rules module's list. */
export function findingActionPath(findingId: string, action: FindingAction): string {
  if (!findingActions.includes(action)) throw new Error(`unknown finding action ${String(action)}`);
  return findingPath(findingId, `/${action}`);
}

/**
 * Every move on a finding, one request per decision: JSON, or multipart when photos go with it (the
 * work done). The answer is the finding as it now stands, with its new `allowedActions`.
 */
export function useFindingActionMutation(findingId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationKey: [...findingKeys.detail(findingId), 'action'],
    // A decision is not sent twice by itself: a retry after a lost answer would be refused as "not now".
    retry: false,
    mutationFn: async ({ action, input, photos }: FindingActionVars) => {
      const body = findingActionInput.parse(input);
      const path = findingActionPath(findingId, action);
      if (photos?.length) return api.upload<FindingDetail>(path, await findingActionFormData(body, photos));
      return api.post<FindingDetail>(path, body);
    },
    onSuccess: (f) => refreshAround(qc, f),
    onError: (e) => {
      // Not yours or not now: someone moved the finding meanwhile, so fetch what may be done now.
      if (e instanceof ApiError && (e.status === 403 || e.status === 409)) {
        return qc.invalidateQueries({ queryKey: findingKeys.detail(findingId) });
      }
      return undefined;
    },
  });
}
