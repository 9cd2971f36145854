import {
  queryOptions,
  useInfiniteQuery,
  useMutation,
  useQuery,
  useQueryClient,
  type InfiniteData,
} from '@tanstack/react-query';
import type { CouponAllowance, CouponCorrectionInput, CouponInput, CouponTest, Page } from '@/db/contracts';
import { api, apiRequest } from '@/lib/api-client';
import { useRefreshingMutation } from './mutations';
import { pagedQueryOptions } from './paged';

export const couponKeys = {
  all: ['coupons'] as const,
  list: () => [...couponKeys.all, 'list'] as const,
  allowables: () => [...couponKeys.all, 'allowables'] as const,
};

export const couponQueries = {
  /** The record of tests, a page at a time (material, gauge, rivet, load). */
  list: () => pagedQueryOptions<Page<CouponTest>>(couponKeys.list(), '/api/coupons'),
  allowables: () =>
    queryOptions({
      queryKey: couponKeys.allowables(),
      queryFn: ({ signal }) => api.get<CouponAllowance[]>('/api/coupons/allowables', signal),
    }),
};

export function useCouponsQuery() {
  return useInfiniteQuery(couponQueries.list());
}

/** The allowables per material, gauge and rivet, derived on the server by the engine's own rule. */
export function useCouponAllowablesQuery() {
  return useQuery(couponQueries.allowables());
}

/** A new test changes the derived allowables; studies use them the next time they are computed. */
export function useCouponCreateMutation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: CouponInput) => api.post<CouponTest>('/api/coupons', input),
    onSuccess: (made) => {
      // Shown at once at the head of the first page; the refetch below puts it in its place in the order.
      qc.setQueryData<InfiniteData<Page<CouponTest>>>(couponKeys.list(), (old) =>
        old?.pages.length
          ? { ...old, pages: [{ ...old.pages[0], items: [made, ...old.pages[0].items] }, ...old.pages.slice(1)] }
          : old,
      );
      return qc.invalidateQueries({ queryKey: couponKeys.all });
    },
  });
}

/** A correction is a new entry; the old one stays in the list marked as corrected, and the allowables change. */
export function useCouponCorrectMutation() {
  return useRefreshingMutation(
    ({ id, input }: { id: string; input: CouponCorrectionInput }) =>
      api.post<CouponTest>(`/api/coupons/${encodeURIComponent(id)}/corrections`, input),
    [couponKeys.all],
  );
}

export function useCouponDeleteMutation() {
  return useRefreshingMutation(
    (id: string) => apiRequest<void>(`/api/coupons/${encodeURIComponent(id)}`, { method: 'DELETE' }),
    [couponKeys.all],
  );
}
