import { queryOptions, useQuery } from '@tanstack/react-query';
import type { PhoneSetup } from '@/db/contracts';
import { api } from '@/lib/api-client';

export const networkKeys = {
  all: ['network'] as const,
  setup: () => [...networkKeys.all, 'setup'] as const,
};

export const networkQueries = {
  setup: () =>
    queryOptions({
      queryKey: networkKeys.setup(),
      queryFn: ({ signal }) => api.get<PhoneSetup>('/api/network', signal),
    }),
};

export function usePhoneSetupQuery() {
  return useQuery(networkQueries.setup());
}
