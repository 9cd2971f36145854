import type { NextFunction, Request, Response } from 'express';
import { ZodError } from 'zod';
import type { ApiErrorBody } from '../../db/contracts';
import { isPoolBusy } from '../../db';
import { EngineeringInputError } from '../engineering/errors';
import { busy, HttpError } from '../http-error';
import { requestIdOf } from './request-log';

/**
 * The one error shape, plus the request's id (server/middleware/request-log.ts, also in the X-Request-Id header and the
 * request's log line) so a reported error can be found in the logs. `requestId` is added here rather
 * than in ApiErrorBody (db/contracts/common.ts), which the app reads.
 */
export type ApiErrorBodyWithRequestId = { error: ApiErrorBody['error'] & { requestId?: string } };

/** Turns every error into the one JSON shape; unknown errors are logged and answered without detail. */
export function errorHandler(thrown: unknown, req: Request, res: Response, _next: NextFunction) {
  if (res.headersSent) return;
  // Every database connection stayed taken while the request waited: load, not a fault of the request.
  const err = isPoolBusy(thrown) ? busy('the server is busy: try again in a few seconds', 5) : thrown;
  const requestId = requestIdOf(req);
  const send = (status: number, error: ApiErrorBody['error']) => {
    res.status(status).json({ error: { ...error, requestId } } satisfies ApiErrorBodyWithRequestId);
  };
  if (err instanceof HttpError) {
    if (err.retryAfterSeconds !== undefined) res.set('Retry-After', String(err.retryAfterSeconds));
    return send(err.status, { code: err.code, message: err.message, fields: err.fields });
  }
  if (err instanceof ZodError) {
    const fields: Record<string, string> = {};
    for (const issue of err.issues) {
      const key = issue.path.join('.') || '_';
      fields[key] ??= issue.message;
    }
    const summary = Object.entries(fields)
      .map(([k, m]) => `${k}: ${m}`)
      .join('; ');
    return send(400, { code: 'invalid_input', message: `some fields are not right — ${summary}`, fields });
  }
  if (err instanceof EngineeringInputError) {
    return send(400, {
      code: 'invalid_input',
      message: `${err.field}: ${err.reason}`,
      fields: { [err.field]: err.reason },
    });
  }
  const refusal = clientRefusal(err);
  if (refusal) return send(refusal.status, refusal.error);
  // The request's log line carries this error when the response finishes (one line, with the id).
  // Where logs are off (tests), the console still shows it: an unexpected error is never silent.
  if (req.log?.isLevelEnabled('error')) res.err = err instanceof Error ? err : new Error(String(err));
  else console.error(`unexpected error (request ${requestId ?? '-'}):`, err);
  send(500, { code: 'internal', message: 'something went wrong on the server; try again' });
}

/** What a request sent, cut short for a message: a header may be kilobytes long. */
const quoted = (v: unknown) => JSON.stringify(String(v ?? '').slice(0, 40));

/**
 * The 4xx that Express's own parts raise before a route runs: the body reader (http-errors with a
 * `type`) and the router, whose `%`-decoding of a path fails with a URIError marked 400. Each gets a
 * message that says what to send instead; without this they would fall through as 500s.
 */
function clientRefusal(err: unknown): { status: number; error: ApiErrorBody['error'] } | null {
  const e = (err ?? {}) as {
    type?: string;
    code?: unknown;
    status?: unknown;
    encoding?: unknown;
    charset?: unknown;
    message?: string;
  };
  const status = e.status;
  if (typeof status !== 'number' || status < 400 || status > 499) return null;
  const refuse = (code: string, message: string) => ({ status, error: { code, message } });
  switch (e.type) {
    case 'entity.parse.failed':
      return refuse('invalid_json', 'the request body is not valid JSON');
    case 'entity.too.large':
      return refuse('too_large', 'the request body is too large');
    case 'encoding.unsupported':
      return refuse(
        'unsupported_encoding',
        `the request body's content encoding ${quoted(e.encoding)} is not one the server reads: send it as it is, or as gzip, deflate or br`,
      );
    case 'charset.unsupported':
      return refuse(
        'unsupported_charset',
        `the request body's charset ${quoted(e.charset)} is not one the server reads: send UTF-8`,
      );
  }
  if (err instanceof URIError) return refuse('invalid_address', 'the address has a malformed %-escape');
  // A body cut off or not the length it said (raw-body's types), a compressed body that does not
  // inflate (zlib's codes). Any other 4xx error keeps the 500 below: it is none of these.
  if (/^(request|stream)\./.test(e.type ?? '') || /^Z_/.test(String(e.code ?? '')))
    return refuse('unreadable_body', `the request body could not be read (${String(e.message).slice(0, 80)})`);
  return null;
}

/**
 * The web app's side (static files and the single-page app's paths): a plain answer with no stack, a
 * malformed address refused as such. Without it Express's fallback page would show the server's stack.
 */
export function pageErrorHandler(err: unknown, req: Request, res: Response, _next: NextFunction) {
  if (res.headersSent) return;
  const refusal = clientRefusal(err);
  // No path in the line: an app path may carry a one-time link's token.
  if (!refusal) console.error(`unexpected error serving a page (request ${requestIdOf(req) ?? '-'}):`, err);
  res
    .status(refusal?.status ?? 500)
    .type('text/plain')
    .send(refusal ? `Not served: ${refusal.error.message}.` : 'Something went wrong on the server; try again.');
}
