import { Router, type RequestHandler, type Response } from 'express';
import {
  buildLogPageQuery,
  buildLogQuery,
  idParam,
  type BuildLogPageQuery,
  type BuildLogQuery,
} from '../../db/contracts';
import type { AppContext } from '../context';
import { validateQuery } from '../middleware/validate';
import { buildLogService } from './build-log-service';

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
  return r;
}
