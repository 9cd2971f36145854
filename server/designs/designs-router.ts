import { Router } from 'express';
import { z } from 'zod';
import { idParam, pageQuery, partDesignInput, publishInput, revisionInput } from '../../db/contracts';
import type { AppContext } from '../context';
import { requireRole } from '../middleware/require-role';
import { validateBody, validateQuery } from '../middleware/validate';
import { designsService } from './designs-service';

const listQuery = pageQuery.extend({ kitModelId: z.uuid({ message: 'kitModelId must be an id' }).optional() });
const createBody = z.object({ design: partDesignInput, revision: revisionInput });

export function designsRouter(ctx: AppContext): Router {
  const r = Router();
  const designs = designsService(ctx.db);
  r.use(requireRole('supplier'));
  r.get('/', validateQuery(listQuery), async (req, res) => {
    res.json(await designs.list(req.user!, res.locals.query));
  });
  r.post('/', validateBody(createBody), async (req, res) => {
    res.status(201).json(await designs.create(req.user!, req.body));
  });
  r.get('/:id', async (req, res) => {
    res.json(await designs.detail(req.user!, idParam.parse(req.params).id));
  });
  r.get('/:id/finding-clusters', async (req, res) => {
    res.json(await designs.findingClusters(req.user!, idParam.parse(req.params).id));
  });
  r.post('/:id/revisions', validateBody(revisionInput), async (req, res) => {
    res.status(201).json(await designs.newRevision(req.user!, idParam.parse(req.params).id, req.body));
  });
  return r;
}

export function revisionsRouter(ctx: AppContext): Router {
  const r = Router();
  const designs = designsService(ctx.db);
  r.use(requireRole('supplier'));
  r.patch('/:id', validateBody(revisionInput), async (req, res) => {
    res.json(await designs.updateRevision(req.user!, idParam.parse(req.params).id, req.body));
  });
  r.delete('/:id', async (req, res) => {
    res.json(await designs.discard(req.user!, idParam.parse(req.params).id));
  });
  r.post('/:id/publish', validateBody(publishInput), async (req, res) => {
    res.json(await designs.publish(req.user!, idParam.parse(req.params).id));
  });
  return r;
}
