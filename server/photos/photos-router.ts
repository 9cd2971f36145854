import { eq } from 'drizzle-orm';
import { Router } from 'express';
import { findingPhotos } from '../../db/schema';
import type { AppContext } from '../context';
import { forbidden, notFound } from '../http-error';

export function photosRouter(ctx: AppContext): Router {
  const r = Router();
  r.get('/:id/:variant', async (req, res) => {
    const { id, variant } = req.params;
    const { exp = '', sig = '' } = req.query as Record<string, string>;
    if (variant !== 'full' && variant !== 'thumb') throw notFound('photo');
    if (!ctx.signer.verify(id, variant, String(exp), String(sig))) throw forbidden('this photo link has expired or is not valid');
    const [photo] = await ctx.db.select().from(findingPhotos).where(eq(findingPhotos.id, id));
    if (!photo) throw notFound('photo');
    const bytes = await ctx.storage.get(variant === 'full' ? photo.fileKey : photo.thumbKey);
    res.set('Cache-Control', 'private, max-age=3600').type('image/jpeg').send(bytes);
  });
  return r;
}
