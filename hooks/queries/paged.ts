import { infiniteQueryOptions, type InfiniteData, type QueryKey } from '@tanstack/react-query';
import type { Page } from '@/db/contracts';
import { api, qs } from '@/lib/api-client';

/** A list's own filters, sent with every page (undefined ones are left out of the query string). */
type PageFilters = Record<string, string | number | undefined>;

/**
 * Every list the API returns comes in pages (`{ items, next }`); these are the pieces each domain's
 * infinite query shares, so "the next page" is worked out one way.
 */
export const pageParams = {
  initialPageParam: null as string | null,
  getNextPageParam: (last: Page<unknown>) => last.next,
};

/** The query string of one page of a list, with the list's own filters. */
export const pagePath = (path: string, cursor: string | null, filters: PageFilters = {}) =>
  `${path}${qs({ ...filters, cursor: cursor ?? undefined })}`;

/** The infinite query of one list endpoint: each page asked with the cursor of the last and the same filters. */
export function pagedQueryOptions<P extends Page<unknown>>(queryKey: QueryKey, path: string, filters?: PageFilters) {
  return infiniteQueryOptions({
    queryKey,
    queryFn: ({ signal, pageParam }) => api.get<P>(pagePath(path, pageParam, filters), signal),
    ...pageParams,
  });
}

/** The rows of every page loaded so far, in order. */
export function pagedItems<T>(data: InfiniteData<Page<T>> | undefined): T[] {
  return data ? data.pages.flatMap((p) => p.items) : [];
}
