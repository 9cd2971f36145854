import { queryOptions, useInfiniteQuery, useQuery } from '@tanstack/react-query';
import type {
  AddMemberInput,
  BuildChangeInput,
  BuildDetail,
  BuildInput,
  BuildSummary,
  FabricationTable,
  Page,
  TravelerSummary,
} from '@/db/contracts';
import { api, apiRequest } from '@/lib/api-client';
import { useRecordMutation, useRefreshingMutation } from './mutations';
import { pagedQueryOptions } from './paged';
import { travelerKeys } from './travelers';

/** The build's page: the contract's detail (its people with what the reader may do) and its parts. */
export type BuildPage = BuildDetail & { travelers: TravelerSummary[] };

export const buildKeys = {
  all: ['builds'] as const,
  list: () => [...buildKeys.all, 'list'] as const,
  details: () => [...buildKeys.all, 'detail'] as const,
  detail: (id: string) => [...buildKeys.details(), id] as const,
  /** Under the build's detail: whatever refreshes the build refreshes its table too. */
  fabrication: (id: string) => [...buildKeys.detail(id), 'fabrication'] as const,
};

export const buildQueries = {
  /** The reader's builds, a page at a time (newest first). */
  list: () => pagedQueryOptions<Page<BuildSummary>>(buildKeys.list(), '/api/builds'),
  detail: (id: string) =>
    queryOptions({
      queryKey: buildKeys.detail(id),
      queryFn: ({ signal }) => api.get<BuildPage>(`/api/builds/${encodeURIComponent(id)}`, signal),
    }),
};

/** The build's fabrication-and-assembly table (who did its parts' steps). */
export function useFabricationQuery(buildId: string) {
  return useQuery({
    queryKey: buildKeys.fabrication(buildId),
    queryFn: ({ signal }) =>
      api.get<FabricationTable>(`/api/builds/${encodeURIComponent(buildId)}/fabrication`, signal),
    enabled: !!buildId,
  });
}

export function useBuildsQuery() {
  return useInfiniteQuery(buildQueries.list());
}

export function useBuildQuery(id: string) {
  return useQuery({ ...buildQueries.detail(id), enabled: !!id });
}

export function useBuildCreateMutation() {
  return useRefreshingMutation(
    (input: BuildInput) => api.post<BuildSummary>('/api/builds', input),
    [buildKeys.all, travelerKeys.all],
  );
}

/**
 * A change to the build's people answers with the whole build as the reader now sees it: it replaces the
 * cached page at once, and the list (which names builders and inspectors) is asked again.
 */
function usePeopleChange<V>(buildId: string, send: (v: V) => Promise<BuildPage>) {
  return useRecordMutation({ record: buildKeys.detail(buildId), send, refresh: [buildKeys.list()] });
}

const buildPath = (id: string) => `/api/builds/${encodeURIComponent(id)}`;

/** Adds a builder or inspector in a place; an address without an account gets an invitation. */
export function useBuildMemberAddMutation(buildId: string) {
  return usePeopleChange(buildId, (input: AddMemberInput) =>
    api.post<BuildPage>(`${buildPath(buildId)}/members`, input),
  );
}

export function useBuildMemberRemoveMutation(buildId: string) {
  return usePeopleChange(buildId, (userId: string) =>
    apiRequest<BuildPage>(`${buildPath(buildId)}/members/${encodeURIComponent(userId)}`, { method: 'DELETE' }),
  );
}

/** Hands the build, its log included, to another builder on it. */
export function useBuildHandOverMutation(buildId: string) {
  return usePeopleChange(buildId, (userId: string) => api.post<BuildPage>(`${buildPath(buildId)}/owner`, { userId }));
}

/** Corrects the shipped build (note, and the serial while no work is recorded); its travelers' serials follow. */
export function useBuildUpdateMutation(buildId: string) {
  return useRecordMutation({
    record: buildKeys.detail(buildId),
    send: (input: BuildChangeInput) => api.patch<BuildPage>(buildPath(buildId), input),
    refresh: [buildKeys.list(), travelerKeys.all],
  });
}

export function useBuildDeleteMutation(buildId: string) {
  return useRecordMutation({
    record: buildKeys.detail(buildId),
    send: () => apiRequest<void>(buildPath(buildId), { method: 'DELETE' }),
    refresh: [buildKeys.list(), travelerKeys.all],
    removed: true,
  });
}
