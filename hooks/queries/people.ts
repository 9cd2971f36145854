import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type {
  AcceptInvitationInput, InvitationView, InviteInput, OrganizationInput, OrganizationSummary, PendingInvitation, PersonSummary,
  PersonUpdateInput, SignInResult,
} from '@/db/contracts';
import { api, apiRequest } from '../api-client';
import { useSession } from '../use-session';

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
  list: () => queryOptions({ queryKey: peopleKeys.list(), queryFn: ({ signal }) => api.get<PersonSummary[]>('/api/people', signal) }),
  invitations: () => queryOptions({
    queryKey: peopleKeys.invitations(),
    queryFn: ({ signal }) => api.get<PendingInvitation[]>('/api/people/invitations', signal),
  }),
  organizations: () => queryOptions({
    queryKey: peopleKeys.organizations(),
    queryFn: ({ signal }) => api.get<OrganizationSummary[]>('/api/people/organizations', signal),
  }),
  invitation: (token: string) => queryOptions({
    queryKey: invitationKeys.detail(token),
    queryFn: ({ signal }) => apiRequest<InvitationView>(`/api/invitations/${encodeURIComponent(token)}`, { signal, skipUnauthorizedHook: true }),
    // A used or expired link stays so: asking again tells nothing new.
    retry: false,
    staleTime: Infinity,
  }),
};

export function usePeopleQuery() {
  return useQuery(peopleQueries.list());
}

export function usePeopleInvitationsQuery() {
  return useQuery(peopleQueries.invitations());
}

export function usePeopleOrganizationsQuery(enabled = true) {
  return useQuery({ ...peopleQueries.organizations(), enabled });
}

export function useInvitationQuery(token: string) {
  return useQuery({ ...peopleQueries.invitation(token), enabled: !!token });
}

export function usePeopleInviteMutation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: InviteInput) => api.post<{ ok: true }>('/api/people/invitations', input),
    onSuccess: () => qc.invalidateQueries({ queryKey: peopleKeys.invitations() }),
  });
}

export function usePeopleOrganizationCreateMutation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: OrganizationInput) => api.post<OrganizationSummary>('/api/people/organizations', input),
    onSuccess: () => qc.invalidateQueries({ queryKey: peopleKeys.organizations() }),
  });
}

/** One change to one person; the answer (with its new `allowed` list) replaces the row at once. */
export function usePeopleUpdateMutation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ id, change }: { id: string; change: PersonUpdateInput }) =>
      api.patch<PersonSummary>(`/api/people/${encodeURIComponent(id)}`, change),
    onSuccess: (person) => {
      qc.setQueryData<PersonSummary[]>(peopleKeys.list(), (list) => list?.map((p) => (p.id === person.id ? person : p)));
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
