import { createHmac, createSecretKey, timingSafeEqual } from 'node:crypto';

/**
 * Photo links carry an expiring signature so an <img> (or a mail client) can load them without a
 * bearer header. The link names the person it was made for, and the photo route checks, on every
 * load, that this person may still see the finding: someone taken off the build loses it at once.
 */
export type UrlSigner = {
  sign: (photoId: string, variant: 'full' | 'thumb', viewerId: string, ttlSeconds?: number) => string;
  verify: (photoId: string, variant: string, viewerId: string, exp: string, sig: string) => boolean;
};

export function createUrlSigner(secret: string): UrlSigner {
  // A key object made once: a list signs a link per row, and a string key is converted again on each.
  const key = createSecretKey(Buffer.from(secret, 'utf8'));
  const mac = (photoId: string, variant: string, viewerId: string, exp: string) =>
    createHmac('sha256', key).update(`${photoId}:${variant}:${viewerId}:${exp}`).digest('base64url');
  return {
    sign(photoId, variant, viewerId, ttlSeconds = 6 * 3600) {
      // Round expiry to the hour so repeated reads give the same URL and the browser cache works.
      const exp = String(Math.ceil((Date.now() / 1000 + ttlSeconds) / 3600) * 3600);
      return `/api/photos/${photoId}/${variant}?u=${viewerId}&exp=${exp}&sig=${mac(photoId, variant, viewerId, exp)}`;
    },
    verify(photoId, variant, viewerId, exp, sig) {
      if (!/^\d+$/.test(exp) || Number(exp) < Date.now() / 1000) return false;
      const a = Buffer.from(mac(photoId, variant, viewerId, exp));
      const b = Buffer.from(sig);
      return a.length === b.length && timingSafeEqual(a, b);
    },
  };
}
