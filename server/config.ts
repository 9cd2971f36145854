import { existsSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { certificateNames, pickLanAddress } from './network/lan';
import type { S3PhotoStorageOptions } from './storage/s3-photo-storage';
import { z } from 'zod';

/**
 * The folder with package.json: the default home of uploads/, dist/ and .cache/ whether this file runs
 * from its source (server/) or compiled (build/server/).
 */
function projectRoot(from = __dirname): string {
  for (let dir = from, i = 0; i < 8; i++, dir = path.dirname(dir)) {
    if (existsSync(path.join(dir, 'package.json'))) return dir;
  }
  return path.join(from, '..');
}
const root = projectRoot();

const count = (fallback: number) => z.coerce.number().int().min(1).max(1_000_000).default(fallback);
const seconds = (fallback: number) =>
  z.coerce
    .number()
    .int()
    .min(1)
    .max(7 * 24 * 3600)
    .default(fallback);

const schema = z
  .object({
    NODE_ENV: z.enum(['development', 'test', 'production']).default('development'),
    PORT: z.coerce.number().int().min(1).max(65535).default(8080),
    /** Defaults to loopback only, or every interface in network mode. */
    HOST: z.string().optional(),
    DATABASE_URL: z.string().regex(/^postgres(ql)?:\/\//, 'DATABASE_URL must be a postgres:// URL'),
    JWT_SECRET: z.string().min(16, 'JWT_SECRET must be at least 16 characters'),
    TOKEN_TTL_SECONDS: z.coerce
      .number()
      .int()
      .positive()
      .default(12 * 3600),
    PUBLIC_URL: z.string().url('PUBLIC_URL must be a URL such as http://localhost:8080').optional(),
    SMTP_HOST: z.string().default('127.0.0.1'),
    SMTP_PORT: z.coerce.number().int().default(2525),
    MAIL_FROM: z.string().default('Pitchcard <noreply@pitchcard.local>'),
    /** Start the local SMTP fake inside this process and expose /api/dev/mail (development only). */
    SMTP_FAKE: z.enum(['0', '1']).default('0'),
    UPLOADS_DIR: z.string().default(path.join(root, 'uploads')),
    WEB_DIST: z.string().default(path.join(root, 'dist')),
    /** Where photo bytes live: this machine's UPLOADS_DIR, or an S3-compatible bucket that every server process shares. */
    PHOTO_STORE: z.enum(['local', 's3']).default('local'),
    S3_BUCKET: z
      .string()
      .regex(/^[a-z0-9][a-z0-9.-]{1,61}[a-z0-9]$/, 'S3_BUCKET must be a bucket name (3–63 of a-z, 0-9, dot, hyphen)')
      .optional(),
    S3_REGION: z.string().min(1).default('us-east-1'),
    /** An S3-compatible service's address; unset for AWS itself. */
    S3_ENDPOINT: z.string().url('S3_ENDPOINT must be a URL such as http://127.0.0.1:9000').optional(),
    /** Bucket in the path (most S3-compatible services want it); defaults to on when S3_ENDPOINT is set. */
    S3_FORCE_PATH_STYLE: z.enum(['0', '1']).optional(),
    /** Keys go under this prefix, so one bucket can hold more than photos. */
    S3_PREFIX: z
      .string()
      .regex(/^([A-Za-z0-9_.-]+\/)*$/, 'S3_PREFIX must be empty or end with / (e.g. photos/)')
      .default(''),
    /** Both or neither; without them the AWS SDK's own chain is used (AWS_ACCESS_KEY_ID, a role, a profile). */
    S3_ACCESS_KEY_ID: z.string().optional(),
    S3_SECRET_ACCESS_KEY: z.string().optional(),
    /** 1: this server process also runs the job queue's consumers and the photo sweep; 0 when `npm run worker` does. */
    RUN_JOBS: z.enum(['0', '1']).default('1'),
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
    /** Network mode: listen on every interface, serve HTTPS, and put the LAN address in labels and mails. */
    LAN: z.enum(['0', '1']).default('0'),
    /** The address phones reach this machine by, when the one picked from its interfaces is not the right one. */
    LAN_ADDRESS: z.ipv4({ message: 'LAN_ADDRESS must be an IPv4 address such as 192.168.1.20' }).optional(),
    /** A certificate the shop supplies (PEM files); without them network mode makes one and keeps it in TLS_DIR. */
    TLS_CERT: z.string().optional(),
    TLS_KEY: z.string().optional(),
    TLS_DIR: z.string().default(path.join(root, '.cache', 'tls')),
  })
  .superRefine((e, issue) => {
    if (e.PHOTO_STORE === 's3' && !e.S3_BUCKET)
      issue.addIssue({ code: 'custom', path: ['S3_BUCKET'], message: 'PHOTO_STORE=s3 needs S3_BUCKET' });
    if (!!e.S3_ACCESS_KEY_ID !== !!e.S3_SECRET_ACCESS_KEY) {
      issue.addIssue({
        code: 'custom',
        path: [e.S3_ACCESS_KEY_ID ? 'S3_SECRET_ACCESS_KEY' : 'S3_ACCESS_KEY_ID'],
        message: 'give both S3_ACCESS_KEY_ID and S3_SECRET_ACCESS_KEY, or neither',
      });
    }
    // The fake keeps mail in memory and shows it at /api/dev/mail: real mail must reach a real relay.
    if (e.NODE_ENV === 'production' && e.SMTP_FAKE === '1') {
      issue.addIssue({
        code: 'custom',
        path: ['SMTP_FAKE'],
        message:
          'the SMTP fake is for development and tests: in production set SMTP_HOST and SMTP_PORT to a mail relay',
      });
    }
    if (!!e.TLS_CERT !== !!e.TLS_KEY)
      issue.addIssue({
        code: 'custom',
        path: [e.TLS_CERT ? 'TLS_KEY' : 'TLS_CERT'],
        message: 'give both TLS_CERT and TLS_KEY, or neither',
      });
    // Whoever guesses the secret signs tokens for anyone: in production it must be long enough not to be guessed.
    if (e.NODE_ENV === 'production' && e.JWT_SECRET.length < 32) {
      issue.addIssue({
        code: 'custom',
        path: ['JWT_SECRET'],
        message: 'JWT_SECRET must be at least 32 characters in production',
      });
    }
  });

/** Attempts per window, per client address (IP) and per e-mail address a request names. */
export type RateLimitConfig = { perAddress: number; perIp: number; windowSeconds: number };

export type Config = {
  env: 'development' | 'test' | 'production';
  port: number;
  host: string;
  databaseUrl: string;
  jwtSecret: string;
  tokenTtlSeconds: number;
  publicUrl: string;
  smtp: { host: string; port: number; from: string; fake: boolean };
  uploadsDir: string;
  webDist: string;
  photoStore: { kind: 'local' } | ({ kind: 's3' } & S3PhotoStorageOptions);
  /** Whether this server process runs the queue's consumers and the photo sweep (else a worker process does). */
  runJobs: boolean;
  logLevel: 'fatal' | 'error' | 'warn' | 'info' | 'debug' | 'trace' | 'silent';
  rateLimits: { signIn: RateLimitConfig; passwordReset: RateLimitConfig; invitations: RateLimitConfig };
  photoSweep: { graceSeconds: number; intervalSeconds: number };
  /** Network mode and HTTPS: null `tls` serves plain HTTP (the loopback default). */
  network: {
    lan: boolean;
    lanAddress: string | null;
    tls: { certFile?: string; keyFile?: string; dir: string; names: { dns: string[]; ips: string[] } } | null;
  };
};

/** A configuration that cannot work: start-up stops, and the supervisor does not retry (exit code 78). */
export class ConfigError extends Error {}

/** Parses the environment once; a bad value stops start-up with a message naming the variable. */
export function loadConfig(
  env: NodeJS.ProcessEnv = process.env,
  machine: { interfaces: NodeJS.Dict<os.NetworkInterfaceInfo[]>; hostname: string } = {
    interfaces: os.networkInterfaces(),
    hostname: os.hostname(),
  },
): Config {
  const parsed = schema.safeParse(env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`).join('\n');
    throw new ConfigError(`configuration is not valid:\n${lines}`);
  }
  const e = parsed.data;
  const lan = e.LAN === '1';
  const lanAddress = lan ? (e.LAN_ADDRESS ?? pickLanAddress(machine.interfaces)) : null;
  if (lan && !lanAddress && !e.PUBLIC_URL) {
    throw new ConfigError(
      'network mode found no network address on this machine: connect it to the shop network, or set LAN_ADDRESS or PUBLIC_URL',
    );
  }
  const https = lan || !!e.TLS_CERT;
  const scheme = https ? 'https' : 'http';
  return {
    env: e.NODE_ENV,
    port: e.PORT,
    host: e.HOST ?? (lan ? '0.0.0.0' : '127.0.0.1'),
    databaseUrl: e.DATABASE_URL,
    jwtSecret: e.JWT_SECRET,
    tokenTtlSeconds: e.TOKEN_TTL_SECONDS,
    publicUrl: e.PUBLIC_URL ?? `${scheme}://${lanAddress ?? 'localhost'}:${e.PORT}`,
    smtp: { host: e.SMTP_HOST, port: e.SMTP_PORT, from: e.MAIL_FROM, fake: e.SMTP_FAKE === '1' },
    uploadsDir: e.UPLOADS_DIR,
    webDist: e.WEB_DIST,
    photoStore:
      e.PHOTO_STORE === 's3'
        ? {
            kind: 's3',
            bucket: e.S3_BUCKET!,
            region: e.S3_REGION,
            endpoint: e.S3_ENDPOINT ?? null,
            forcePathStyle: e.S3_FORCE_PATH_STYLE ? e.S3_FORCE_PATH_STYLE === '1' : !!e.S3_ENDPOINT,
            prefix: e.S3_PREFIX,
            credentials: e.S3_ACCESS_KEY_ID
              ? { accessKeyId: e.S3_ACCESS_KEY_ID, secretAccessKey: e.S3_SECRET_ACCESS_KEY! }
              : null,
          }
        : { kind: 'local' },
    runJobs: e.RUN_JOBS === '1',
    logLevel: e.LOG_LEVEL ?? (e.NODE_ENV === 'test' ? 'silent' : 'info'),
    rateLimits: {
      signIn: {
        perAddress: e.SIGN_IN_LIMIT_PER_ADDRESS,
        perIp: e.SIGN_IN_LIMIT_PER_IP,
        windowSeconds: e.SIGN_IN_LIMIT_WINDOW_SECONDS,
      },
      passwordReset: {
        perAddress: e.PASSWORD_RESET_LIMIT_PER_ADDRESS,
        perIp: e.PASSWORD_RESET_LIMIT_PER_IP,
        windowSeconds: e.PASSWORD_RESET_LIMIT_WINDOW_SECONDS,
      },
      invitations: {
        perAddress: e.INVITATION_LIMIT_PER_ADDRESS,
        perIp: e.INVITATION_LIMIT_PER_IP,
        windowSeconds: e.INVITATION_LIMIT_WINDOW_SECONDS,
      },
    },
    photoSweep: { graceSeconds: e.PHOTO_SWEEP_GRACE_SECONDS, intervalSeconds: e.PHOTO_SWEEP_INTERVAL_SECONDS },
    network: {
      lan,
      lanAddress,
      tls: https
        ? {
            certFile: e.TLS_CERT,
            keyFile: e.TLS_KEY,
            dir: e.TLS_DIR,
            names: certificateNames(lanAddress, machine.hostname, e.PUBLIC_URL),
          }
        : null,
    },
  };
}
