import { Router, type Request, type Response } from 'express';
import multer from 'multer';
import { dispositionInput, findingInput, findingListQuery, findingStepInput, idParam, reworkCheckInput } from '../../db/contracts';
import type { AppContext } from '../context';
import { badRequest } from '../http-error';
import { validateBody, validateQuery } from '../middleware/validate';
import type { Action } from './finding-transitions';
import { findingsService } from './findings-service';

export const MAX_PHOTOS = 6;
const upload = multer({ storage: multer.memoryStorage(), limits: { fileSize: 10 * 1024 * 1024, files: MAX_PHOTOS, fields: 12, fieldSize: 64 * 1024 } });

/** Multipart fields are strings: holeIds comes as a JSON array (or a comma list from a plain form). */
function parseHoleIds(raw: unknown): unknown {
  if (typeof raw !== 'string') return raw;
  const s = raw.trim();
  if (s.startsWith('[')) {
    try { return JSON.parse(s); } catch { throw badRequest('holeIds is not a valid list', { holeIds: 'send a JSON array such as ["U-03"]' }); }
  }
  return s.split(',').map((h) => h.trim()).filter(Boolean);
}

export function findingsRouter(ctx: AppContext): Router {
  const r = Router();
  const service = findingsService(ctx);

  r.get('/', validateQuery(findingListQuery), async (req, res) => { res.json(await service.list(req.user!, res.locals.query)); });
  r.post('/', upload.array('photos', MAX_PHOTOS), async (req, res) => {
    const input = findingInput.parse({ ...req.body, holeIds: parseHoleIds(req.body?.holeIds) });
    const files = (req.files as Express.Multer.File[] | undefined) ?? [];
    res.status(201).json(await service.create(req.user!, input, files));
  });
  r.get('/:id', async (req, res) => { res.json(await service.detail(req.user!, idParam.parse(req.params).id)); });
  r.post('/:id/rework-check', validateBody(reworkCheckInput), async (req, res) => {
    res.json(await service.reworkCheck(req.user!, idParam.parse(req.params).id, req.body.proposedSpec));
  });

  const step = (action: Action) => async (req: Request, res: Response) => {
    res.json(await service.act(req.user!, idParam.parse(req.params).id, action, req.body));
  };
  r.post('/:id/review', validateBody(findingStepInput), step('review'));
  r.post('/:id/disposition', validateBody(dispositionInput), step('disposition'));
  r.post('/:id/rework-done', validateBody(findingStepInput), step('rework-done'));
  r.post('/:id/verify', validateBody(findingStepInput), step('verify'));
  r.post('/:id/close', validateBody(findingStepInput), step('close'));
  return r;
}
