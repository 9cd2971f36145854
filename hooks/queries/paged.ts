import type { InfiniteData } from '@tanstack/react-query';
import type { Page } from '@/db/contracts';
import { qs } from '@/lib/api-client';

/**
 * Every list the API returns comes in pages (`{ items, next }`); these are the pieces each domain's
 * infinite query shares, so "the next page" is worked out one way.
 */
export const pageParams = {
  initialPageParam: null as string | null,
  getNextPageParam: (last: Page<unknown>) => last.next,
};

/** The query string of one page of a list, with the list's own filters. */
export const pagePath = (
  path: string,
  cursor: string | null,
  filters: Record<string, string | number | undefined> = {},
) => `${path}${qs({ ...filters, cursor: cursor ?? undefined })}`;

/** The rows of every page loaded so far, in order. */
export function pagedItems<T>(data: InfiniteData<Page<T>> | undefined): T[] {
  return data ? data.pages.flatMap((p) => p.items) : [];
}
