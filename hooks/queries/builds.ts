import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { BuildInput, BuildSummary, QrLabel, TravelerSummary } from '@/db/contracts';
import { api } from '../api-client';

export type BuildDetail = BuildSummary & { travelers: TravelerSummary[] };

export const buildKeys = {
  all: ['builds'] as const,
  list: () => [...buildKeys.all, 'list'] as const,
  details: () => [...buildKeys.all, 'detail'] as const,
  detail: (id: string) => [...buildKeys.details(), id] as const,
  labels: (id: string) => [...buildKeys.all, 'labels', id] as const,
};

export const buildQueries = {
  list: () => queryOptions({ queryKey: buildKeys.list(), queryFn: ({ signal }) => api.get<BuildSummary[]>('/api/builds', signal) }),
  detail: (id: string) => queryOptions({
    queryKey: buildKeys.detail(id),
    queryFn: ({ signal }) => api.get<BuildDetail>(`/api/builds/${encodeURIComponent(id)}`, signal),
  }),
  labels: (id: string) => queryOptions({
    queryKey: buildKeys.labels(id),
    queryFn: ({ signal }) => api.get<QrLabel[]>(`/api/builds/${encodeURIComponent(id)}/labels`, signal),
    staleTime: 5 * 60_000,
  }),
};

export function useBuildsQuery() {
  return useQuery(buildQueries.list());
}

export function useBuildQuery(id: string) {
  return useQuery({ ...buildQueries.detail(id), enabled: !!id });
}

export function useBuildLabelsQuery(id: string) {
  return useQuery({ ...buildQueries.labels(id), enabled: !!id });
}

export function useBuildCreateMutation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: BuildInput) => api.post<BuildSummary>('/api/builds', input),
    onSuccess: () => Promise.all([
      qc.invalidateQueries({ queryKey: buildKeys.all }),
      qc.invalidateQueries({ queryKey: ['travelers'] }),
    ]),
  });
}
