import { Router, type RequestHandler } from 'express';
import {
  acceptInvitationInput,
  idParam,
  inviteInput,
  organizationInput,
  pageQuery,
  personUpdateInput,
} from '../../db/contracts';
import { z } from 'zod';
import type { AppContext } from '../context';
import { validateBody, validateQuery } from '../middleware/validate';
import { peopleService } from './people-service';

const tokenParam = z.object({
  token: z.string().regex(/^[A-Za-z0-9_-]{20,100}$/, 'the link is incomplete or damaged: open it again from the mail'),
});

/** Organisations and people, for the admin and a supplier's lead engineer. */
export function peopleRouter(ctx: AppContext, inviteLimits: RequestHandler[] = []): Router {
  const r = Router();
  const s = peopleService(ctx);
  r.get('/organizations', validateQuery(pageQuery), async (req, res) => {
    res.json(await s.organizations(req.user!, res.locals.query));
  });
  r.post('/organizations', validateBody(organizationInput), async (req, res) => {
    res.status(201).json(await s.createOrganization(req.user!, req.body));
  });
  r.get('/', validateQuery(pageQuery), async (req, res) => {
    res.json(await s.people(req.user!, res.locals.query));
  });
  r.get('/invitations', validateQuery(pageQuery), async (req, res) => {
    res.json(await s.pending(req.user!, res.locals.query));
  });
  r.post('/invitations', ...inviteLimits, validateBody(inviteInput), async (req, res) => {
    res.status(201).json(await s.invite(req.user!, req.body));
  });
  r.patch('/:id', validateBody(personUpdateInput), async (req, res) => {
    res.json(await s.update(req.user!, idParam.parse(req.params).id, req.body));
  });
  return r;
}

/** The one-time invitation link, used signed out. */
export function invitationsRouter(ctx: AppContext, limits: RequestHandler[] = []): Router {
  const r = Router();
  const s = peopleService(ctx);
  r.get('/:token', ...limits, async (req, res) => {
    res.json(await s.viewInvitation(tokenParam.parse(req.params).token));
  });
  r.post('/accept', ...limits, validateBody(acceptInvitationInput), async (req, res) => {
    res.json(await s.accept(req.body));
  });
  return r;
}
