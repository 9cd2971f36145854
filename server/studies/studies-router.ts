import { Router } from 'express';
import { z } from 'zod';
import { applyStudyInput, idParam, pageQuery, plainText, studyInput } from '../../db/contracts';
import { GAUGE_RANGE_IN, measured } from '../../db/contracts/engineering';
import type { AppContext } from '../context';
import { requireRole } from '../middleware/require-role';
import { validateBody, validateQuery } from '../middleware/validate';
import { studiesService } from './studies-service';

const revision = z.coerce.number().int().positive('revision is a whole number from 1').optional();
const detailQuery = z.object({ revision });
/** A query string is text: the gauge is read as a number, then held to the gauges a study takes. */
const candidateQuery = z.object({
  gaugeIn: z.preprocess(
    (v) => (typeof v === 'string' && v.trim() !== '' ? Number(v) : v),
    measured('gauge', GAUGE_RANGE_IN.min, GAUGE_RANGE_IN.max, 'in'),
  ),
  rivet: plainText('the rivet', 1, 40, 'choose the rivet'),
  revision,
});

export function studiesRouter(ctx: AppContext): Router {
  const r = Router();
  const studies = studiesService(ctx.db);
  r.use(requireRole('supplier'));
  r.get('/', validateQuery(pageQuery), async (req, res) => {
    res.json(await studies.list(req.user!, res.locals.query));
  });
  r.post('/', validateBody(studyInput), async (req, res) => {
    res.status(201).json(await studies.create(req.user!, req.body));
  });
  r.get('/:id', validateQuery(detailQuery), async (req, res) => {
    res.json(await studies.detail(req.user!, idParam.parse(req.params).id, res.locals.query.revision));
  });
  r.get('/:id/candidate', validateQuery(candidateQuery), async (req, res) => {
    const { gaugeIn, rivet, revision: at } = res.locals.query as z.infer<typeof candidateQuery>;
    res.json(await studies.candidate(req.user!, idParam.parse(req.params).id, { gaugeIn, rivet }, at));
  });
  r.put('/:id', validateBody(studyInput), async (req, res) => {
    res.json(await studies.update(req.user!, idParam.parse(req.params).id, req.body));
  });
  r.post('/:id/apply', validateBody(applyStudyInput), async (req, res) => {
    res.json(await studies.apply(req.user!, idParam.parse(req.params).id, req.body));
  });
  return r;
}
