import path from 'node:path';
import { z } from 'zod';
import { isKnownTimeZone } from '../../shared/site-time';

const ZFlag = z
  .enum(['0', '1', 'true', 'false', 'yes', 'no'])
  .transform((value) => value === '1' || value === 'true' || value === 'yes');

const ZEnvironment = z.object({
  PORT: z.coerce.number().int().min(0).max(65535).default(8080),
  HOST: z.string().default('0.0.0.0'),
  DATA_DIR: z.string().min(1).default('./data'),
  DATABASE_URL: z
    .string()
    .regex(/^postgres(ql)?:\/\//, 'DATABASE_URL must start with postgres:// or postgresql://')
    .optional(),
  DEMO_SEED: ZFlag.default(true),
  SMTP_URL: z.string().url('SMTP_URL must be a URL such as smtp://mail.example:587').optional(),
  SMTP_FAKE_PORT: z.coerce.number().int().min(0).max(65535).default(2525),
  MAX_UPLOAD_BYTES: z.coerce
    .number()
    .int()
    .positive()
    .default(1024 ** 3),
  MAX_UNPACKED_BYTES: z.coerce
    .number()
    .int()
    .positive()
    .default(4 * 1024 ** 3),
  SESSION_TTL_SECONDS: z.coerce
    .number()
    .int()
    .min(60)
    .default(15 * 60),
  SESSION_MAX_AGE_SECONDS: z.coerce
    .number()
    .int()
    .min(300)
    .default(12 * 3600),
  MAX_RUNNING_REPLAYS_PER_USER: z.coerce.number().int().min(1).default(3),
  LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
  PUBLIC_URL: z.string().url().optional(),
  SITE_TIME_ZONE: z
    .string()
    .default('UTC')
    .refine(isKnownTimeZone, 'SITE_TIME_ZONE must be an IANA time zone such as Europe/Berlin or UTC'),
  NODE_ENV: z.string().default('production'),
});

export interface AppConfig {
  port: number;
  host: string;
  /** Absolute path; everything the server keeps on disk lives below it. */
  dataDir: string;
  databaseUrl?: string;
  demoSeed: boolean;
  smtpUrl?: string;
  smtpFakePort: number;
  maxUploadBytes: number;
  maxUnpackedBytes: number;
  sessionTtlSeconds: number;
  sessionMaxAgeSeconds: number;
  /** Replays one user may have queued or running at once; more are refused with 429. */
  maxRunningReplaysPerUser: number;
  logLevel: string;
  publicUrl: string;
  /** IANA zone every time is shown in (screens, mails, report.html); RFC 3339 stays in the data. */
  siteTimeZone: string;
  /** Cookies get `Secure` only behind HTTPS, so local http use keeps working. */
  secureCookies: boolean;
}

/** Reads and checks the environment once at start-up; throws a readable message naming each bad variable. */
export function loadConfig(env: NodeJS.ProcessEnv = process.env): AppConfig {
  const parsed = ZEnvironment.safeParse(env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((issue) => `  ${issue.path.join('.')}: ${issue.message}`);
    throw new Error(`Invalid configuration:\n${lines.join('\n')}`);
  }
  const e = parsed.data;
  const publicUrl = e.PUBLIC_URL ?? `http://localhost:${e.PORT}`;
  return {
    port: e.PORT,
    host: e.HOST,
    dataDir: path.resolve(e.DATA_DIR),
    databaseUrl: e.DATABASE_URL,
    demoSeed: e.DEMO_SEED,
    smtpUrl: e.SMTP_URL,
    smtpFakePort: e.SMTP_FAKE_PORT,
    maxUploadBytes: e.MAX_UPLOAD_BYTES,
    maxUnpackedBytes: e.MAX_UNPACKED_BYTES,
    sessionTtlSeconds: e.SESSION_TTL_SECONDS,
    sessionMaxAgeSeconds: e.SESSION_MAX_AGE_SECONDS,
    maxRunningReplaysPerUser: e.MAX_RUNNING_REPLAYS_PER_USER,
    logLevel: e.LOG_LEVEL,
    publicUrl,
    siteTimeZone: e.SITE_TIME_ZONE,
    secureCookies: publicUrl.startsWith('https://'),
  };
}

/** The repository root, resolved from this file so source (tsx) and bundled runs agree. */
export const PROJECT_ROOT = path.resolve(import.meta.dirname, '..', '..');
