import { Router, type RequestHandler, type Response } from 'express';
import multer from 'multer';
import {
  buildLogPageQuery,
  buildLogQuery,
  idParam,
  LOG_CHECK_FILE_MAX_MB,
  type BuildLogPageQuery,
  type BuildLogQuery,
} from '../../db/contracts';
import type { AppContext } from '../context';
import { badRequest, HttpError } from '../http-error';
import { validateQuery } from '../middleware/validate';
import { readUpload } from '../photos/uploads';
import { buildLogService } from './build-log-service';
import { logChainService } from './log-chain-service';

/** `attachment; filename=…` with the plain name and its UTF-8 form (RFC 6266). */
function attachment(filename: string): string {
  const plain = filename.replace(/[^\x20-\x7e]|["\\]/g, '_');
  return `attachment; filename="${plain}"; filename*=UTF-8''${encodeURIComponent(filename)}`;
}

/**
 * Streams an export once its checks have passed (they answer 4xx as JSON, before any byte). Once bytes
 * went out an error can no longer become a JSON answer: the response is cut off instead, so the reader
 * sees a failed download, never a file that looks whole.
 */
async function stream(res: Response, headers: Record<string, string>, write: (out: Response) => Promise<void>) {
  res.set({ ...headers, 'Cache-Control': 'private, no-store' });
  res.status(200);
  try {
    await write(res);
  } catch (err) {
    res.destroy(err instanceof Error ? err : new Error(String(err)));
  }
}

/** An export of the log: the service's checks and the file's name, then the file streamed as `contentType`. */
type MakeExport = (
  user: Express.User,
  buildId: string,
  q: BuildLogQuery,
) => Promise<{ filename: string; write: (out: Response) => Promise<void> }>;

function exportRoute(make: MakeExport, contentType: string): RequestHandler {
  return async (req, res) => {
    const file = await make(req.user!, idParam.parse(req.params).id, res.locals.query as BuildLogQuery);
    await stream(res, { 'Content-Type': contentType, 'Content-Disposition': attachment(file.filename) }, file.write);
  };
}

/** One exported log in memory, as the `file` field, its limits refused in its own words (one CSV, its size). */
const oneLogFile = multer({
  storage: multer.memoryStorage(),
  limits: { fileSize: LOG_CHECK_FILE_MAX_MB * 1024 * 1024, files: 1, fields: 4, parts: 5 },
}).single('file');
const logUpload = readUpload(oneLogFile, 'file', (err) =>
  err.code === 'LIMIT_FILE_SIZE'
    ? new HttpError(413, 'too_large', `the log file is larger than ${LOG_CHECK_FILE_MAX_MB} MB`)
    : badRequest('attach one CSV file, as the "file" field', { file: 'one CSV file' }),
);

/**
 * GET /api/builds/:id/log (JSON, one page at a time), /log.csv and /log.pdf, same filters. Mounted on /builds ahead of the
 * builds router; it signs in only its own routes, so other /builds requests are not authenticated twice.
 * The exports take the bearer header like every other route: the app fetches them and hands the file
 * to the browser, so no token ever sits in a URL.
 */
export function buildLogRouter(ctx: AppContext, signedIn: RequestHandler): Router {
  const r = Router();
  const service = buildLogService(ctx);
  const query = validateQuery(buildLogQuery);

  r.get('/:id/log', signedIn, validateQuery(buildLogPageQuery), async (req, res) => {
    res.set('Cache-Control', 'private, no-store');
    res.json(await service.page(req.user!, idParam.parse(req.params).id, res.locals.query as BuildLogPageQuery));
  });
  r.get('/:id/log.csv', signedIn, query, exportRoute(service.csv, 'text/csv; charset=utf-8; header=present'));
  r.get('/:id/log.pdf', signedIn, query, exportRoute(service.pdf, 'application/pdf'));

  // The hash chain: its state, and an exported CSV checked against it. The upload is read only once the
  // build is known to be visible (404 first), so nobody makes the server hold a file for a build they cannot see.
  const chain = logChainService(ctx);
  r.get('/:id/log/chain', signedIn, async (req, res) => {
    res.set('Cache-Control', 'private, no-store');
    res.json(await chain.chain(req.user!, idParam.parse(req.params).id));
  });
  r.post(
    '/:id/log/check',
    signedIn,
    async (req, _res, next) => {
      await chain.mustSee(req.user!, idParam.parse(req.params).id);
      next();
    },
    logUpload,
    async (req, res) => {
      res.set('Cache-Control', 'private, no-store');
      res.json(await chain.checkFile(req.user!, idParam.parse(req.params).id, req.file));
    },
  );
  return r;
}
