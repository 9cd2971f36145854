import { Router } from 'express';
import { z } from 'zod';
import {
  idParam,
  labelsQuery,
  lookupInput,
  moveRevisionInput,
  stepInput,
  tickHolesInput,
  workHoursInput,
  workPhotosInput,
  workStartInput,
  workStopInput,
  travelerListQuery,
  withdrawSignOffInput,
} from '../../db/contracts';
import type { AppContext } from '../context';
import { findingsService } from '../findings/findings-service';
import { validateBody, validateQuery } from '../middleware/validate';
import { MAX_PHOTOS, parseJsonField, photosIn, uploadedFiles } from '../photos/uploads';
import { travelersService } from './travelers-service';

const stepParams = z.object({ id: z.uuid({ message: 'must be an id' }), stepId: z.uuid({ message: 'must be an id' }) });

export function travelersRouter(ctx: AppContext): Router {
  const r = Router();
  const findings = findingsService(ctx);
  const service = travelersService(ctx.db, ctx.pool, findings.list, {
    mailQueue: ctx.mailQueue,
    publicUrl: ctx.config.publicUrl,
    storage: ctx.storage,
  });
  r.get('/', validateQuery(travelerListQuery), async (req, res) => {
    res.json(await service.page(req.user!, res.locals.query));
  });
  r.get('/labels', validateQuery(labelsQuery), async (req, res) => {
    res.json(await service.labels(req.user!, res.locals.query));
  });
  r.get('/lookup', validateQuery(lookupInput), async (req, res) => {
    res.json(await service.lookup(req.user!, res.locals.query.code));
  });
  r.get('/:id', async (req, res) => {
    res.json(await service.detail(req.user!, idParam.parse(req.params).id));
  });
  r.post('/:id/holes', validateBody(tickHolesInput), async (req, res) => {
    res.json(await service.tickHoles(req.user!, idParam.parse(req.params).id, req.body));
  });
  r.post('/:id/steps/:stepId', validateBody(stepInput), async (req, res) => {
    const { id, stepId } = stepParams.parse(req.params);
    res.json(await service.setStep(req.user!, id, stepId, req.body));
  });
  r.post('/:id/work/start', validateBody(workStartInput), async (req, res) => {
    res.json(await service.startWork(req.user!, idParam.parse(req.params).id, req.body));
  });
  r.post('/:id/work/stop', validateBody(workStopInput), async (req, res) => {
    res.json(await service.stopWork(req.user!, idParam.parse(req.params).id, req.body));
  });
  r.post('/:id/work/hours', validateBody(workHoursInput), async (req, res) => {
    res.json(await service.enterHours(req.user!, idParam.parse(req.params).id, req.body));
  });
  r.post('/:id/photos', photosIn('photos', MAX_PHOTOS), async (req, res) => {
    const input = workPhotosInput.parse({
      ...req.body,
      holeIds: parseJsonField(req.body?.holeIds, 'holeIds', '["U-03"]'),
    });
    res.json(await service.addWorkPhotos(req.user!, idParam.parse(req.params).id, input, uploadedFiles(req)));
  });
  r.post('/:id/steps/:stepId/stamp', async (req, res) => {
    const { id, stepId } = stepParams.parse(req.params);
    res.json(await service.stampStep(req.user!, id, stepId));
  });
  r.post('/:id/sign-off', async (req, res) => {
    res.json(await service.signOff(req.user!, idParam.parse(req.params).id));
  });
  r.post('/:id/sign-off/withdraw', validateBody(withdrawSignOffInput), async (req, res) => {
    res.json(await service.withdrawSignOff(req.user!, idParam.parse(req.params).id, req.body.reason));
  });
  r.post('/:id/revision', validateBody(moveRevisionInput), async (req, res) => {
    res.json(await service.moveToRevision(req.user!, idParam.parse(req.params).id, req.body));
  });
  return r;
}
