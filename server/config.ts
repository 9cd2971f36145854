import path from 'node:path';
import { z } from 'zod';

const count = (fallback: number) => z.coerce.number().int().min(1).max(1_000_000).default(fallback);
const seconds = (fallback: number) => z.coerce.number().int().min(1).max(7 * 24 * 3600).default(fallback);

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
  /** pino's level; tests default to silent. */
  LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).optional(),
  /** Attempts allowed per window, counted in PostgreSQL so every server process shares them. */
  SIGN_IN_LIMIT_PER_ADDRESS: count(10),
  SIGN_IN_LIMIT_PER_IP: count(50),
  SIGN_IN_LIMIT_WINDOW_SECONDS: seconds(15 * 60),
  PASSWORD_RESET_LIMIT_PER_ADDRESS: count(5),
  PASSWORD_RESET_LIMIT_PER_IP: count(20),
  PASSWORD_RESET_LIMIT_WINDOW_SECONDS: seconds(3600),
  INVITATION_LIMIT_PER_ADDRESS: count(5),
  INVITATION_LIMIT_PER_IP: count(100),
  INVITATION_LIMIT_WINDOW_SECONDS: seconds(3600),
  /** A photo file no row points to is removed once it is this old (a crash between write and commit). */
  PHOTO_SWEEP_GRACE_SECONDS: seconds(3600),
  PHOTO_SWEEP_INTERVAL_SECONDS: seconds(3600),
}).superRefine((e, issue) => {
  // Whoever guesses the secret signs tokens for anyone: in production it must be long enough not to be guessed.
  if (e.NODE_ENV === 'production' && e.JWT_SECRET.length < 32) {
    issue.addIssue({ code: 'custom', path: ['JWT_SECRET'], message: 'JWT_SECRET must be at least 32 characters in production' });
  }
});

/** Attempts per window, per client address (IP) and per e-mail address a request names. */
export type RateLimitConfig = { perAddress: number; perIp: number; windowSeconds: number };

export type Config = {
  env: 'development' | 'test' | 'production';
  port: number; host: string; databaseUrl: string; jwtSecret: string; tokenTtlSeconds: number;
  publicUrl: string; smtp: { host: string; port: number; from: string; fake: boolean };
  uploadsDir: string; webDist: string;
  logLevel: 'fatal' | 'error' | 'warn' | 'info' | 'debug' | 'trace' | 'silent';
  rateLimits: { signIn: RateLimitConfig; passwordReset: RateLimitConfig; invitations: RateLimitConfig };
  photoSweep: { graceSeconds: number; intervalSeconds: number };
};

/** A configuration that cannot work: start-up stops, and the supervisor does not retry (exit code 78). */
export class ConfigError extends Error {}

/** Parses the environment once; a bad value stops start-up with a message naming the variable. */
export function loadConfig(env: NodeJS.ProcessEnv = process.env): Config {
  const parsed = schema.safeParse(env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`).join('\n');
    throw new ConfigError(`configuration is not valid:\n${lines}`);
  }
  const e = parsed.data;
  return {
    env: e.NODE_ENV, port: e.PORT, host: e.HOST, databaseUrl: e.DATABASE_URL, jwtSecret: e.JWT_SECRET,
    tokenTtlSeconds: e.TOKEN_TTL_SECONDS, publicUrl: e.PUBLIC_URL ?? `http://localhost:${e.PORT}`,
    smtp: { host: e.SMTP_HOST, port: e.SMTP_PORT, from: e.MAIL_FROM, fake: e.SMTP_FAKE === '1' },
    uploadsDir: e.UPLOADS_DIR, webDist: e.WEB_DIST,
    logLevel: e.LOG_LEVEL ?? (e.NODE_ENV === 'test' ? 'silent' : 'info'),
    rateLimits: {
      signIn: { perAddress: e.SIGN_IN_LIMIT_PER_ADDRESS, perIp: e.SIGN_IN_LIMIT_PER_IP, windowSeconds: e.SIGN_IN_LIMIT_WINDOW_SECONDS },
      passwordReset: { perAddress: e.PASSWORD_RESET_LIMIT_PER_ADDRESS, perIp: e.PASSWORD_RESET_LIMIT_PER_IP, windowSeconds: e.PASSWORD_RESET_LIMIT_WINDOW_SECONDS },
      invitations: { perAddress: e.INVITATION_LIMIT_PER_ADDRESS, perIp: e.INVITATION_LIMIT_PER_IP, windowSeconds: e.INVITATION_LIMIT_WINDOW_SECONDS },
    },
    photoSweep: { graceSeconds: e.PHOTO_SWEEP_GRACE_SECONDS, intervalSeconds: e.PHOTO_SWEEP_INTERVAL_SECONDS },
  };
}
