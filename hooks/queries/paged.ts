import { infiniteQueryOptions, type InfiniteData, type QueryKey } from '@tanstack/react-query';
import { PAGE_SIZE_MAX, type Page } from '@/db/contracts';
import { api, qs } from '@/lib/api-client';

/** A list's own filters, sent with every page (undefined ones are left out of the query string). */
type PageFilters = Record<string, string | number | undefined>;

/**
 * Every list the API returns comes in pages (`{ items, next }`): "the next page" is worked out one way,
 * for every domain's infinite query (pagedQueryOptions) and for a chooser's whole list (readPages).
 */
const pageParams = {
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

/** Pages a chooser reads at most: 10 × 100 rows. */
const CHOICES_MAX_PAGES = 10;

/**
 * A list read page after page for a chooser (a form's kit or part design), as one array: pages of the
 * largest size, at most CHOICES_MAX_PAGES of them (the bound keeps a runaway list from being read whole).
 */
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
    cursor = pageParams.getNextPageParam(page);
    if (!cursor) break;
  }
  return rows;
}
