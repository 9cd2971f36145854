import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { KitModel, KitModelInput } from '@/db/contracts';
import { api } from '../api-client';

export const kitKeys = {
  all: ['kits'] as const,
  list: () => [...kitKeys.all, 'list'] as const,
};

export const kitQueries = {
  list: () => queryOptions({ queryKey: kitKeys.list(), queryFn: ({ signal }) => api.get<KitModel[]>('/api/kits', signal) }),
};

export function useKitsQuery() {
  return useQuery(kitQueries.list());
}

export function useKitCreateMutation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: KitModelInput) => api.post<KitModel>('/api/kits', input),
    onSuccess: () => qc.invalidateQueries({ queryKey: kitKeys.all }),
  });
}
