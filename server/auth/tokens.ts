import { createHash, createSecretKey, randomBytes, type KeyObject } from 'node:crypto';
import jwt from 'jsonwebtoken';

export const JWT_ALGORITHM = 'HS256' as const;

const keys = new Map<string, KeyObject>();

/**
 * The signing secret as a key object, made once per secret. Handed a string, the token library first
 * tries to read it as a public key and fails on every request (hundreds of microseconds each); a
 * secret key object goes straight to the HMAC.
 */
export function signingKey(secret: string): KeyObject {
  let key = keys.get(secret);
  if (!key) {
    key = createSecretKey(Buffer.from(secret, 'utf8'));
    keys.set(secret, key);
  }
  return key;
}

/** A bearer token carries the person's session version: bumping it ends every sign-in they have. */
export function issueToken(
  secret: string,
  ttlSeconds: number,
  userId: string,
  sessionVersion: number,
): { token: string; expiresAt: string } {
  const token = jwt.sign({ ver: sessionVersion }, signingKey(secret), {
    algorithm: JWT_ALGORITHM,
    subject: userId,
    expiresIn: ttlSeconds,
  });
  return { token, expiresAt: new Date(Date.now() + ttlSeconds * 1000).toISOString() };
}

/** A one-time link's token (sent by mail) and its SHA-256 (all we keep). */
export function newOneTimeToken(): { token: string; hash: string } {
  const token = randomBytes(32).toString('base64url');
  return { token, hash: hashOneTimeToken(token) };
}

export const hashOneTimeToken = (token: string) => createHash('sha256').update(token).digest('hex');
