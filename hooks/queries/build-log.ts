import { keepPreviousData, useInfiniteQuery, useMutation } from '@tanstack/react-query';
import { Platform } from 'react-native';
import type { ApiErrorBody, BuildLogGroup, BuildLogPage, LogChainReport, LogFileCheck } from '@/db/contracts';
import { api, ApiError, networkMessage, qs, url } from '@/lib/api-client';
import { useSession } from '../use-session';
import { pagedQueryOptions } from './paged';

/**
 * What the server narrows: a kind family, one part, and search words (the log comes in pages, so words
 * must be searched where the whole log is; the screen also narrows the pages it has at once, as they are typed).
 */
export type BuildLogServerFilters = { group?: BuildLogGroup | 'all'; travelerId?: string | null; text?: string };
/** What an export carries: the screen's filters, words included, and the zone to print times in. */
export type BuildLogExportFilters = BuildLogServerFilters & { text?: string; tz?: string };
export type BuildLogFormat = 'csv' | 'pdf';

const logPath = (buildId: string, suffix = '') => `/api/builds/${encodeURIComponent(buildId)}/log${suffix}`;

/** The server's names of the filters, as the log's pages and its exports both take them. */
function logFilters(f: BuildLogServerFilters) {
  return {
    kind: f.group && f.group !== 'all' ? f.group : undefined,
    travelerId: f.travelerId ?? undefined,
    q: f.text?.trim() || undefined,
  };
}

function logQueryString(f: BuildLogExportFilters): string {
  return qs({ ...logFilters(f), tz: f.tz });
}

export const buildLogKeys = {
  all: ['builds', 'log'] as const,
  build: (buildId: string) => [...buildLogKeys.all, buildId] as const,
  filtered: (buildId: string, f: BuildLogServerFilters = {}) =>
    [
      ...buildLogKeys.build(buildId),
      { group: f.group ?? 'all', travelerId: f.travelerId ?? null, ...(f.text?.trim() ? { text: f.text.trim() } : {}) },
    ] as const,
};

export const buildLogQueries = {
  /** The log newest first, a page at a time; the first page also names the build and its parts. */
  filtered: (buildId: string, f: BuildLogServerFilters = {}) =>
    pagedQueryOptions<BuildLogPage>(buildLogKeys.filtered(buildId, f), logPath(buildId), logFilters(f)),
};

/** The log of one build; switching a filter keeps the last answer on screen until the new one arrives. */
export function useBuildLogQuery(buildId: string, f: BuildLogServerFilters = {}) {
  return useInfiniteQuery({
    ...buildLogQueries.filtered(buildId, f),
    enabled: !!buildId,
    placeholderData: keepPreviousData,
  });
}

/** The zone the device's clock is in, so an export prints the times the person saw. */
export function deviceTimeZone(): string | undefined {
  try {
    return Intl.DateTimeFormat().resolvedOptions().timeZone || undefined;
  } catch {
    return undefined;
  }
}

function fileNameFrom(disposition: string | null, fallback: string): string {
  const star = disposition?.match(/filename\*=UTF-8''([^;]+)/i);
  if (star) {
    try {
      return decodeURIComponent(star[1]);
    } catch {
      /* fall through to the plain name */
    }
  }
  return disposition?.match(/filename="([^"]+)"/i)?.[1] ?? fallback;
}

/** Hands a file to the browser as a download: no new tab, and no token in any URL. */
function saveInBrowser(blob: Blob, name: string) {
  const href = URL.createObjectURL(blob);
  const a = document.createElement('a');
  a.href = href;
  a.download = name;
  a.rel = 'noopener';
  document.body.appendChild(a);
  a.click();
  a.remove();
  // Some browsers read the blob after click() returns.
  setTimeout(() => URL.revokeObjectURL(href), 30_000);
}

/**
 * Fetches the CSV or PDF with the bearer header, like every other request, and saves it. The export
 * links are not opened by the browser directly because it would have no token to send.
 */
export function useBuildLogExportMutation(buildId: string) {
  const session = useSession();
  return useMutation({
    retry: false,
    mutationFn: async ({ format, filters }: { format: BuildLogFormat; filters: BuildLogExportFilters }) => {
      if (Platform.OS !== 'web')
        throw new Error('Exports are saved from the web app: open Pitchcard in a browser to export the log.');
      let res: Response;
      try {
        res = await fetch(url(`${logPath(buildId, `.${format}`)}${logQueryString(filters)}`), {
          headers: {
            Accept: format === 'pdf' ? 'application/pdf' : 'text/csv',
            ...(session.token ? { Authorization: `Bearer ${session.token}` } : {}),
          },
        });
      } catch {
        throw new ApiError(0, 'network', networkMessage);
      }
      if (!res.ok) {
        if (res.status === 401) void session.signOut('Your session ran out. Please sign in again.');
        const body = (await res.json().catch(() => null)) as ApiErrorBody | null;
        throw new ApiError(
          res.status,
          body?.error?.code ?? String(res.status),
          body?.error?.message ?? `The export failed (${res.status}). Try again.`,
          body?.error?.fields,
        );
      }
      const name = fileNameFrom(res.headers.get('Content-Disposition'), `build-log.${format}`);
      saveInBrowser(await res.blob(), name);
      return { name };
    },
  });
}

/** A check's answer: the file's name, the server's comparison, and the chain's head as it is now (null when that read failed). */
export type BuildLogCheck = { name: string; check: LogFileCheck; chain: LogChainReport | null };

/**
 * Sends an exported CSV (multipart field `file`) to be compared with the hash chain kept here, then reads
 * the chain's head so the answer can say which link the log has reached. Web only, like the exports: the
 * file is chosen from the computer.
 */
export function useBuildLogCheckMutation(buildId: string) {
  return useMutation({
    retry: false,
    mutationFn: async ({ file, name }: { file: Blob; name: string }): Promise<BuildLogCheck> => {
      if (Platform.OS !== 'web')
        throw new Error('An exported log is checked from the web app: open Pitchcard in a browser to check a file.');
      const form = new FormData();
      form.append('file', file, name);
      const check = await api.upload<LogFileCheck>(logPath(buildId, '/check'), form);
      // The comparison stands on its own: a failed read of the head only leaves that line out.
      const chain = await api.get<LogChainReport>(logPath(buildId, '/chain')).catch(() => null);
      return { name, check, chain };
    },
  });
}
