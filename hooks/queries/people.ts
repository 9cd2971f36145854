import {
  queryOptions,
  useInfiniteQuery,
  useMutation,
  useQuery,
  useQueryClient,
  type InfiniteData,
} from '@tanstack/react-query';
import type {
  AcceptInvitationInput,
  InvitationView,
  InviteInput,
  OrganizationInput,
  OrganizationSummary,
  Page,
  PendingInvitation,
  PersonSummary,
  PersonUpdateInput,
  SignInResult,
} from '@/db/contracts';
import { api, apiRequest } from '@/lib/api-client';
import { useSession } from '../use-session';
import { useRefreshingMutation } from './mutations';
import { pagedQueryOptions } from './paged';

/** Organisations, people and their invitations, as the admin and a supplier's lead engineer manage them. */
export const peopleKeys = {
  all: ['people'] as const,
  list: () => [...peopleKeys.all, 'list'] as const,
  invitations: () => [...peopleKeys.all, 'invitations'] as const,
  organizations: () => [...peopleKeys.all, 'organizations'] as const,
};

/** The one-time invitation link, read signed out (its own URL segment: /api/invitations). */
export const invitationKeys = {
  all: ['invitations'] as const,
  detail: (token: string) => [...invitationKeys.all, token] as const,
};

export const peopleQueries = {
  /** People by name, a page at a time. */
  list: () => pagedQueryOptions<Page<PersonSummary>>(peopleKeys.list(), '/api/people'),
  /** Invitations not yet taken up, oldest first, a page at a time. */
  invitations: () => pagedQueryOptions<Page<PendingInvitation>>(peopleKeys.invitations(), '/api/people/invitations'),
  /** Organisations by name, a page at a time. */
  organizations: () =>
    pagedQueryOptions<Page<OrganizationSummary>>(peopleKeys.organizations(), '/api/people/organizations'),
  invitation: (token: string) =>
    queryOptions({
      queryKey: invitationKeys.detail(token),
      queryFn: ({ signal }) =>
        apiRequest<InvitationView>(`/api/invitations/${encodeURIComponent(token)}`, {
          signal,
          skipUnauthorizedHook: true,
        }),
      // A used or expired link stays so: asking again tells nothing new.
      retry: false,
      staleTime: Infinity,
    }),
};

export function usePeopleQuery() {
  return useInfiniteQuery(peopleQueries.list());
}

export function usePeopleInvitationsQuery() {
  return useInfiniteQuery(peopleQueries.invitations());
}

export function usePeopleOrganizationsQuery(enabled = true) {
  return useInfiniteQuery({ ...peopleQueries.organizations(), enabled });
}

export function useInvitationQuery(token: string) {
  return useQuery({ ...peopleQueries.invitation(token), enabled: !!token });
}

export function usePeopleInviteMutation() {
  return useRefreshingMutation(
    (input: InviteInput) => api.post<{ ok: true }>('/api/people/invitations', input),
    [peopleKeys.invitations()],
  );
}

export function usePeopleOrganizationCreateMutation() {
  return useRefreshingMutation(
    (input: OrganizationInput) => api.post<OrganizationSummary>('/api/people/organizations', input),
    [peopleKeys.organizations()],
  );
}

/** One change to one person; the answer (with its new `allowed` list) replaces the row at once. */
export function usePeopleUpdateMutation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ id, change }: { id: string; change: PersonUpdateInput }) =>
      api.patch<PersonSummary>(`/api/people/${encodeURIComponent(id)}`, change),
    onSuccess: (person) => {
      qc.setQueryData<InfiniteData<Page<PersonSummary>>>(peopleKeys.list(), (list) =>
        list
          ? {
              ...list,
              pages: list.pages.map((pg) => ({ ...pg, items: pg.items.map((p) => (p.id === person.id ? person : p)) })),
            }
          : list,
      );
      // Organisation head counts and anything else derived from people.
      return qc.invalidateQueries({ queryKey: peopleKeys.all });
    },
  });
}

/** Joins from the mail's link: the account is made and the person is signed in. */
export function useInvitationAcceptMutation() {
  const session = useSession();
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: AcceptInvitationInput) =>
      apiRequest<SignInResult>('/api/invitations/accept', { method: 'POST', body: input, skipUnauthorizedHook: true }),
    onSuccess: async (result, input) => {
      qc.removeQueries({ queryKey: invitationKeys.detail(input.token) });
      await session.signIn(result);
    },
  });
}
