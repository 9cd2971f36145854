import { queryOptions, useInfiniteQuery, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type {
  ApplyStudyInput,
  Page,
  Revision,
  StudyDetail,
  StudyInput,
  StudySummary,
  WingStudyInput,
} from '@/db/contracts';
import type { StudyCandidate } from '@/lib/engineering-results';
import { api, apiRequest, qs } from '@/lib/api-client';
import { designKeys } from './designs';
import { useRefreshingMutation } from './mutations';
import { pagedQueryOptions } from './paged';

export const studyKeys = {
  all: ['studies'] as const,
  lists: () => [...studyKeys.all, 'list'] as const,
  details: () => [...studyKeys.all, 'detail'] as const,
  /** Every revision of one study: what a new revision or an apply refreshes. */
  study: (id: string) => [...studyKeys.details(), id] as const,
  detail: (id: string, revision?: number) => [...studyKeys.study(id), { revision: revision ?? null }] as const,
  /** One candidate of one revision, with its holes: a stored revision's never changes. */
  candidate: (id: string, revision: number, gaugeIn: number, rivet: string) =>
    [...studyKeys.study(id), 'candidate', { revision, gaugeIn, rivet }] as const,
};

/** What the study endpoints take: a rib study (no kind) or a whole wing (kind 'wing'). */
export type StudyBodyInput = StudyInput | WingStudyInput;

export const studyQueries = {
  /** The organisation's studies, a page at a time (last changed first). */
  list: () => pagedQueryOptions<Page<StudySummary>>(studyKeys.lists(), '/api/studies'),
  detail: (id: string, revision?: number) =>
    queryOptions({
      queryKey: studyKeys.detail(id, revision),
      queryFn: ({ signal }) =>
        api.get<StudyDetail>(`/api/studies/${encodeURIComponent(id)}${qs({ revision })}`, signal),
      // A stored revision never changes; only "latest" can move on.
      staleTime: revision ? Infinity : 0,
    }),
  /** A rib study's candidate with its holes, recomputed by the server (only the recommended one is stored whole). */
  candidate: (id: string, revision: number, gaugeIn: number, rivet: string) =>
    queryOptions({
      queryKey: studyKeys.candidate(id, revision, gaugeIn, rivet),
      queryFn: ({ signal }) =>
        api.get<StudyCandidate>(
          `/api/studies/${encodeURIComponent(id)}/candidate${qs({ gaugeIn, rivet, revision })}`,
          signal,
        ),
      staleTime: Infinity,
    }),
};

export function useStudiesQuery() {
  return useInfiniteQuery(studyQueries.list());
}

/** The candidate's holes when the stored result has only its zones; off while `key` is null. */
export function useStudyCandidateQuery(id: string, revision: number, key: { gaugeIn: number; rivet: string } | null) {
  return useQuery({
    ...studyQueries.candidate(id, revision, key?.gaugeIn ?? 0, key?.rivet ?? ''),
    enabled: !!id && !!key,
  });
}

/** `revision` undefined = the latest one. */
export function useStudyQuery(id: string, revision?: number) {
  return useQuery({ ...studyQueries.detail(id, revision), enabled: !!id });
}

function remember(qc: ReturnType<typeof useQueryClient>, detail: StudyDetail) {
  qc.setQueryData(studyKeys.detail(detail.id), detail);
  qc.setQueryData(studyKeys.detail(detail.id, detail.revision), detail);
}

/** POST /api/studies: the server computes revision 1 and answers with its result. */
export function useStudyCreateMutation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: StudyBodyInput) => api.post<StudyDetail>('/api/studies', input),
    onSuccess: (detail) => {
      remember(qc, detail);
      return qc.invalidateQueries({ queryKey: studyKeys.lists() });
    },
  });
}

/** PUT /api/studies/:id: changed inputs become the next numbered revision. */
export function useStudyUpdateMutation(id: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: StudyBodyInput) =>
      apiRequest<StudyDetail>(`/api/studies/${encodeURIComponent(id)}`, { method: 'PUT', body: input }),
    onSuccess: async (detail) => {
      // The revision list of every cached revision is out of date now.
      await qc.invalidateQueries({ queryKey: studyKeys.study(id) });
      remember(qc, detail);
      await qc.invalidateQueries({ queryKey: studyKeys.lists() });
    },
  });
}

/**
 * Writes the chosen candidate into the part design's draft revision (made when there is none); a wing
 * study names its rib or skin panel in `target`.
 */
export function useStudyApplyMutation(id: string) {
  return useRefreshingMutation(
    (input: ApplyStudyInput) => api.post<Revision>(`/api/studies/${encodeURIComponent(id)}/apply`, input),
    [designKeys.all],
  );
}
