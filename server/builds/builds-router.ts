import { Router } from 'express';
import { z } from 'zod';
import { addMemberInput, buildChangeInput, buildInput, handOverInput, idParam, pageQuery } from '../../db/contracts';
import type { AppContext } from '../context';
import { requireRole } from '../middleware/require-role';
import { validateBody, validateQuery } from '../middleware/validate';
import { buildsService } from './builds-service';

const memberParams = z.object({
  id: z.uuid({ message: 'must be an id' }),
  userId: z.uuid({ message: 'must be an id' }),
});

export function buildsRouter(ctx: AppContext): Router {
  const r = Router();
  const builds = buildsService(ctx);
  r.get('/', validateQuery(pageQuery), async (req, res) => {
    res.json(await builds.list(req.user!, res.locals.query));
  });
  r.post('/', requireRole('supplier'), validateBody(buildInput), async (req, res) => {
    res.status(201).json(await builds.create(req.user!, req.body));
  });
  r.get('/:id', async (req, res) => {
    res.json(await builds.detail(req.user!, idParam.parse(req.params).id));
  });
  r.get('/:id/hours', async (req, res) => {
    res.json(await builds.hours(req.user!, idParam.parse(req.params).id));
  });
  r.get('/:id/fabrication', async (req, res) => {
    res.json(await builds.fabrication(req.user!, idParam.parse(req.params).id));
  });
  r.patch('/:id', validateBody(buildChangeInput), async (req, res) => {
    res.json(await builds.update(req.user!, idParam.parse(req.params).id, req.body));
  });
  r.delete('/:id', async (req, res) => {
    await builds.remove(req.user!, idParam.parse(req.params).id);
    res.status(204).end();
  });
  r.post('/:id/members', validateBody(addMemberInput), async (req, res) => {
    res.json(await builds.addMember(req.user!, idParam.parse(req.params).id, req.body));
  });
  r.delete('/:id/members/:userId', async (req, res) => {
    const { id, userId } = memberParams.parse(req.params);
    res.json(await builds.removeMember(req.user!, id, userId));
  });
  r.post('/:id/owner', validateBody(handOverInput), async (req, res) => {
    res.json(await builds.handOver(req.user!, idParam.parse(req.params).id, req.body.userId));
  });
  return r;
}
