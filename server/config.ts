// Configuration comes from environment variables only, each with a safe default for a lab
// workstation. Production must set SESSION_SECRET and PUBLIC_URL (the README lists them all).
import { z } from 'zod';
import { isTimeZone } from './mail/lab-time';

const bool = z.enum(['true', 'false', '1', '0']).transform((value) => value === 'true' || value === '1');

const envSchema = z.object({
  NODE_ENV: z.enum(['development', 'test', 'production']).default('development'),
  HOST: z.string().min(1).default('127.0.0.1'),
  PORT: z.coerce.number().int().min(0).max(65535).default(8080),
  PUBLIC_URL: z.string().url().optional(),
  // The clock e-mails are written in (an IANA name such as Europe/London); unset: the server's.
  LAB_TIME_ZONE: z.string().refine(isTimeZone, 'an IANA time zone name such as Europe/London').optional(),
  DB_HOST: z.string().min(1).default('127.0.0.1'),
  DB_PORT: z.coerce.number().int().min(1).max(65535).default(3307),
  DB_SOCKET: z.string().min(1).max(107, 'Unix socket paths are at most 107 bytes').optional(),
  DB_NAME: z
    .string()
    .regex(/^[A-Za-z0-9_]+$/, 'letters, digits and _ only')
    .default('voltcrib_dev'),
  DB_USER: z.string().min(1).default('voltcrib'),
  DB_PASSWORD: z.string().default('voltcrib-local-only'),
  DB_POOL_MAX: z.coerce.number().int().min(1).max(200).default(20),
  SESSION_SECRET: z.string().min(16, 'at least 16 characters').optional(),
  // How long a process may serve a session from its own copy; 0 with more than one process.
  SESSION_CACHE_MS: z.coerce.number().int().min(0).max(60_000).default(5000),
  SESSION_MAX_AGE_HOURS: z.coerce
    .number()
    .positive()
    .max(24 * 30)
    .default(12),
  COOKIE_SECURE: bool.optional(),
  TRUST_PROXY: bool.default(false),
  LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
  LOGIN_RATE_LIMIT: z.coerce.number().int().min(1).default(10),
  LOGIN_RATE_LIMIT_PER_ADDRESS: z.coerce.number().int().min(1).default(100),
  WEB_DIR: z.string().default('dist'),
  S3_ENDPOINT: z.string().url().optional(),
  S3_REGION: z.string().min(1).default('us-east-1'),
  S3_BUCKET: z
    .string()
    .regex(/^[a-z0-9.-]{3,63}$/)
    .default('voltcrib-files'),
  S3_ACCESS_KEY_ID: z.string().min(1).default('S3RVER'),
  S3_SECRET_ACCESS_KEY: z.string().min(1).default('S3RVER'),
  UPLOAD_MAX_MB: z.coerce.number().positive().max(100).default(10),
  BOOKING_PHOTOS_MAX: z.coerce.number().int().min(1).default(24),
  BOOKING_PHOTOS_MAX_MB: z.coerce.number().positive().default(60),
  PERSON_UPLOADS_PER_DAY: z.coerce.number().int().min(1).default(100),
  PERSON_UPLOAD_MB_PER_DAY: z.coerce.number().positive().default(250),
  SMTP_URL: z
    .string()
    .regex(/^smtps?:\/\//, 'smtp:// or smtps:// URL')
    .optional(),
  SMTP_FAKE_PORT: z.coerce.number().int().min(0).max(65535).default(0),
  MAIL_FROM: z.string().min(3).default('Voltcrib <voltcrib@localhost>'),
  MAIL_CRON: z.string().min(9).default('0 * * * * *'),
  MAIL_POLL_MS: z.coerce.number().int().min(100).max(600_000).default(2000),
  MAIL_LEASE_MS: z.coerce.number().int().min(1000).max(3_600_000).default(60_000),
  SCHEDULER: bool.default(true),
});

export interface Config {
  env: 'development' | 'test' | 'production';
  host: string;
  port: number;
  publicUrl: string;
  /** socketPath, when set, is used instead of host and port (a database on the same machine). */
  db: { host: string; port: number; socketPath: string | null; database: string; user: string; password: string; poolMax: number };
  session: { secret: string; maxAgeMs: number; secureCookies: boolean; cacheMs: number };
  trustProxy: boolean;
  logLevel: string;
  /** Failed attempts per 15 minutes: per account and address, and per address. */
  loginRateLimit: number;
  loginRateLimitPerAddress: number;
  webDir: string;
  /** null: development starts a local S3 fake in-process. */
  s3: { endpoint: string | null; region: string; bucket: string; accessKeyId: string; secretAccessKey: string };
  uploadMaxBytes: number;
  /** Caps on booking photos: per booking in all, and per person over the last 24 hours. */
  uploadCaps: { bookingFiles: number; bookingBytes: number; personFilesPerDay: number; personBytesPerDay: number };
  mail: { smtpUrl: string | null; fakePort: number; from: string; cron: string; pollMs: number; leaseMs: number; scheduler: boolean };
}

export class ConfigError extends Error {}

const DEV_SECRET = 'voltcrib-development-secret-not-for-production';

export function loadConfig(env: Record<string, string | undefined> = process.env): Config {
  const parsed = envSchema.safeParse(env);
  if (!parsed.success) {
    const problems = parsed.error.issues.map((issue) => `${issue.path.join('.')}: ${issue.message}`);
    throw new ConfigError(`Invalid configuration:\n  ${problems.join('\n  ')}`);
  }
  const e = parsed.data;
  if (e.NODE_ENV === 'production' && !e.SESSION_SECRET) {
    throw new ConfigError('Invalid configuration:\n  SESSION_SECRET: required in production');
  }
  const publicUrl = (e.PUBLIC_URL ?? `http://${e.HOST === '0.0.0.0' ? '127.0.0.1' : e.HOST}:${e.PORT}`).replace(/\/$/, '');
  return {
    env: e.NODE_ENV,
    host: e.HOST,
    port: e.PORT,
    publicUrl,
    db: {
      host: e.DB_HOST,
      port: e.DB_PORT,
      socketPath: e.DB_SOCKET ?? null,
      database: e.DB_NAME,
      user: e.DB_USER,
      password: e.DB_PASSWORD,
      poolMax: e.DB_POOL_MAX,
    },
    session: {
      secret: e.SESSION_SECRET ?? DEV_SECRET,
      maxAgeMs: e.SESSION_MAX_AGE_HOURS * 3600_000,
      cacheMs: e.SESSION_CACHE_MS,
      // Secure cookies whenever the public URL is HTTPS unless explicitly overridden.
      secureCookies: e.COOKIE_SECURE ?? publicUrl.startsWith('https://'),
    },
    trustProxy: e.TRUST_PROXY,
    logLevel: e.LOG_LEVEL,
    loginRateLimit: e.LOGIN_RATE_LIMIT,
    loginRateLimitPerAddress: e.LOGIN_RATE_LIMIT_PER_ADDRESS,
    webDir: e.WEB_DIR,
    s3: {
      endpoint: e.S3_ENDPOINT ?? null,
      region: e.S3_REGION,
      bucket: e.S3_BUCKET,
      accessKeyId: e.S3_ACCESS_KEY_ID,
      secretAccessKey: e.S3_SECRET_ACCESS_KEY,
    },
    uploadMaxBytes: Math.round(e.UPLOAD_MAX_MB * 1024 * 1024),
    uploadCaps: {
      bookingFiles: e.BOOKING_PHOTOS_MAX,
      bookingBytes: Math.round(e.BOOKING_PHOTOS_MAX_MB * 1024 * 1024),
      personFilesPerDay: e.PERSON_UPLOADS_PER_DAY,
      personBytesPerDay: Math.round(e.PERSON_UPLOAD_MB_PER_DAY * 1024 * 1024),
    },
    mail: {
      smtpUrl: e.SMTP_URL ?? null,
      fakePort: e.SMTP_FAKE_PORT,
      from: e.MAIL_FROM,
      cron: e.MAIL_CRON,
      pollMs: e.MAIL_POLL_MS,
      leaseMs: e.MAIL_LEASE_MS,
      scheduler: e.SCHEDULER,
    },
  };
}
