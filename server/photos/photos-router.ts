import { Router } from 'express';
import { z } from 'zod';
import type { AppContext } from '../context';
import { findSessionUser } from '../auth/auth-repository';
import { findPhotoRow, listFindingRows } from '../findings/findings-repository';
import { forbidden, notFound } from '../http-error';

const photoQuery = z.object({
  u: z.uuid({ message: 'this photo link is not valid' }),
  exp: z.string().max(20),
  sig: z.string().max(100),
});

export function photosRouter(ctx: AppContext): Router {
  const r = Router();
  r.get('/:id/:variant', async (req, res) => {
    const { id, variant } = req.params;
    if (variant !== 'full' && variant !== 'thumb') throw notFound('photo');
    const q = photoQuery.safeParse(req.query);
    if (!q.success || !ctx.signer.verify(id, variant, q.data.u, q.data.exp, q.data.sig))
      throw forbidden('this photo link has expired or is not valid');
    // The link's person must still be active and still see the finding the photo belongs to.
    const viewer = await findSessionUser(ctx.db, q.data.u);
    if (!viewer?.active) throw forbidden('this photo link is no longer valid');
    const photo = await findPhotoRow(ctx.db, id);
    if (!photo) throw notFound('photo');
    const [visible] = await listFindingRows(ctx.db, viewer, { id: photo.findingId });
    if (!visible) throw forbidden('this photo link is no longer valid');
    const bytes = await ctx.storage.get(variant === 'full' ? photo.fileKey : photo.thumbKey);
    res.set('Cache-Control', 'private, max-age=300').type('image/jpeg').send(bytes);
  });
  return r;
}
