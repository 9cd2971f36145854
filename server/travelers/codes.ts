import { randomBytes, randomInt } from 'node:crypto';

// No 0/O, 1/I/L, 5/S, 2/Z: a short code read off a label in bad light must not be mistaken.
const ALPHABET = '346789ABCDEFGHJKMNPQRTUVWXY';

/** 6 characters shown as XXX-XXX: about 387 million codes, typed at the bench when the camera fails. */
export function newShortCode(): string {
  let s = '';
  for (let i = 0; i < 6; i++) s += ALPHABET[randomInt(ALPHABET.length)];
  return `${s.slice(0, 3)}-${s.slice(3)}`;
}

/** Normalises what a person typed: case, spaces, a missing dash. */
export function normaliseShortCode(input: string): string | null {
  const s = input.toUpperCase().replace(/[\s-]/g, '');
  if (!/^[A-Z0-9]{6}$/.test(s)) return null;
  return `${s.slice(0, 3)}-${s.slice(3)}`;
}

/** 144 random bits: the QR label's token cannot be guessed from a serial or a short code. */
export const newQrToken = () => randomBytes(18).toString('base64url');

/** Accepts a short code, a bare token, or the whole URL a QR label carries. */
export function parseTravelerCode(input: string): { shortCode: string } | { qrToken: string } | null {
  const trimmed = input.trim();
  const fromUrl = trimmed.match(/\/t\/([A-Za-z0-9_-]{16,})\/?(?:[?#].*)?$/);
  if (fromUrl) return { qrToken: fromUrl[1] };
  if (/^[A-Za-z0-9_-]{24}$/.test(trimmed)) return { qrToken: trimmed };
  const shortCode = normaliseShortCode(trimmed);
  return shortCode ? { shortCode } : null;
}
