import { Router, type RequestHandler } from 'express';
import QRCode from 'qrcode';
import type { PhoneSetup } from '../../db/contracts';
import type { AppContext } from '../context';
import { forbidden, notFound } from '../http-error';
import { isLoopbackUrl } from './lan';

/** The phone setup page's facts, and the certificate itself for a phone to install and trust. */
export function networkRouter(ctx: AppContext, signedIn: RequestHandler): Router {
  const r = Router();
  r.get('/', signedIn, async (req, res) => {
    const role = req.user!.role;
    if (role !== 'admin' && role !== 'supplier') throw forbidden('only an admin or a supplier sets up phones');
    const url = ctx.config.publicUrl;
    const tls = ctx.tls;
    const body: PhoneSetup = {
      publicUrl: url,
      loopback: isLoopbackUrl(url),
      https: url.startsWith('https:'),
      qrDataUrl: await QRCode.toDataURL(url, { errorCorrectionLevel: 'M', margin: 2, scale: 8 }),
      certificate: tls
        ? {
            fingerprint: tls.fingerprint,
            downloadUrl: '/api/network/certificate',
            madeHere: !ctx.config.network.tls?.certFile,
            names: [...tls.names.dns, ...tls.names.ips],
          }
        : null,
    };
    res.json(body);
  });
  // Public: a certificate is no secret, and a phone fetches it before anyone signs in on it.
  r.get('/certificate', (_req, res) => {
    if (!ctx.tls) throw notFound('certificate: Pitchcard serves plain HTTP here');
    res
      .type('application/x-pem-file')
      .set('Content-Disposition', 'attachment; filename="pitchcard.crt"')
      .send(ctx.tls.cert);
  });
  return r;
}
