import { queryOptions, useInfiniteQuery, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type {
  FindingCluster,
  Page,
  PartDesignDetail,
  PartDesignInput,
  PartDesignSummary,
  Revision,
  RevisionInput,
} from '@/db/contracts';
import { api, apiRequest } from '@/lib/api-client';
import { useRecordMutation, useRefreshingMutation } from './mutations';
import { pagedQueryOptions, readPages } from './paged';

export const designKeys = {
  all: ['designs'] as const,
  lists: () => [...designKeys.all, 'list'] as const,
  list: (kitModelId?: string) => [...designKeys.lists(), { kitModelId: kitModelId ?? null }] as const,
  /** One kit's designs at once, for choosing a part in a form (under lists: whatever refreshes lists refreshes it). */
  choices: (kitModelId: string) => [...designKeys.lists(), 'choices', kitModelId] as const,
  details: () => [...designKeys.all, 'detail'] as const,
  detail: (id: string) => [...designKeys.details(), id] as const,
  clusters: (id: string) => [...designKeys.detail(id), 'finding-clusters'] as const,
};

export const designQueries = {
  /** The part designs (of one kit, or all), a page at a time by part number. */
  list: (kitModelId?: string) =>
    pagedQueryOptions<Page<PartDesignSummary>>(designKeys.list(kitModelId), '/api/designs', { kitModelId }),
  /** One kit's part designs as one array, read page after page within the chooser's bound (readPages). */
  choices: (kitModelId: string) =>
    queryOptions({
      queryKey: designKeys.choices(kitModelId),
      queryFn: ({ signal }) => readPages<PartDesignSummary>('/api/designs', { kitModelId }, signal),
    }),
  detail: (id: string) =>
    queryOptions({
      queryKey: designKeys.detail(id),
      queryFn: ({ signal }) => api.get<PartDesignDetail>(`/api/designs/${encodeURIComponent(id)}`, signal),
    }),
};

/** The catalogue's list, paged: pagedItems(data) and <LoadMore/> show it. */
export function useDesignPagesQuery(kitModelId?: string) {
  return useInfiniteQuery(designQueries.list(kitModelId));
}

/** One kit's part designs (within the chooser's bound) as one array, for choosing a part. */
export function useDesignsQuery(kitModelId: string) {
  return useQuery({ ...designQueries.choices(kitModelId), enabled: !!kitModelId });
}

export function useDesignFindingClustersQuery(id: string) {
  return useQuery({
    queryKey: designKeys.clusters(id),
    queryFn: ({ signal }) =>
      api.get<FindingCluster[]>(`/api/designs/${encodeURIComponent(id)}/finding-clusters`, signal),
    enabled: !!id,
  });
}

export function useDesignQuery(id: string) {
  return useQuery({ ...designQueries.detail(id), enabled: !!id });
}

export function useDesignCreateMutation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: { design: PartDesignInput; revision: RevisionInput }) =>
      api.post<PartDesignDetail>('/api/designs', input),
    onSuccess: (detail) => {
      qc.setQueryData(designKeys.detail(detail.id), detail);
      return qc.invalidateQueries({ queryKey: designKeys.lists() });
    },
  });
}

/** Revisions live under their design: every change refreshes the design they belong to. */
export function useDesignRevisionCreateMutation(designId: string) {
  return useRefreshingMutation(
    (input: RevisionInput) => api.post<Revision>(`/api/designs/${encodeURIComponent(designId)}/revisions`, input),
    [designKeys.all],
  );
}

export function useDesignRevisionUpdateMutation(designId: string) {
  return useRefreshingMutation(
    ({ revisionId, input }: { revisionId: string; input: RevisionInput }) =>
      api.patch<Revision>(`/api/revisions/${encodeURIComponent(revisionId)}`, input),
    [designKeys.detail(designId)],
  );
}

export function useDesignRevisionPublishMutation(designId: string) {
  return useRefreshingMutation(
    // Publishing is the approval: the server names the signed-in supplier as the approver.
    (revisionId: string) => api.post<Revision>(`/api/revisions/${encodeURIComponent(revisionId)}/publish`, {}),
    [designKeys.all],
  );
}

/** Discards the draft: the answer is the design as it now stands (its published revisions kept). */
export function useDesignRevisionDiscardMutation(designId: string) {
  return useRecordMutation({
    record: designKeys.detail(designId),
    send: (revisionId: string) =>
      apiRequest<PartDesignDetail>(`/api/revisions/${encodeURIComponent(revisionId)}`, { method: 'DELETE' }),
    refresh: [designKeys.lists()],
  });
}
