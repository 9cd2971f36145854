import path from 'node:path';
import { z } from 'zod';

const schema = z.object({
  NODE_ENV: z.enum(['development', 'test', 'production']).default('development'),
  PORT: z.coerce.number().int().min(1).max(65535).default(8080),
  HOST: z.string().default('127.0.0.1'),
  DATABASE_URL: z.string().regex(/^postgres(ql)?:\/\//, 'DATABASE_URL must be a postgres:// URL'),
  JWT_SECRET: z.string().min(16, 'JWT_SECRET must be at least 16 characters'),
  TOKEN_TTL_SECONDS: z.coerce.number().int().positive().default(12 * 3600),
  PUBLIC_URL: z.string().url('PUBLIC_URL must be a URL such as http://localhost:8080').optional(),
  SMTP_HOST: z.string().default('127.0.0.1'),
  SMTP_PORT: z.coerce.number().int().default(2525),
  MAIL_FROM: z.string().default('Pitchcard <noreply@pitchcard.local>'),
  /** Start the local SMTP fake inside this process and expose /api/dev/mail (development only). */
  SMTP_FAKE: z.enum(['0', '1']).default('0'),
  UPLOADS_DIR: z.string().default(path.join(__dirname, '..', 'uploads')),
  WEB_DIST: z.string().default(path.join(__dirname, '..', 'dist')),
});

export type Config = {
  env: 'development' | 'test' | 'production';
  port: number; host: string; databaseUrl: string; jwtSecret: string; tokenTtlSeconds: number;
  publicUrl: string; smtp: { host: string; port: number; from: string; fake: boolean };
  uploadsDir: string; webDist: string;
};

/** Parses the environment once; a bad value stops start-up with a message naming the variable. */
export function loadConfig(env: NodeJS.ProcessEnv = process.env): Config {
  const parsed = schema.safeParse(env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`).join('\n');
    throw new Error(`configuration is not valid:\n${lines}`);
  }
  const e = parsed.data;
  return {
    env: e.NODE_ENV, port: e.PORT, host: e.HOST, databaseUrl: e.DATABASE_URL, jwtSecret: e.JWT_SECRET,
    tokenTtlSeconds: e.TOKEN_TTL_SECONDS, publicUrl: e.PUBLIC_URL ?? `http://localhost:${e.PORT}`,
    smtp: { host: e.SMTP_HOST, port: e.SMTP_PORT, from: e.MAIL_FROM, fake: e.SMTP_FAKE === '1' },
    uploadsDir: e.UPLOADS_DIR, webDist: e.WEB_DIST,
  };
}
