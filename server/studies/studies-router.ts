import { Router } from 'express';
import { z } from 'zod';
import { applyStudyInput, idParam, studyInput } from '../../db/contracts';
import type { AppContext } from '../context';
import { requireRole } from '../middleware/require-role';
import { validateBody, validateQuery } from '../middleware/validate';
import { studiesService } from './studies-service';

const detailQuery = z.object({ revision: z.coerce.number().int().positive('revision is a whole number from 1').optional() });

export function studiesRouter(ctx: AppContext): Router {
  const r = Router();
  const studies = studiesService(ctx.db);
  r.use(requireRole('supplier'));
  r.get('/', async (req, res) => { res.json(await studies.list(req.user!)); });
  r.post('/', validateBody(studyInput), async (req, res) => { res.status(201).json(await studies.create(req.user!, req.body)); });
  r.get('/:id', validateQuery(detailQuery), async (req, res) => { res.json(await studies.detail(req.user!, idParam.parse(req.params).id, res.locals.query.revision)); });
  r.put('/:id', validateBody(studyInput), async (req, res) => { res.json(await studies.update(req.user!, idParam.parse(req.params).id, req.body)); });
  r.post('/:id/apply', validateBody(applyStudyInput), async (req, res) => { res.json(await studies.apply(req.user!, idParam.parse(req.params).id, req.body)); });
  return r;
}
