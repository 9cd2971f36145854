import type { NextFunction, Request, Response } from 'express';
import { MulterError } from 'multer';
import { ZodError } from 'zod';
import type { ApiErrorBody } from '../../db/contracts';
import { EngineeringInputError } from '../engineering/errors';
import { HttpError } from '../http-error';

function send(res: Response, status: number, error: ApiErrorBody['error']) {
  res.status(status).json({ error } satisfies ApiErrorBody);
}

/** Turns every error into the one JSON shape; unknown errors are logged and answered without detail. */
export function errorHandler(err: unknown, _req: Request, res: Response, _next: NextFunction) {
  if (res.headersSent) return;
  if (err instanceof HttpError) return send(res, err.status, { code: err.code, message: err.message, fields: err.fields });
  if (err instanceof ZodError) {
    const fields: Record<string, string> = {};
    for (const issue of err.issues) {
      const key = issue.path.join('.') || '_';
      fields[key] ??= issue.message;
    }
    const summary = Object.entries(fields).map(([k, m]) => `${k}: ${m}`).join('; ');
    return send(res, 400, { code: 'invalid_input', message: `some fields are not right — ${summary}`, fields });
  }
  if (err instanceof EngineeringInputError) {
    return send(res, 400, { code: 'invalid_input', message: `${err.field}: ${err.reason}`, fields: { [err.field]: err.reason } });
  }
  if (err instanceof MulterError) {
    if (err.code === 'LIMIT_FILE_SIZE') return send(res, 413, { code: 'too_large', message: 'a photo is larger than 10 MB' });
    if (err.code === 'LIMIT_FILE_COUNT' || err.code === 'LIMIT_UNEXPECTED_FILE') {
      return send(res, 400, { code: 'invalid_input', message: 'attach at most 6 photos, as the "photos" field', fields: { photos: 'at most 6 photos' } });
    }
    return send(res, 400, { code: 'invalid_input', message: err.message });
  }
  const e = err as { type?: string; status?: number; message?: string };
  if (e?.type === 'entity.parse.failed') return send(res, 400, { code: 'invalid_json', message: 'the request body is not valid JSON' });
  if (e?.type === 'entity.too.large') return send(res, 413, { code: 'too_large', message: 'the request body is too large' });
  console.error('unexpected error:', err);
  send(res, 500, { code: 'internal', message: 'something went wrong on the server; try again' });
}
