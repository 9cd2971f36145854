import { Router } from 'express';
import { z } from 'zod';
import type { AppContext } from '../context';
import { notFound } from '../http-error';
import { photosService } from './photos-service';
import { startsAsPdf } from './uploads';

const photoQuery = z.object({
  u: z.uuid({ message: 'this photo link is not valid' }),
  exp: z.string().max(20),
  sig: z.string().max(100),
});

export function photosRouter(ctx: AppContext): Router {
  const r = Router();
  const photos = photosService(ctx);
  r.get('/:id/:variant', async (req, res) => {
    const { id, variant } = req.params;
    if (variant !== 'full' && variant !== 'thumb') throw notFound('photo');
    const q = photoQuery.safeParse(req.query);
    const bytes = await photos.read(id, variant, q.success ? q.data : null);
    res.set('Cache-Control', 'private, max-age=300');
    // A notice's PDF is stored as sent: it downloads, never opens inside our own origin.
    if (startsAsPdf(bytes)) res.type('application/pdf').attachment('notice.pdf').send(bytes);
    else res.type('image/jpeg').send(bytes);
  });
  return r;
}
