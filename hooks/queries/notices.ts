import {
  queryOptions,
  useInfiniteQuery,
  useMutation,
  useQuery,
  useQueryClient,
  type QueryClient,
} from '@tanstack/react-query';
import type {
  ComplianceChange,
  DeviceTime,
  NoticeBuildAnswer,
  NoticeChange,
  NoticeDetail,
  NoticeSummary,
  Page,
} from '@/db/contracts';
import { api, ApiError } from '@/lib/api-client';
import { appendPhotos, type DraftPhoto } from '@/lib/photo-form-data';
import { buildLogKeys } from './build-log';
import { invalidateAll } from './mutations';
import { pagedQueryOptions, pagePath } from './paged';

/** GET /api/notices narrows by one of these (db/contracts/notices.ts `noticeListQuery`). */
export type NoticeFilters = { kitModelId?: string; buildId?: string; travelerId?: string };

export const noticeKeys = {
  all: ['notices'] as const,
  lists: () => [...noticeKeys.all, 'list'] as const,
  list: (f: NoticeFilters = {}) =>
    [
      ...noticeKeys.lists(),
      { kitModelId: f.kitModelId ?? null, buildId: f.buildId ?? null, travelerId: f.travelerId ?? null },
    ] as const,
  details: () => [...noticeKeys.all, 'detail'] as const,
  detail: (id: string) => [...noticeKeys.details(), id] as const,
};

const noticePath = (id: string, rest = '') => `/api/notices/${encodeURIComponent(id)}${rest}`;
const answerPath = (id: string, buildId: string, action: 'acknowledge' | 'compliance') =>
  noticePath(id, `/builds/${encodeURIComponent(buildId)}/${action}`);

const listFilters = (f: NoticeFilters) => ({ kitModelId: f.kitModelId, buildId: f.buildId, travelerId: f.travelerId });

/** The first page of a list, as its query asks for it (components/navigation/early-arrival.web.ts asks for a part's early). */
export const noticeListFirstPath = (f: NoticeFilters) => pagePath('/api/notices', null, listFilters(f));

export const noticeQueries = {
  /** A kit's notices (the supplier), or one build's or one part's with that build's answer on each row. */
  list: (f: NoticeFilters = {}) =>
    pagedQueryOptions<Page<NoticeSummary>>(noticeKeys.list(f), '/api/notices', listFilters(f)),
  detail: (id: string) =>
    queryOptions({
      queryKey: noticeKeys.detail(id),
      queryFn: ({ signal }) => api.get<NoticeDetail>(noticePath(id), signal),
    }),
};

export function useNoticesQuery(f: NoticeFilters, opts: { enabled?: boolean } = {}) {
  return useInfiniteQuery({ ...noticeQueries.list(f), enabled: opts.enabled ?? true });
}

export function useNoticeQuery(id: string) {
  return useQuery({ ...noticeQueries.detail(id), enabled: !!id });
}

/**
 * A file attached to a notice or an answer, as kept until it is sent: a photo from the picker, or (on
 * the web) a PDF chosen from the computer, both readable back through their URI.
 */
export type DraftFile = DraftPhoto;

/** The multipart body of POST /api/notices: its fields as strings (parts as JSON), then the files. */
export async function noticeFormData(input: NoticeChange, files: DraftFile[]): Promise<FormData> {
  const form = new FormData();
  form.append('kitModelId', input.kitModelId);
  form.append('level', input.level);
  form.append('title', input.title);
  form.append('body', input.body);
  // Left out: every serial.
  if (input.serialFrom && input.serialTo) {
    form.append('serialFrom', input.serialFrom);
    form.append('serialTo', input.serialTo);
  }
  form.append('reaches', input.reaches);
  form.append('parts', JSON.stringify(input.parts));
  await appendPhotos(form, files, 'files');
  return form;
}

/**
 * The multipart body of a build's compliance: the outcome and its words, the device's times (when it was
 * done, and when it was sent: the server flags a device clock far from its own), the photos.
 */
export async function complianceFormData(input: ComplianceChange, time: DeviceTime, photos: DraftFile[]) {
  const form = new FormData();
  form.append('outcome', input.outcome);
  if (input.outcome === 'done') form.append('note', input.note);
  else form.append('reason', input.reason);
  if (time.doneAt) form.append('doneAt', time.doneAt);
  if (time.sentAt) form.append('sentAt', time.sentAt);
  await appendPhotos(form, photos);
  return form;
}

/** A build's new answer, written into the notice's cached page at once; lists and that build's log asked again. */
function refreshAnswer(qc: QueryClient, noticeId: string, a: NoticeBuildAnswer) {
  qc.setQueryData<NoticeDetail>(noticeKeys.detail(noticeId), (n) =>
    n ? { ...n, builds: n.builds.map((b) => (b.buildId === a.buildId ? a : b)) } : n,
  );
  return invalidateAll(qc, [noticeKeys.detail(noticeId), noticeKeys.lists(), buildLogKeys.build(a.buildId)]);
}

/** Not yours or not now (someone answered meanwhile): fetch the notice as it stands, with its `allowed`. */
function refetchOnRefusal(qc: QueryClient, noticeId: string, e: unknown) {
  if (e instanceof ApiError && (e.status === 403 || e.status === 409))
    return qc.invalidateQueries({ queryKey: noticeKeys.detail(noticeId) });
  return undefined;
}

/** The supplier issues a notice: the answer is the notice's page; every list and every build's log may show it. */
export function useNoticeIssueMutation() {
  const qc = useQueryClient();
  return useMutation({
    // Files are not sent twice by themselves: the draft stays on screen and the person sends again.
    retry: false,
    mutationFn: async ({ input, files }: { input: NoticeChange; files: DraftFile[] }) =>
      api.upload<NoticeDetail>('/api/notices', await noticeFormData(input, files)),
    onSuccess: (n) => {
      qc.setQueryData(noticeKeys.detail(n.id), n);
      return invalidateAll(qc, [noticeKeys.lists(), buildLogKeys.all]);
    },
  });
}

/** Someone on the build says they have read the notice. */
export function useNoticeAcknowledgeMutation(noticeId: string) {
  const qc = useQueryClient();
  return useMutation({
    retry: false,
    mutationFn: (buildId: string) => {
      const now = new Date().toISOString();
      return api.post<NoticeBuildAnswer>(answerPath(noticeId, buildId, 'acknowledge'), {
        doneAt: now,
        sentAt: now,
      } satisfies DeviceTime);
    },
    onSuccess: (a) => refreshAnswer(qc, noticeId, a),
    onError: (e) => refetchOnRefusal(qc, noticeId, e),
  });
}

export type ComplianceVars = { buildId: string; input: ComplianceChange; photos: DraftFile[]; doneAt?: string };

/** A builder records what was done about the notice (or why it does not apply), with photos of the work. */
export function useNoticeComplianceMutation(noticeId: string) {
  const qc = useQueryClient();
  return useMutation({
    retry: false,
    mutationFn: async ({ buildId, input, photos, doneAt }: ComplianceVars) => {
      // The time on the device: the log keeps when the work was done, not when it reached the server.
      const now = new Date().toISOString();
      return api.upload<NoticeBuildAnswer>(
        answerPath(noticeId, buildId, 'compliance'),
        await complianceFormData(input, { doneAt: doneAt ?? now, sentAt: now }, photos),
      );
    },
    onSuccess: (a) => refreshAnswer(qc, noticeId, a),
    onError: (e) => refetchOnRefusal(qc, noticeId, e),
  });
}
