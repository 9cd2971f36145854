import { queryOptions, useMutation, useQuery } from '@tanstack/react-query';
import type { SessionUser, SignInInput, SignInResult } from '@/db/contracts';
import { apiRequest, api } from '../api-client';
import { useSession } from '../use-session';

export const authKeys = {
  all: ['auth'] as const,
  me: () => [...authKeys.all, 'me'] as const,
};

export const authQueries = {
  me: () => queryOptions({ queryKey: authKeys.me(), queryFn: ({ signal }) => api.get<SessionUser>('/api/auth/me', signal) }),
};

export function useAuthMeQuery(enabled = true) {
  return useQuery({ ...authQueries.me(), enabled });
}

export function useAuthSignInMutation() {
  const session = useSession();
  return useMutation({
    mutationFn: (input: SignInInput) =>
      apiRequest<SignInResult>('/api/auth/sign-in', { method: 'POST', body: input, skipUnauthorizedHook: true }),
    onSuccess: (result) => session.signIn(result),
  });
}
