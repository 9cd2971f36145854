import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { CouponAllowance, CouponCorrectionInput, CouponInput, CouponTest } from '@/db/contracts';
import { api, apiRequest } from '../api-client';

export const couponKeys = {
  all: ['coupons'] as const,
  list: () => [...couponKeys.all, 'list'] as const,
  allowables: () => [...couponKeys.all, 'allowables'] as const,
};

export const couponQueries = {
  list: () => queryOptions({ queryKey: couponKeys.list(), queryFn: ({ signal }) => api.get<CouponTest[]>('/api/coupons', signal) }),
  allowables: () => queryOptions({ queryKey: couponKeys.allowables(), queryFn: ({ signal }) => api.get<CouponAllowance[]>('/api/coupons/allowables', signal) }),
};

export function useCouponsQuery() {
  return useQuery(couponQueries.list());
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
      qc.setQueryData<CouponTest[]>(couponKeys.list(), (old) => (old ? [made, ...old] : old));
      return qc.invalidateQueries({ queryKey: couponKeys.all });
    },
  });
}

/** A correction is a new entry; the old one stays in the list marked as corrected, and the allowables change. */
export function useCouponCorrectMutation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ id, input }: { id: string; input: CouponCorrectionInput }) =>
      api.post<CouponTest>(`/api/coupons/${encodeURIComponent(id)}/corrections`, input),
    onSuccess: () => qc.invalidateQueries({ queryKey: couponKeys.all }),
  });
}

export function useCouponDeleteMutation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (id: string) => apiRequest<void>(`/api/coupons/${encodeURIComponent(id)}`, { method: 'DELETE' }),
    onSuccess: () => qc.invalidateQueries({ queryKey: couponKeys.all }),
  });
}
