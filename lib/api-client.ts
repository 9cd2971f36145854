import type { ApiErrorBody } from '@/db/contracts';

/**
 * The one way the app talks to the server. On the web the app is served by the same Express process
 * as the API, so paths stay relative (same origin); a native build, or `expo start` on another port,
 * sets EXPO_PUBLIC_API_URL.
 */
export const apiBaseUrl: string = (process.env.EXPO_PUBLIC_API_URL ?? '').replace(/\/+$/, '');

export class ApiError extends Error {
  readonly status: number;
  readonly code: string;
  readonly fields?: Record<string, string>;

  constructor(status: number, code: string, message: string, fields?: Record<string, string>) {
    super(message);
    this.name = 'ApiError';
    this.status = status;
    this.code = code;
    this.fields = fields;
  }

  /** True when the request never reached the server (no signal, server down). */
  get isNetwork(): boolean {
    return this.status === 0;
  }
}

export const networkMessage = 'No connection to the server. Check the signal and try again.';

type ClientHooks = {
  getToken: () => string | null;
  /** The signed-in person's id; null when no one is; undefined while the stored session is still being read. */
  getPersonId: () => string | null | undefined;
  onUnauthorized: () => void;
};
let hooks: ClientHooks = { getToken: () => null, getPersonId: () => null, onUnauthorized: () => {} };

/** The session provider registers how to read the token and what to do when it is refused. */
export function configureApiClient(next: Partial<ClientHooks>): void {
  hooks = { ...hooks, ...next };
}

/** The id of the person signed in on this device now: null when no one is, undefined while not yet known. */
export const signedInPersonId = (): string | null | undefined => hooks.getPersonId();

const statusWords: Record<number, string> = {
  400: 'Some of what was sent is not right.',
  401: 'Please sign in again.',
  403: 'Your role may not do this.',
  404: 'Not found, or not yours to see.',
  409: 'This changed meanwhile, or cannot change now.',
  413: 'That is too large to send.',
  415: 'That file is not an image the server can read.',
  429: 'Too many tries. Wait a moment and try again.',
  500: 'The server ran into a problem. Try again in a moment.',
};

function isErrorBody(x: unknown): x is ApiErrorBody {
  return (
    !!x &&
    typeof x === 'object' &&
    'error' in x &&
    !!(x as ApiErrorBody).error &&
    typeof (x as ApiErrorBody).error.message === 'string'
  );
}

export function url(path: string): string {
  return `${apiBaseUrl}${path}`;
}

export type RequestOptions = {
  method?: 'GET' | 'POST' | 'PATCH' | 'PUT' | 'DELETE';
  body?: unknown;
  form?: FormData;
  signal?: AbortSignal;
  /** For sign-in: a 401 there means a wrong password, not an expired session. */
  skipUnauthorizedHook?: boolean;
};

/**
 * GETs started before the app has drawn anything (components/navigation/early-arrival.web.ts: a page opened from its link by a
 * person already signed in), by path: the first request of the same path with the same token takes the
 * answer instead of asking again, and everything after it (errors, a refused session) goes as for any
 * request. Each is taken once, and only soon after it started: a later ask is a fresh one.
 */
const early = new Map<string, { token: string; at: number; response: Promise<Response> }>();
/** How long an early answer waits to be taken, ms (a start-up's length, with room for a slow phone). */
const EARLY_TAKEN_WITHIN_MS = 15_000;
/** Early answers kept at once, at most: one page's few requests. */
const EARLY_MAX = 4;

export function startEarlyGet(path: string, token: string): void {
  if (early.has(path) || early.size >= EARLY_MAX || typeof fetch !== 'function') return;
  const response = fetch(url(path), {
    method: 'GET',
    headers: { Accept: 'application/json', Authorization: `Bearer ${token}` },
  });
  // A failure is the taker's to report; an answer never taken fails quietly.
  response.catch(() => undefined);
  early.set(path, { token, at: Date.now(), response });
}

function takeEarly(path: string, token: string | null): Promise<Response> | null {
  const e = early.get(path);
  if (!e) return null;
  early.delete(path);
  return e.token === token && Date.now() - e.at <= EARLY_TAKEN_WITHIN_MS ? e.response : null;
}

export async function apiRequest<T>(path: string, opts: RequestOptions = {}): Promise<T> {
  const headers: Record<string, string> = { Accept: 'application/json' };
  const token = hooks.getToken();
  if (token) headers.Authorization = `Bearer ${token}`;
  let body: BodyInit | undefined;
  if (opts.form) {
    body = opts.form; // the browser sets the multipart boundary itself
  } else if (opts.body !== undefined) {
    headers['Content-Type'] = 'application/json';
    body = JSON.stringify(opts.body);
  }

  let res: Response;
  try {
    const taken = !body && (opts.method ?? 'GET') === 'GET' ? takeEarly(path, token) : null;
    res = await (taken ??
      fetch(url(path), {
        method: opts.method ?? (body ? 'POST' : 'GET'),
        headers,
        body,
        signal: opts.signal,
      }));
  } catch (e) {
    if ((e as Error)?.name === 'AbortError') throw e;
    throw new ApiError(0, 'network', networkMessage);
  }

  const text = await res.text();
  let data: unknown = undefined;
  if (text) {
    try {
      data = JSON.parse(text);
    } catch {
      data = undefined;
    }
  }

  if (!res.ok) {
    if (res.status === 401 && !opts.skipUnauthorizedHook) hooks.onUnauthorized();
    if (isErrorBody(data)) {
      const { code, message, fields } = data.error;
      throw new ApiError(res.status, code ?? String(res.status), message, fields);
    }
    throw new ApiError(res.status, String(res.status), statusWords[res.status] ?? `The server answered ${res.status}.`);
  }
  return data as T;
}

export const api = {
  get: <T>(path: string, signal?: AbortSignal) => apiRequest<T>(path, { method: 'GET', signal }),
  post: <T>(path: string, body?: unknown) => apiRequest<T>(path, { method: 'POST', body: body ?? {} }),
  patch: <T>(path: string, body: unknown) => apiRequest<T>(path, { method: 'PATCH', body }),
  upload: <T>(path: string, form: FormData) => apiRequest<T>(path, { method: 'POST', form }),
};

/** A message fit to show a person, whatever was thrown. */
export function errorMessage(e: unknown): string {
  if (e instanceof ApiError) return e.message;
  if (e instanceof Error && e.message) return e.message;
  return 'Something went wrong.';
}

/** Builds a query string from the defined values only. */
export function qs(params: Record<string, string | number | undefined | null>): string {
  const parts = Object.entries(params)
    .filter(([, v]) => v !== undefined && v !== null && v !== '')
    .map(([k, v]) => `${encodeURIComponent(k)}=${encodeURIComponent(String(v))}`);
  return parts.length ? `?${parts.join('&')}` : '';
}
