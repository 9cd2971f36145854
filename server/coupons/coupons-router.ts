import { Router } from 'express';
import { couponInput } from '../../db/contracts';
import type { AppContext } from '../context';
import { requireRole } from '../middleware/require-role';
import { validateBody } from '../middleware/validate';
import { couponsService } from './coupons-service';

export function couponsRouter(ctx: AppContext): Router {
  const r = Router();
  const coupons = couponsService(ctx.db);
  r.use(requireRole('supplier'));
  r.get('/', async (req, res) => { res.json(await coupons.list(req.user!)); });
  r.get('/allowables', async (req, res) => { res.json(await coupons.allowables(req.user!)); });
  r.post('/', validateBody(couponInput), async (req, res) => { res.status(201).json(await coupons.create(req.user!, req.body)); });
  return r;
}
