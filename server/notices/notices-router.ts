import { Router } from 'express';
import { z } from 'zod';
import {
  complianceInput,
  deviceTime,
  idParam,
  MAX_COMPLIANCE_PHOTOS,
  MAX_NOTICE_FILES,
  noticeInput,
  noticeListQuery,
  pageQuery,
} from '../../db/contracts';
import type { AppContext } from '../context';
import { requireRole } from '../middleware/require-role';
import { validateQuery } from '../middleware/validate';
import { parseJsonField, photosIn, uploadedFiles } from '../photos/uploads';
import { benchTimeOf } from '../travelers/device-time';
import { noticesService } from './notices-service';

const answerParams = z.object({
  id: z.uuid({ message: 'must be an id' }),
  buildId: z.uuid({ message: 'must be an id' }),
});

/** A form's empty field is a field not given. */
const given = (v: unknown) => (v === '' ? undefined : v);

export function noticesRouter(ctx: AppContext): Router {
  const r = Router();
  const notices = noticesService(ctx);
  r.get('/', validateQuery(noticeListQuery.extend(pageQuery.shape)), async (req, res) => {
    const { cursor, limit, ...by } = res.locals.query;
    res.json(await notices.list(req.user!, by, { cursor, limit }));
  });
  // Multipart (the fields and the files) or JSON without files.
  r.post('/', requireRole('supplier'), photosIn('files', MAX_NOTICE_FILES, 'file'), async (req, res) => {
    const b = req.body ?? {};
    const input = noticeInput.parse({
      ...b,
      serialFrom: given(b.serialFrom),
      serialTo: given(b.serialTo),
      parts: parseJsonField(given(b.parts), 'parts', '[{"partDesignId":"…","letters":["A"]}]'),
    });
    res.status(201).json(await notices.issue(req.user!, input, uploadedFiles(req)));
  });
  r.get('/:id', async (req, res) => {
    res.json(await notices.detail(req.user!, idParam.parse(req.params).id));
  });
  r.post('/:id/builds/:buildId/acknowledge', async (req, res) => {
    const { id, buildId } = answerParams.parse(req.params);
    const at = benchTimeOf(deviceTime.parse(req.body ?? {}));
    res.json(await notices.acknowledge(req.user!, id, buildId, at));
  });
  r.post('/:id/builds/:buildId/compliance', photosIn('photos', MAX_COMPLIANCE_PHOTOS), async (req, res) => {
    const { id, buildId } = answerParams.parse(req.params);
    const b = req.body ?? {};
    const input = complianceInput.parse(b);
    const at = benchTimeOf(deviceTime.parse({ doneAt: given(b.doneAt), sentAt: given(b.sentAt) }));
    res.json(await notices.recordCompliance(req.user!, id, buildId, input, uploadedFiles(req), at));
  });
  return r;
}
