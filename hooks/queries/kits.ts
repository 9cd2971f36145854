import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { KitChangeInput, KitModel, KitModelDetail, KitModelInput } from '@/db/contracts';
import { api, apiRequest } from '../api-client';

export const kitKeys = {
  all: ['kits'] as const,
  list: () => [...kitKeys.all, 'list'] as const,
  details: () => [...kitKeys.all, 'detail'] as const,
  detail: (id: string) => [...kitKeys.details(), id] as const,
};

const kitPath = (id: string) => `/api/kits/${encodeURIComponent(id)}`;

export const kitQueries = {
  list: () => queryOptions({ queryKey: kitKeys.list(), queryFn: ({ signal }) => api.get<KitModel[]>('/api/kits', signal) }),
  detail: (id: string) => queryOptions({ queryKey: kitKeys.detail(id), queryFn: ({ signal }) => api.get<KitModelDetail>(kitPath(id), signal) }),
};

export function useKitsQuery() {
  return useQuery(kitQueries.list());
}

/** One kit with what relies on it, what the reader may do, and the history of its data. */
export function useKitQuery(id: string) {
  return useQuery({ ...kitQueries.detail(id), enabled: !!id });
}

export function useKitCreateMutation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: KitModelInput) => api.post<KitModel>('/api/kits', input),
    onSuccess: () => qc.invalidateQueries({ queryKey: kitKeys.all }),
  });
}

/** A change answers with the kit's page as it now stands; lists naming the kit are asked again. */
export function useKitUpdateMutation(id: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: KitChangeInput) => api.patch<KitModelDetail>(kitPath(id), input),
    onSuccess: (detail) => {
      qc.setQueryData(kitKeys.detail(id), detail);
      return Promise.all([qc.invalidateQueries({ queryKey: kitKeys.list() }), qc.invalidateQueries({ queryKey: ['designs'] })]);
    },
  });
}

export function useKitDeleteMutation(id: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => apiRequest<void>(kitPath(id), { method: 'DELETE' }),
    onSuccess: () => {
      qc.removeQueries({ queryKey: kitKeys.detail(id) });
      return Promise.all([qc.invalidateQueries({ queryKey: kitKeys.list() }), qc.invalidateQueries({ queryKey: ['designs'] })]);
    },
  });
}
