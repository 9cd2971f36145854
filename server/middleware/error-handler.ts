import type { NextFunction, Request, Response } from 'express';
import { MulterError } from 'multer';
import { ZodError } from 'zod';
import type { ApiErrorBody } from '../../db/contracts';
import { EngineeringInputError } from '../engineering/errors';
import { HttpError } from '../http-error';
import { requestIdOf } from './request-log';

/**
 * The one error shape, plus the request's id (server/middleware/request-log.ts, also in the X-Request-Id header and the
 * request's log line) so a reported error can be found in the logs. `requestId` is added here rather
 * than in ApiErrorBody (db/contracts/common.ts), which the app reads.
 */
export type ApiErrorBodyWithRequestId = { error: ApiErrorBody['error'] & { requestId?: string } };

/** Turns every error into the one JSON shape; unknown errors are logged and answered without detail. */
export function errorHandler(err: unknown, req: Request, res: Response, _next: NextFunction) {
  if (res.headersSent) return;
  const requestId = requestIdOf(req);
  const send = (status: number, error: ApiErrorBody['error']) => {
    res.status(status).json({ error: { ...error, requestId } } satisfies ApiErrorBodyWithRequestId);
  };
  if (err instanceof HttpError) return send(err.status, { code: err.code, message: err.message, fields: err.fields });
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
  if (err instanceof MulterError) {
    if (err.code === 'LIMIT_FILE_SIZE')
      return send(413, { code: 'too_large', message: 'a photo is larger than 10 MB' });
    if (err.code === 'LIMIT_FILE_COUNT' || err.code === 'LIMIT_UNEXPECTED_FILE') {
      return send(400, {
        code: 'invalid_input',
        message: 'attach at most 6 photos, as the "photos" field',
        fields: { photos: 'at most 6 photos' },
      });
    }
    return send(400, { code: 'invalid_input', message: err.message });
  }
  const e = err as { type?: string; status?: number; message?: string };
  if (e?.type === 'entity.parse.failed')
    return send(400, { code: 'invalid_json', message: 'the request body is not valid JSON' });
  if (e?.type === 'entity.too.large') return send(413, { code: 'too_large', message: 'the request body is too large' });
  // The request's log line carries this error when the response finishes (one line, with the id).
  // Where logs are off (tests), the console still shows it: an unexpected error is never silent.
  if (req.log?.isLevelEnabled('error')) res.err = err instanceof Error ? err : new Error(String(err));
  else console.error(`unexpected error (request ${requestId ?? '-'}):`, err);
  send(500, { code: 'internal', message: 'something went wrong on the server; try again' });
}
