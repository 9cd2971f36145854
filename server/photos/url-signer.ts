import { createHmac, createSecretKey, timingSafeEqual } from 'node:crypto';
import { BoundedMap } from '../bounded-map';

/**
 * Photo links carry an expiring signature so an <img> (or a mail client) can load them without a
 * bearer header. The link names the person it was made for, and the photo route checks, on every
 * load, that this person may still see the finding: someone taken off the build loses it at once.
 */
export type UrlSigner = {
  sign: (photoId: string, variant: 'full' | 'thumb', viewerId: string, ttlSeconds?: number) => string;
  verify: (photoId: string, variant: string, viewerId: string, exp: string, sig: string) => boolean;
};

/** Links' signatures kept in memory (some 200 bytes each). */
const SIGNATURES_KEPT = 20_000;

export function createUrlSigner(secret: string): UrlSigner {
  // A key object made once: a list signs a link per row, and a string key is converted again on each.
  const key = createSecretKey(Buffer.from(secret, 'utf8'));
  const hmac = (message: string) => createHmac('sha256', key).update(message).digest('base64url');
  // Expiries are whole hours, so a list read again within the hour signs the very same links: kept
  // rather than worked out again (a page of the review queue signs one per row).
  const signed = new BoundedMap<string, string>(SIGNATURES_KEPT);
  const message = (photoId: string, variant: string, viewerId: string, exp: string) =>
    `${photoId}:${variant}:${viewerId}:${exp}`;
  return {
    sign(photoId, variant, viewerId, ttlSeconds = 6 * 3600) {
      // Round expiry to the hour so repeated reads give the same URL and the browser cache works.
      const exp = String(Math.ceil((Date.now() / 1000 + ttlSeconds) / 3600) * 3600);
      const m = message(photoId, variant, viewerId, exp);
      let sig = signed.get(m);
      if (sig === undefined) signed.set(m, (sig = hmac(m)));
      return `/api/photos/${photoId}/${variant}?u=${viewerId}&exp=${exp}&sig=${sig}`;
    },
    verify(photoId, variant, viewerId, exp, sig) {
      if (!/^\d+$/.test(exp) || Number(exp) < Date.now() / 1000) return false;
      // Looked up but never kept: these words come from whoever asks.
      const m = message(photoId, variant, viewerId, exp);
      const a = Buffer.from(signed.get(m) ?? hmac(m));
      const b = Buffer.from(sig);
      return a.length === b.length && timingSafeEqual(a, b);
    },
  };
}
