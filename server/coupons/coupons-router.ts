import { Router } from 'express';
import { couponCorrectionInput, couponInput, couponListQuery, idParam } from '../../db/contracts';
import type { AppContext } from '../context';
import { requireRole } from '../middleware/require-role';
import { validateBody, validateQuery } from '../middleware/validate';
import { couponsService } from './coupons-service';

export function couponsRouter(ctx: AppContext): Router {
  const r = Router();
  const coupons = couponsService(ctx.db);
  r.use(requireRole('supplier'));
  r.get('/', validateQuery(couponListQuery), async (req, res) => {
    res.json(await coupons.list(req.user!, res.locals.query));
  });
  r.get('/allowables', async (req, res) => {
    res.json(await coupons.allowables(req.user!));
  });
  r.post('/', validateBody(couponInput), async (req, res) => {
    res.status(201).json(await coupons.create(req.user!, req.body));
  });
  r.post('/:id/corrections', validateBody(couponCorrectionInput), async (req, res) => {
    res.status(201).json(await coupons.correct(req.user!, idParam.parse(req.params).id, req.body));
  });
  r.delete('/:id', async (req, res) => {
    await coupons.remove(req.user!, idParam.parse(req.params).id);
    res.status(204).end();
  });
  return r;
}
