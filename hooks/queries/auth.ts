import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import type { ChangePasswordInput, ResetPasswordInput, SessionUser, SignInInput, SignInResult } from '@/db/contracts';
import { apiRequest, api } from '@/lib/api-client';
import { useSession } from '../use-session';

export const authKeys = {
  all: ['auth'] as const,
  me: () => [...authKeys.all, 'me'] as const,
};

export const authQueries = {
  me: () =>
    queryOptions({ queryKey: authKeys.me(), queryFn: ({ signal }) => api.get<SessionUser>('/api/auth/me', signal) }),
};

export function useAuthSignInMutation() {
  const session = useSession();
  return useMutation({
    mutationFn: (input: SignInInput) =>
      apiRequest<SignInResult>('/api/auth/sign-in', { method: 'POST', body: input, skipUnauthorizedHook: true }),
    onSuccess: (result) => session.signIn(result),
  });
}

/** Asks for a reset link; the server answers the same whether or not the address has an account. */
export function useAuthForgotMutation() {
  return useMutation({
    mutationFn: (input: { email: string }) =>
      apiRequest<{ message: string }>('/api/auth/forgot', { method: 'POST', body: input, skipUnauthorizedHook: true }),
  });
}

/** Sets a new password from the mail's link; the answer signs the person in. */
export function useAuthResetMutation() {
  const session = useSession();
  return useMutation({
    mutationFn: (input: ResetPasswordInput) =>
      apiRequest<SignInResult>('/api/auth/reset', { method: 'POST', body: input, skipUnauthorizedHook: true }),
    onSuccess: (result) => session.signIn(result),
  });
}

/**
 * A new password ends every sign-in of the person, this one's token included: the answer carries a
 * fresh token, stored at once so the next request is not refused. Queries in flight are cancelled
 * first so none of them comes back refused with the old token and signs this device out.
 */
export function useAuthChangePasswordMutation() {
  const session = useSession();
  const qc = useQueryClient();
  return useMutation({
    // No retry: a second try after a lost answer would be refused (the current password changed).
    retry: false,
    mutationFn: async (input: ChangePasswordInput) => {
      await qc.cancelQueries();
      return apiRequest<SignInResult>('/api/auth/change-password', { method: 'POST', body: input });
    },
    onSuccess: (result) => session.signIn(result),
  });
}

/** Ends every sign-in of the person, on every device; this one signs out too. */
export function useAuthSignOutEverywhereMutation() {
  const session = useSession();
  return useMutation({
    retry: false,
    mutationFn: () => apiRequest<void>('/api/auth/sign-out-everywhere', { method: 'POST', body: {} }),
    onSuccess: () => session.signOut('You signed out on every device. Sign in again to go on here.'),
  });
}
