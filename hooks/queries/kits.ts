import { queryOptions, useInfiniteQuery, useQuery } from '@tanstack/react-query';
import {
  PAGE_SIZE_MAX,
  type KitChangeInput,
  type KitModel,
  type KitModelDetail,
  type KitModelInput,
  type Page,
} from '@/db/contracts';
import { api, apiRequest } from '@/lib/api-client';
import { designKeys } from './designs';
import { useRecordMutation, useRefreshingMutation } from './mutations';
import { pagedQueryOptions, pagePath } from './paged';

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
   * The kit models a form chooses from: pages of the largest size read one after another, at most
   * KIT_CHOICES_MAX_PAGES of them (a supplier has a few kits; the bound keeps a runaway list from being read whole).
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

/** Pages a chooser reads at most: 10 × 100 rows. */
export const CHOICES_MAX_PAGES = 10;

/** A list read page after page for a chooser, up to CHOICES_MAX_PAGES pages. */
export async function readPages<T>(
  path: string,
  filters: Record<string, string | undefined>,
  signal?: AbortSignal,
): Promise<T[]> {
  const rows: T[] = [];
  let cursor: string | null = null;
  for (let n = 0; n < CHOICES_MAX_PAGES; n++) {
    const page: Page<T> = await api.get<Page<T>>(pagePath(path, cursor, { ...filters, limit: PAGE_SIZE_MAX }), signal);
    rows.push(...page.items);
    cursor = page.next;
    if (!cursor) break;
  }
  return rows;
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
