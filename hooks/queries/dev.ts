import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../api-client';

export type DevMail = { id: string; from: string; to: string[]; subject: string; text: string; html: string; receivedAt: string };

export const devKeys = {
  all: ['dev'] as const,
  mail: () => [...devKeys.all, 'mail'] as const,
};

export const devQueries = {
  mail: () => queryOptions({ queryKey: devKeys.mail(), queryFn: ({ signal }) => api.get<DevMail[]>('/api/dev/mail', signal) }),
};

export function useDevMailQuery() {
  return useQuery({ ...devQueries.mail(), refetchInterval: 3000 });
}
