import { Router } from 'express';
import { buildInput, idParam } from '../../db/contracts';
import type { AppContext } from '../context';
import { requireRole } from '../middleware/require-role';
import { validateBody } from '../middleware/validate';
import { buildsService } from './builds-service';

export function buildsRouter(ctx: AppContext): Router {
  const r = Router();
  const builds = buildsService(ctx.db, ctx.config.publicUrl);
  r.get('/', async (req, res) => { res.json(await builds.list(req.user!)); });
  r.post('/', requireRole('supplier'), validateBody(buildInput), async (req, res) => { res.status(201).json(await builds.create(req.user!, req.body)); });
  r.get('/:id', async (req, res) => { res.json(await builds.detail(req.user!, idParam.parse(req.params).id)); });
  r.get('/:id/labels', requireRole('supplier'), async (req, res) => { res.json(await builds.labels(req.user!, idParam.parse(req.params).id)); });
  return r;
}
