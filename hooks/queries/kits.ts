import { queryOptions, useInfiniteQuery, useQuery } from '@tanstack/react-query';
import type { KitChangeInput, KitModel, KitModelDetail, KitModelInput, Page } from '@/db/contracts';
import { api, apiRequest } from '@/lib/api-client';
import { designKeys } from './designs';
import { useRecordMutation, useRefreshingMutation } from './mutations';
import { pagedQueryOptions, readPages } from './paged';

export const kitKeys = {
  all: ['kits'] as const,
  list: () => [...kitKeys.all, 'list'] as const,
  /** Every kit of the organisation at once, for a form's kit chooser. */
  choices: () => [...kitKeys.all, 'choices'] as const,
  details: () => [...kitKeys.all, 'detail'] as const,
  detail: (id: string) => [...kitKeys.details(), id] as const,
};

const kitPath = (id: string) => `/api/kits/${encodeURIComponent(id)}`;

export const kitQueries = {
  /** The kit models, a page at a time (by code). */
  list: () => pagedQueryOptions<Page<KitModel>>(kitKeys.list(), '/api/kits'),
  /**
   * The kit models a form chooses from, read page after page within readPages' bound (a supplier has a few kits).
   */
  choices: () =>
    queryOptions({
      queryKey: kitKeys.choices(),
      queryFn: ({ signal }) => readPages<KitModel>('/api/kits', {}, signal),
    }),
  detail: (id: string) =>
    queryOptions({
      queryKey: kitKeys.detail(id),
      queryFn: ({ signal }) => api.get<KitModelDetail>(kitPath(id), signal),
    }),
};

/** The kit models list, paged: pagedItems(data) and <LoadMore/> show it. */
export function useKitPagesQuery() {
  return useInfiniteQuery(kitQueries.list());
}

/** Every kit model (within a bound) as one array, for choosing a kit in a form. */
export function useKitsQuery() {
  return useQuery(kitQueries.choices());
}

/** One kit with what relies on it, what the reader may do, and the history of its data. */
export function useKitQuery(id: string) {
  return useQuery({ ...kitQueries.detail(id), enabled: !!id });
}

export function useKitCreateMutation() {
  return useRefreshingMutation((input: KitModelInput) => api.post<KitModel>('/api/kits', input), [kitKeys.all]);
}

/** A change answers with the kit's page as it now stands; lists naming the kit are asked again. */
export function useKitUpdateMutation(id: string) {
  return useRecordMutation({
    record: kitKeys.detail(id),
    send: (input: KitChangeInput) => api.patch<KitModelDetail>(kitPath(id), input),
    refresh: [kitKeys.list(), designKeys.all],
  });
}

export function useKitDeleteMutation(id: string) {
  return useRecordMutation({
    record: kitKeys.detail(id),
    send: () => apiRequest<void>(kitPath(id), { method: 'DELETE' }),
    refresh: [kitKeys.list(), designKeys.all],
    removed: true,
  });
}
