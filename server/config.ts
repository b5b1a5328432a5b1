import path from 'node:path';
import { z } from 'zod';
import type { S3Settings } from './storage/s3';

const root = path.resolve(import.meta.dirname, '..');

const boolish = z
  .enum(['true', 'false', '1', '0', 'yes', 'no'])
  .transform((v) => v === 'true' || v === '1' || v === 'yes');

const EnvSchema = z
  .object({
    NODE_ENV: z.enum(['development', 'production', 'test']).default('development'),
    HOST: z.string().default('127.0.0.1'),
    PORT: z.coerce.number().int().min(0).max(65535).default(3000),
    DATABASE_URL: z.url({ message: 'must be a postgres:// URL' }).startsWith('postgres'),
    PUBLIC_URL: z.url().optional(),
    SESSION_SECRET: z.string().min(32, 'must be at least 32 characters').optional(),
    SMTP_URL: z.string().startsWith('smtp', 'must be an smtp:// or smtps:// URL').default('smtp://127.0.0.1:2525'),
    MAIL_FROM: z.string().default('Tillwell <no-reply@tillwell.example.org>'),
    BCRYPT_COST: z.coerce.number().int().min(10).max(15).default(12),
    AUTH_RATE_LIMIT: z.coerce.number().int().min(1).default(10),
    SIGNIN_MAX_FAILURES_PER_ACCOUNT: z.coerce.number().int().min(1).default(10),
    SIGNIN_MAX_FAILURES_PER_ADDRESS: z.coerce.number().int().min(1).default(100),
    SIGNIN_LOCK_MINUTES: z.coerce.number().int().min(1).max(24 * 60).default(15),
    APPLY_RATE_LIMIT: z.coerce.number().int().min(1).default(5),
    TRUST_PROXY: boolish.default(false),
    LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
    STATIC_DIR: z.string().default(path.join(root, 'dist')),
    UPLOAD_DIR: z.string().default(path.join(root, '.data', 'uploads')),
    STORAGE: z.enum(['local', 's3']).default('local'),
    S3_ENDPOINT: z.url({ message: 'must be an http:// or https:// URL' }).startsWith('http', 'must be an http:// or https:// URL').optional(),
    S3_BUCKET: z.string().regex(/^[a-z0-9][a-z0-9.-]{1,61}[a-z0-9]$/, 'must be a bucket name (3–63 lower-case letters, digits, dots, dashes)').optional(),
    S3_REGION: z.string().min(1).default('us-east-1'),
    S3_ACCESS_KEY_ID: z.string().min(1).optional(),
    S3_SECRET_ACCESS_KEY: z.string().min(1).optional(),
    S3_FORCE_PATH_STYLE: boolish.optional(),
  })
  .superRefine((env, ctx) => {
    if (env.NODE_ENV === 'production' && !env.SESSION_SECRET) {
      ctx.addIssue({ code: 'custom', path: ['SESSION_SECRET'], message: 'is required in production' });
    }
    if (env.NODE_ENV === 'production' && !env.PUBLIC_URL) {
      ctx.addIssue({ code: 'custom', path: ['PUBLIC_URL'], message: 'is required in production (links in e-mails)' });
    }
    if (env.STORAGE === 's3' && !env.S3_BUCKET) {
      ctx.addIssue({ code: 'custom', path: ['S3_BUCKET'], message: 'is required when STORAGE=s3' });
    }
    if (Boolean(env.S3_ACCESS_KEY_ID) !== Boolean(env.S3_SECRET_ACCESS_KEY)) {
      const missing = env.S3_ACCESS_KEY_ID ? 'S3_SECRET_ACCESS_KEY' : 'S3_ACCESS_KEY_ID';
      ctx.addIssue({ code: 'custom', path: [missing], message: 'S3_ACCESS_KEY_ID and S3_SECRET_ACCESS_KEY go together' });
    }
  });

export type Env = z.infer<typeof EnvSchema>;

export interface Config {
  env: Env['NODE_ENV'];
  host: string;
  port: number;
  databaseUrl: string;
  publicUrl: string;
  sessionSecret: string;
  cookieSecure: boolean;
  smtpUrl: string;
  mailFrom: string;
  bcryptCost: number;
  authRateLimit: number;
  /** Wrong passwords in a row for one e-mail address before sign-in to it is locked. */
  signInMaxFailuresPerAccount: number;
  /** Failed sign-ins from one client address before sign-in from it is locked. */
  signInMaxFailuresPerAddress: number;
  /** How long both counts run and a lock lasts. */
  signInLockMinutes: number;
  /** Public waiting list applications per client address per hour. */
  applyRateLimit: number;
  trustProxy: boolean;
  logLevel: Env['LOG_LEVEL'];
  staticDir: string;
  /** The local upload folder (also what the backup copies when storage is local). */
  uploadDir: string;
  /** Where uploads are kept: the upload folder, or an S3-compatible bucket. */
  storage: { kind: 'local'; dir: string } | ({ kind: 's3' } & S3Settings);
}

/** Reads and validates the environment once, failing with every bad variable listed. */
export function loadConfig(source: NodeJS.ProcessEnv = process.env): Config {
  const parsed = EnvSchema.safeParse(source);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.') || '(env)'}: ${i.message}`);
    throw new Error(`Invalid configuration:\n${lines.join('\n')}`);
  }
  const e = parsed.data;
  const publicUrl = (e.PUBLIC_URL ?? `http://${e.HOST}:${e.PORT}`).replace(/\/$/, '');
  return {
    env: e.NODE_ENV,
    host: e.HOST,
    port: e.PORT,
    databaseUrl: e.DATABASE_URL,
    publicUrl,
    // A fixed secret is tolerated only outside production, where the data is demo data.
    sessionSecret: e.SESSION_SECRET ?? 'development-only-secret-not-for-production-use',
    cookieSecure: publicUrl.startsWith('https://'),
    smtpUrl: e.SMTP_URL,
    mailFrom: e.MAIL_FROM,
    bcryptCost: e.BCRYPT_COST,
    authRateLimit: e.AUTH_RATE_LIMIT,
    signInMaxFailuresPerAccount: e.SIGNIN_MAX_FAILURES_PER_ACCOUNT,
    signInMaxFailuresPerAddress: e.SIGNIN_MAX_FAILURES_PER_ADDRESS,
    signInLockMinutes: e.SIGNIN_LOCK_MINUTES,
    applyRateLimit: e.APPLY_RATE_LIMIT,
    trustProxy: e.TRUST_PROXY,
    logLevel: e.LOG_LEVEL,
    staticDir: e.STATIC_DIR,
    uploadDir: e.UPLOAD_DIR,
    storage:
      e.STORAGE === 's3'
        ? {
            kind: 's3',
            endpoint: e.S3_ENDPOINT,
            bucket: e.S3_BUCKET!,
            region: e.S3_REGION,
            accessKeyId: e.S3_ACCESS_KEY_ID,
            secretAccessKey: e.S3_SECRET_ACCESS_KEY,
            // Path-style addressing by default for a named endpoint (most S3-compatible servers), not for AWS.
            forcePathStyle: e.S3_FORCE_PATH_STYLE ?? Boolean(e.S3_ENDPOINT),
          }
        : { kind: 'local', dir: e.UPLOAD_DIR },
  };
}

/**
 * Settings that load but will not work together, said once at start-up. Tillwell serves plain
 * HTTP, so an https PUBLIC_URL means a proxy terminates TLS: without TRUST_PROXY, Express
 * sees every request as http and refuses to set the Secure session cookie, and every
 * sign-in then fails with "The page was out of date".
 */
export function configWarnings(config: Config): string[] {
  const warnings: string[] = [];
  if (config.cookieSecure && !config.trustProxy) {
    warnings.push(
      'PUBLIC_URL is https:// but TRUST_PROXY is not set: session cookies are Secure and will not be set ' +
        'for requests that reach Tillwell over plain HTTP, so nobody can sign in. Behind a reverse proxy ' +
        'that terminates TLS, set TRUST_PROXY=true.',
    );
  }
  return warnings;
}
