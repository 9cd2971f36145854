import { Router } from 'express';
import multer from 'multer';
import { z } from 'zod';
import {
  findingActionInput,
  findingActions,
  findingInput,
  findingListQuery,
  idParam,
  reworkCheckInput,
} from '../../db/contracts';
import type { AppContext } from '../context';
import { badRequest } from '../http-error';
import { validateBody, validateQuery } from '../middleware/validate';
import { findingsService } from './findings-service';

export const MAX_PHOTOS = 6;
const upload = multer({
  storage: multer.memoryStorage(),
  limits: { fileSize: 10 * 1024 * 1024, files: MAX_PHOTOS, fields: 16, fieldSize: 64 * 1024 },
});

/** Multipart fields are strings: lists and objects come as JSON (holeIds also as a comma list from a plain form). */
function parseJsonField(raw: unknown, field: string, example: string): unknown {
  if (typeof raw !== 'string') return raw;
  const s = raw.trim();
  if (s.startsWith('[') || s.startsWith('{')) {
    try {
      return JSON.parse(s);
    } catch {
      throw badRequest(`${field} is not valid JSON`, { [field]: `send JSON such as ${example}` });
    }
  }
  return field === 'holeIds'
    ? s
        .split(',')
        .map((h) => h.trim())
        .filter(Boolean)
    : raw;
}

const actionParams = z.object({
  id: z.uuid({ message: 'must be an id' }),
  action: z.enum(findingActions, { message: `the step is one of ${findingActions.join(', ')}` }),
});

export function findingsRouter(ctx: AppContext): Router {
  const r = Router();
  const service = findingsService(ctx);
  const files = (req: { files?: unknown }) => (req.files as Express.Multer.File[] | undefined) ?? [];

  r.get('/', validateQuery(findingListQuery), async (req, res) => {
    res.json(await service.page(req.user!, res.locals.query));
  });
  r.post('/', upload.array('photos', MAX_PHOTOS), async (req, res) => {
    const input = findingInput.parse({
      ...req.body,
      holeIds: parseJsonField(req.body?.holeIds, 'holeIds', '["U-03"]'),
      measurements:
        req.body?.measurements === undefined
          ? undefined
          : parseJsonField(req.body.measurements, 'measurements', '{"holeDiameterIn":0.134}'),
    });
    res.status(201).json(await service.create(req.user!, input, files(req)));
  });
  r.get('/:id', async (req, res) => {
    res.json(await service.detail(req.user!, idParam.parse(req.params).id));
  });
  r.post('/:id/repair-check', validateBody(reworkCheckInput), async (req, res) => {
    res.json(await service.repairCheck(req.user!, idParam.parse(req.params).id, req.body.proposedSpec));
  });
  // One decision, one request: JSON, or multipart when it carries photos (work done).
  r.post('/:id/:action', upload.array('photos', MAX_PHOTOS), async (req, res) => {
    const { id, action } = actionParams.parse(req.params);
    const input = findingActionInput.parse(req.body ?? {});
    res.json(await service.act(req.user!, id, action, input, files(req)));
  });
  return r;
}
