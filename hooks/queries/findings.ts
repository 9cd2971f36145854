import { queryOptions, useMutation, useQuery, useQueryClient, type QueryClient } from '@tanstack/react-query';
import type { DispositionInput, FindingDetail, FindingInput, FindingStatus, FindingSummary, ReworkResult } from '@/db/contracts';
import { api, qs } from '../api-client';
import { findingFormData, type DraftPhoto } from '../photo-form-data';
import { travelerKeys } from './travelers';

export type FindingFilters = { status?: FindingStatus | 'open'; buildId?: string };

export const findingKeys = {
  all: ['findings'] as const,
  lists: () => [...findingKeys.all, 'list'] as const,
  list: (f: FindingFilters = {}) => [...findingKeys.lists(), { status: f.status ?? null, buildId: f.buildId ?? null }] as const,
  details: () => [...findingKeys.all, 'detail'] as const,
  detail: (id: string) => [...findingKeys.details(), id] as const,
};

export const findingQueries = {
  list: (f: FindingFilters = {}) => queryOptions({
    queryKey: findingKeys.list(f),
    queryFn: ({ signal }) => api.get<FindingSummary[]>(`/api/findings${qs({ status: f.status, buildId: f.buildId })}`, signal),
  }),
  detail: (id: string) => queryOptions({
    queryKey: findingKeys.detail(id),
    queryFn: ({ signal }) => api.get<FindingDetail>(`/api/findings/${encodeURIComponent(id)}`, signal),
  }),
};

export function useFindingsQuery(filters: FindingFilters = {}) {
  return useQuery(findingQueries.list(filters));
}

export function useFindingQuery(id: string) {
  return useQuery({ ...findingQueries.detail(id), enabled: !!id });
}

/** A finding's change shows on its traveler (hole statuses, findings list) and in every list. */
function refreshAround(qc: QueryClient, f: FindingDetail) {
  qc.setQueryData(findingKeys.detail(f.id), f);
  return Promise.all([
    qc.invalidateQueries({ queryKey: findingKeys.lists() }),
    qc.invalidateQueries({ queryKey: travelerKeys.detail(f.travelerId) }),
    qc.invalidateQueries({ queryKey: travelerKeys.list() }),
    qc.invalidateQueries({ queryKey: ['builds'] }),
  ]);
}

export function useFindingCreateMutation() {
  const qc = useQueryClient();
  return useMutation({
    // A photo upload is not retried by itself: the draft stays on the device and the person sends again.
    retry: false,
    mutationFn: async ({ input, photos }: { input: FindingInput; photos: DraftPhoto[] }) =>
      api.upload<FindingDetail>('/api/findings', await findingFormData(input, photos)),
    onSuccess: (f) => refreshAround(qc, f),
  });
}

function useFindingStep<TVars>(findingId: string, path: string, body: (v: TVars) => unknown) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (v: TVars) => api.post<FindingDetail>(`/api/findings/${encodeURIComponent(findingId)}/${path}`, body(v)),
    onSuccess: (f) => refreshAround(qc, f),
  });
}

export function useFindingReviewMutation(findingId: string) {
  return useFindingStep<void>(findingId, 'review', () => ({}));
}

export function useFindingDispositionMutation(findingId: string) {
  return useFindingStep<DispositionInput>(findingId, 'disposition', (v) => v);
}

export function useFindingReworkDoneMutation(findingId: string) {
  return useFindingStep<{ note: string }>(findingId, 'rework-done', (v) => v);
}

export function useFindingVerifyMutation(findingId: string) {
  return useFindingStep<{ note: string }>(findingId, 'verify', (v) => v);
}

/** The engine's answer as the server sends it: lengths in inches, margins null where no load was applied. */
export type ReworkCheckResult = ReworkResult;

/**
 * The inspector's check of drilling the finding's hole out for a larger rivet. Without `proposedSpec`
 * the server takes the next size up of the traveler's rivet. Nothing is stored: it is a question asked.
 */
export function useFindingReworkCheckMutation(findingId: string) {
  return useMutation({
    mutationKey: [...findingKeys.detail(findingId), 'rework-check'],
    mutationFn: (proposedSpec?: string) =>
      api.post<ReworkCheckResult>(`/api/findings/${encodeURIComponent(findingId)}/rework-check`, proposedSpec ? { proposedSpec } : {}),
  });
}
