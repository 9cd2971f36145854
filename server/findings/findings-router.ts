import { Router } from 'express';
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
import { validateBody, validateQuery } from '../middleware/validate';
import { MAX_PHOTOS, parseJsonField, photosIn, uploadedFiles } from '../photos/uploads';
import { findingsService } from './findings-service';

const actionParams = z.object({
  id: z.uuid({ message: 'must be an id' }),
  action: z.enum(findingActions, { message: `the step is one of ${findingActions.join(', ')}` }),
});

export function findingsRouter(ctx: AppContext): Router {
  const r = Router();
  const service = findingsService(ctx);

  r.get('/', validateQuery(findingListQuery), async (req, res) => {
    res.json(await service.page(req.user!, res.locals.query));
  });
  r.post('/', photosIn('photos', MAX_PHOTOS), async (req, res) => {
    const input = findingInput.parse({
      ...req.body,
      holeIds: parseJsonField(req.body?.holeIds, 'holeIds', '["U-03"]'),
      measurements:
        req.body?.measurements === undefined
          ? undefined
          : parseJsonField(req.body.measurements, 'measurements', '{"holeDiameterIn":0.134}'),
    });
    res.status(201).json(await service.create(req.user!, input, uploadedFiles(req)));
  });
  r.get('/:id', async (req, res) => {
    res.json(await service.detail(req.user!, idParam.parse(req.params).id));
  });
  r.post('/:id/repair-check', validateBody(reworkCheckInput), async (req, res) => {
    res.json(await service.repairCheck(req.user!, idParam.parse(req.params).id, req.body.proposedSpec));
  });
  // One decision, one request: JSON, or multipart when it carries photos (work done).
  r.post('/:id/:action', photosIn('photos', MAX_PHOTOS), async (req, res) => {
    const { id, action } = actionParams.parse(req.params);
    const input = findingActionInput.parse(req.body ?? {});
    res.json(await service.act(req.user!, id, action, input, uploadedFiles(req)));
  });
  return r;
}
