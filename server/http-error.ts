/** Thrown by services; the error handler turns it into `{ error: { code, message, fields? } }`. */
export class HttpError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields?: Record<string, string>,
    /** Sent as Retry-After: how long to wait before the same request may succeed. */
    readonly retryAfterSeconds?: number,
  ) {
    super(message);
  }
}

export const badRequest = (message: string, fields?: Record<string, string>) =>
  new HttpError(400, 'invalid_input', message, fields);
export const unauthorized = (message = 'sign in first') => new HttpError(401, 'unauthorized', message);
export const forbidden = (message = 'your role may not do this') => new HttpError(403, 'forbidden', message);
export const notFound = (what: string) => new HttpError(404, 'not_found', `${what} not found`);
export const conflict = (message: string, fields?: Record<string, string>) =>
  new HttpError(409, 'conflict', message, fields);
/** Loaded, not broken: 503 with Retry-After, so a client (and the bench's queued ticks) tries again later. */
export const busy = (message: string, retryAfterSeconds: number) =>
  new HttpError(503, 'busy', message, undefined, retryAfterSeconds);
