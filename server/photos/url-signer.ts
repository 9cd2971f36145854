import { createHmac, timingSafeEqual } from 'node:crypto';

/**
 * Photo links carry an expiring signature so an <img> (or a mail client) can load them without a
 * bearer header; the access check happens when the finding that lists them is read.
 */
export type UrlSigner = {
  sign: (photoId: string, variant: 'full' | 'thumb', ttlSeconds?: number) => string;
  verify: (photoId: string, variant: string, exp: string, sig: string) => boolean;
};

export function createUrlSigner(secret: string): UrlSigner {
  const mac = (photoId: string, variant: string, exp: string) =>
    createHmac('sha256', secret).update(`${photoId}:${variant}:${exp}`).digest('base64url');
  return {
    sign(photoId, variant, ttlSeconds = 6 * 3600) {
      // Round expiry to the hour so repeated reads give the same URL and the browser cache works.
      const exp = String(Math.ceil((Date.now() / 1000 + ttlSeconds) / 3600) * 3600);
      return `/api/photos/${photoId}/${variant}?exp=${exp}&sig=${mac(photoId, variant, exp)}`;
    },
    verify(photoId, variant, exp, sig) {
      if (!/^\d+$/.test(exp) || Number(exp) < Date.now() / 1000) return false;
      const a = Buffer.from(mac(photoId, variant, exp));
      const b = Buffer.from(sig);
      return a.length === b.length && timingSafeEqual(a, b);
    },
  };
}
