import jwt from 'jsonwebtoken';

export const JWT_ALGORITHM = 'HS256' as const;

export function issueToken(secret: string, ttlSeconds: number, userId: string): { token: string; expiresAt: string } {
  const token = jwt.sign({}, secret, { algorithm: JWT_ALGORITHM, subject: userId, expiresIn: ttlSeconds });
  return { token, expiresAt: new Date(Date.now() + ttlSeconds * 1000).toISOString() };
}
