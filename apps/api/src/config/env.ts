import { resolve } from 'node:path';
import { z } from 'zod';

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
  SPLITCASE_DEMO_PASSWORD: z.string().min(10, 'SPLITCASE_DEMO_PASSWORD must be at least 10 characters').default('splitcase-demo'),
  SPLITCASE_PUBLIC_URL: z.string().optional(),
  SPLITCASE_SESSION_SECRET: z.string().optional(),
  SPLITCASE_SMTP_URL: z.string().optional(),
  SPLITCASE_MAIL_FROM: z.string().default('Splitcase <no-reply@splitcase.test>'),
  SPLITCASE_CAPTURE_SMTP_PORT: z.coerce.number().int().min(0).max(65535).default(0),
  SPLITCASE_UPLOAD_MAX_MB: z.coerce.number().positive().default(25),
  SPLITCASE_RUN_UPLOAD_MAX_MB: z.coerce.number().positive().default(200),
  SPLITCASE_LOGIN_LIMIT_IP: z.coerce.number().int().positive().default(30),
  SPLITCASE_LOGIN_LIMIT_ACCOUNT: z.coerce.number().int().positive().default(8),
  SPLITCASE_SECURE_COOKIES: z.enum(['true', 'false']).optional(),
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
  loginLimitPerIp: number;
  loginLimitPerAccount: number;
  secureCookies: boolean;
}

export function readEnv(source: NodeJS.ProcessEnv = process.env): Env {
  const parsed = schema.safeParse(source);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`).join('\n');
    throw new Error(`Invalid environment:\n${lines}`);
  }
  const e = parsed.data;
  const dataDir = resolve(e.SPLITCASE_DATA_DIR);
  return {
    nodeEnv: e.NODE_ENV,
    port: e.PORT,
    host: e.HOST,
    dataDir,
    uploadsDir: resolve(e.SPLITCASE_UPLOADS_DIR),
    backupsDir: resolve(e.SPLITCASE_BACKUPS_DIR),
    dbPath: resolve(dataDir, 'splitcase.sqlite'),
    demoPassword: e.SPLITCASE_DEMO_PASSWORD,
    publicUrl: (e.SPLITCASE_PUBLIC_URL ?? `http://localhost:${e.PORT}`).replace(/\/$/, ''),
    sessionSecret: e.SPLITCASE_SESSION_SECRET,
    smtpUrl: e.SPLITCASE_SMTP_URL,
    mailFrom: e.SPLITCASE_MAIL_FROM,
    captureSmtpPort: e.SPLITCASE_CAPTURE_SMTP_PORT,
    uploadMaxBytes: Math.round(e.SPLITCASE_UPLOAD_MAX_MB * 1024 * 1024),
    runUploadMaxBytes: Math.round(e.SPLITCASE_RUN_UPLOAD_MAX_MB * 1024 * 1024),
    loginLimitPerIp: e.SPLITCASE_LOGIN_LIMIT_IP,
    loginLimitPerAccount: e.SPLITCASE_LOGIN_LIMIT_ACCOUNT,
    secureCookies: e.SPLITCASE_SECURE_COOKIES === 'true',
  };
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
