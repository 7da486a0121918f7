import { resolve } from 'node:path';
import { z } from 'zod';

/** Server log levels (pino's, and silent). */
export const LOG_LEVELS = ['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent'] as const;
export type LogLevel = (typeof LOG_LEVELS)[number];

/**
 * The only module that reads process.env. Everything else receives an Env.
 */
const schema = z.object({
  NODE_ENV: z.enum(['development', 'production', 'test']).default('development'),
  PORT: z.coerce.number().int().min(0).max(65535).default(3000),
  HOST: z.string().default('0.0.0.0'),
  SPLITCASE_DATA_DIR: z.string().default('./data'),
  SPLITCASE_UPLOADS_DIR: z.string().default('./uploads'),
  SPLITCASE_BACKUPS_DIR: z.string().default('./backups'),
  SPLITCASE_DEMO_PASSWORD: z.string().min(12, 'SPLITCASE_DEMO_PASSWORD must be at least 12 characters').default('splitcase-demo'),
  SPLITCASE_PUBLIC_URL: z.string().optional(),
  SPLITCASE_SESSION_SECRET: z.string().optional(),
  SPLITCASE_SMTP_URL: z.string().optional(),
  SPLITCASE_MAIL_FROM: z.string().default('Splitcase <no-reply@splitcase.test>'),
  SPLITCASE_CAPTURE_SMTP_PORT: z.coerce.number().int().min(0).max(65535).default(0),
  SPLITCASE_UPLOAD_MAX_MB: z.coerce.number().positive().default(25),
  SPLITCASE_RUN_UPLOAD_MAX_MB: z.coerce.number().positive().default(200),
  SPLITCASE_LOGIN_LIMIT_IP: z.coerce.number().int().positive().default(30),
  SPLITCASE_LOGIN_LIMIT_ACCOUNT: z.coerce.number().int().positive().default(8),
  SPLITCASE_LOGIN_DELAY_MAX_MS: z.coerce.number().int().min(0).max(60_000).default(8000),
  SPLITCASE_SECURE_COOKIES: z.enum(['true', 'false']).optional(),
  /** Express's `trust proxy`: unset (no proxy: X-Forwarded-* ignored), or e.g. `loopback`, `1`, `10.0.0.2`. */
  SPLITCASE_TRUST_PROXY: z.string().trim().min(1).optional(),
  /** Server log level (pino): fatal, error, warn, info, debug, trace or silent; default info (warn under NODE_ENV=test). */
  LOG_LEVEL: z.enum(LOG_LEVELS).optional(),
});

export interface Env {
  nodeEnv: 'development' | 'production' | 'test';
  port: number;
  host: string;
  dataDir: string;
  uploadsDir: string;
  /** Where `npm run backup` writes its dated folders (and the admin page looks for the latest). */
  backupsDir: string;
  dbPath: string;
  demoPassword: string;
  publicUrl: string;
  sessionSecret: string | undefined;
  smtpUrl: string | undefined;
  mailFrom: string;
  captureSmtpPort: number;
  uploadMaxBytes: number;
  /** Largest bench-run log accepted (a 1,000,000-row log with five columns is about 40 MB). */
  runUploadMaxBytes: number;
  /** Failed sign-ins from one address in 15 minutes before it gets 429. */
  loginLimitPerIp: number;
  /** Failed sign-ins on one account before each further attempt on it is delayed (never refused). */
  loginLimitPerAccount: number;
  /** Longest delay of a sign-in attempt on an account under attack. */
  loginDelayMaxMs: number;
  /** Session cookies only over HTTPS; default: true when the public URL is https. */
  secureCookies: boolean;
  /** Express's `trust proxy` setting; false when no reverse proxy is configured. */
  trustProxy: boolean | number | string;
  /** Least level of the server log (LOG_LEVEL); one info line per request. */
  logLevel: LogLevel;
}

export function readEnv(source: NodeJS.ProcessEnv = process.env): Env {
  const parsed = schema.safeParse(source);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`).join('\n');
    throw new Error(`Invalid environment:\n${lines}`);
  }
  const e = parsed.data;
  const dataDir = resolve(e.SPLITCASE_DATA_DIR);
  const publicUrl = (e.SPLITCASE_PUBLIC_URL ?? `http://localhost:${e.PORT}`).replace(/\/$/, '');
  return {
    nodeEnv: e.NODE_ENV,
    port: e.PORT,
    host: e.HOST,
    dataDir,
    uploadsDir: resolve(e.SPLITCASE_UPLOADS_DIR),
    backupsDir: resolve(e.SPLITCASE_BACKUPS_DIR),
    dbPath: resolve(dataDir, 'splitcase.sqlite'),
    demoPassword: e.SPLITCASE_DEMO_PASSWORD,
    publicUrl,
    sessionSecret: e.SPLITCASE_SESSION_SECRET,
    smtpUrl: e.SPLITCASE_SMTP_URL,
    mailFrom: e.SPLITCASE_MAIL_FROM,
    captureSmtpPort: e.SPLITCASE_CAPTURE_SMTP_PORT,
    uploadMaxBytes: Math.round(e.SPLITCASE_UPLOAD_MAX_MB * 1024 * 1024),
    runUploadMaxBytes: Math.round(e.SPLITCASE_RUN_UPLOAD_MAX_MB * 1024 * 1024),
    loginLimitPerIp: e.SPLITCASE_LOGIN_LIMIT_IP,
    loginLimitPerAccount: e.SPLITCASE_LOGIN_LIMIT_ACCOUNT,
    loginDelayMaxMs: e.SPLITCASE_LOGIN_DELAY_MAX_MS,
    secureCookies: e.SPLITCASE_SECURE_COOKIES ? e.SPLITCASE_SECURE_COOKIES === 'true' : publicUrl.startsWith('https:'),
    trustProxy: trustProxySetting(e.SPLITCASE_TRUST_PROXY),
    logLevel: e.LOG_LEVEL ?? (e.NODE_ENV === 'test' ? 'warn' : 'info'),
  };
}

/** `true`/`false`, a hop count, or addresses and names (loopback, 10.0.0.0/8…) as Express reads them. */
function trustProxySetting(value: string | undefined): boolean | number | string {
  if (value === undefined || value === 'false') return false;
  if (value === 'true') return true;
  return /^\d+$/.test(value) ? Number(value) : value;
}

/** An Env for tests and scripts: defaults plus overrides, no process.env. */
export function testEnv(overrides: Partial<Env> & { dataDir: string }): Env {
  const base = readEnv({ NODE_ENV: 'test' });
  return {
    ...base,
    uploadsDir: resolve(overrides.dataDir, 'uploads'),
    backupsDir: resolve(overrides.dataDir, 'backups'),
    dbPath: resolve(overrides.dataDir, 'splitcase.sqlite'),
    ...overrides,
  };
}
