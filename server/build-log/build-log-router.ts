import { Router, type RequestHandler } from 'express';
import { buildLogQuery, idParam, type BuildLogQuery } from '../../db/contracts';
import type { AppContext } from '../context';
import { validateQuery } from '../middleware/validate';
import { buildLogService } from './build-log-service';

/** `attachment; filename=…` with the plain name and its UTF-8 form (RFC 6266). */
function attachment(filename: string): string {
  const plain = filename.replace(/[^\x20-\x7e]|["\\]/g, '_');
  return `attachment; filename="${plain}"; filename*=UTF-8''${encodeURIComponent(filename)}`;
}

/**
 * GET /api/builds/:id/log (JSON), /log.csv and /log.pdf, same filters. Mounted on /builds ahead of the
 * builds router; it signs in only its own routes, so other /builds requests are not authenticated twice.
 * The exports take the bearer header like every other route: the app fetches them and hands the file
 * to the browser, so no token ever sits in a URL.
 */
export function buildLogRouter(ctx: AppContext, signedIn: RequestHandler): Router {
  const r = Router();
  const service = buildLogService(ctx);
  const query = validateQuery(buildLogQuery);

  r.get('/:id/log', signedIn, query, async (req, res) => {
    res.set('Cache-Control', 'private, no-store');
    res.json(await service.log(req.user!, idParam.parse(req.params).id, res.locals.query as BuildLogQuery));
  });
  r.get('/:id/log.csv', signedIn, query, async (req, res) => {
    const { filename, body } = await service.csv(req.user!, idParam.parse(req.params).id, res.locals.query as BuildLogQuery);
    res.set({ 'Content-Type': 'text/csv; charset=utf-8; header=present', 'Content-Disposition': attachment(filename), 'Cache-Control': 'private, no-store' });
    res.send(body);
  });
  r.get('/:id/log.pdf', signedIn, query, async (req, res) => {
    const { filename, body } = await service.pdf(req.user!, idParam.parse(req.params).id, res.locals.query as BuildLogQuery);
    res.set({ 'Content-Type': 'application/pdf', 'Content-Disposition': attachment(filename), 'Cache-Control': 'private, no-store' });
    res.send(body);
  });
  return r;
}
