import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

export type DevMailPart = {
  cid: string | null;
  filename: string | null;
  contentType: string;
  disposition: string | null;
  size: number;
};
export type DevMail = {
  id: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
  receivedAt: string;
  /** As sent (inline images as cid: links); `previewHtml` has them swapped for data: URLs, to look at. */
  html: string;
  previewHtml: string;
  attachments: DevMailPart[];
};

export const devKeys = {
  all: ['dev'] as const,
  mail: () => [...devKeys.all, 'mail'] as const,
};

export const devQueries = {
  mail: () =>
    queryOptions({ queryKey: devKeys.mail(), queryFn: ({ signal }) => api.get<DevMail[]>('/api/dev/mail', signal) }),
};

export function useDevMailQuery() {
  return useQuery({ ...devQueries.mail(), refetchInterval: 3000 });
}
