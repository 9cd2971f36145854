import { Router } from 'express';
import { idParam, kitChangeInput, kitModelInput, pageQuery } from '../../db/contracts';
import type { AppContext } from '../context';
import { requireRole } from '../middleware/require-role';
import { validateBody, validateQuery } from '../middleware/validate';
import { kitsService } from './kits-service';

export function kitsRouter(ctx: AppContext): Router {
  const r = Router();
  const kits = kitsService(ctx.db);
  r.use(requireRole('supplier'));
  r.get('/', validateQuery(pageQuery), async (req, res) => {
    res.json(await kits.list(req.user!, res.locals.query));
  });
  r.post('/', validateBody(kitModelInput), async (req, res) => {
    res.status(201).json(await kits.create(req.user!, req.body));
  });
  r.get('/:id', async (req, res) => {
    res.json(await kits.detail(req.user!, idParam.parse(req.params).id));
  });
  r.patch('/:id', validateBody(kitChangeInput), async (req, res) => {
    res.json(await kits.update(req.user!, idParam.parse(req.params).id, req.body));
  });
  r.delete('/:id', async (req, res) => {
    await kits.remove(req.user!, idParam.parse(req.params).id);
    res.status(204).end();
  });
  return r;
}
