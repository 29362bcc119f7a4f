import os from 'node:os';
import path from 'node:path';
import { z } from 'zod';

// Every setting comes from the environment, validated once, with defaults that
// run on a fresh machine: a SQLite file under data/ and a local mail catcher.
const EnvSchema = z.object({
  NODE_ENV: z.enum(['development', 'production', 'test']).default('development'),
  PORT: z.coerce.number().int().min(0).max(65535).default(3000),
  HOST: z.string().default('127.0.0.1'),
  DATABASE_PATH: z.string().default('data/wearcourse.db'),
  APP_URL: z.string().url().optional(),
  SMTP_URL: z.string().url().optional(),
  MAIL_CATCHER_PORT: z.coerce.number().int().min(0).max(65535).default(2525),
  MAIL_FROM: z.string().default('Wearcourse <no-reply@wearcourse.local>'),
  SESSION_SECRET: z.string().min(16).optional(),
  TRUST_PROXY: z.enum(['0', '1']).default('0'),
  SIGNIN_RATE_LIMIT: z.coerce.number().int().min(1).default(10),
  SEED_DEMO: z.enum(['0', '1']).default('1'),
  ALLOWED_ORIGINS: z.string().optional(),
  ALLOW_RESTORE_BY_ANY_USER: z.enum(['0', '1']).default('0'),
  RESTORE_RATE_LIMIT: z.coerce.number().int().min(1).default(5),
  WORKER_THREADS: z.coerce.number().int().min(1).max(64).optional(),
  WORKER_TASKS_PER_AGENCY: z.coerce.number().int().min(1).max(64).default(2),
  WORKER_TASKS_PER_USER: z.coerce.number().int().min(1).max(64).default(2),
});

/** One worker thread per core, at least two: heavy work runs there, never on the request thread. */
export const defaultWorkerThreads = () => Math.max(2, os.availableParallelism());

export type AppConfig = {
  env: 'development' | 'production' | 'test';
  port: number;
  host: string;
  databasePath: string;
  appUrl: string;
  /** True when APP_URL was not set and the URL follows the port actually bound. */
  appUrlFromPort: boolean;
  smtpUrl: string | undefined;
  mailCatcherPort: number;
  mailFrom: string;
  sessionSecret: string;
  trustProxy: boolean;
  signInRateLimit: number;
  seedDemo: boolean;
  /** Origins besides APP_URL's that may send state-changing requests (comma-separated in ALLOWED_ORIGINS). */
  allowedOrigins: string[];
  /** Off by default: only someone who is already an admin of an agency may restore an archive. */
  restoreByAnyUser: boolean;
  /** Restores per user per hour. */
  restoreRateLimit: number;
  /** Heavy tasks at once: in all (the pool's threads), per agency and per user. */
  workers: { threads: number; perAgency: number; perUser: number };
};

export function loadConfig(env: NodeJS.ProcessEnv = process.env): AppConfig {
  const parsed = EnvSchema.safeParse(env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`);
    throw new Error(`Invalid configuration:\n${lines.join('\n')}`);
  }
  const e = parsed.data;
  if (e.NODE_ENV === 'production' && !e.SESSION_SECRET) {
    throw new Error('SESSION_SECRET (16+ characters) is required when NODE_ENV=production');
  }
  return {
    env: e.NODE_ENV,
    port: e.PORT,
    host: e.HOST,
    databasePath: path.resolve(e.DATABASE_PATH),
    appUrl: (e.APP_URL ?? `http://localhost:${e.PORT}`).replace(/\/$/, ''),
    appUrlFromPort: !e.APP_URL,
    smtpUrl: e.SMTP_URL,
    mailCatcherPort: e.MAIL_CATCHER_PORT,
    mailFrom: e.MAIL_FROM,
    // A development secret is fine on a desk machine; production must set one.
    sessionSecret: e.SESSION_SECRET ?? 'wearcourse-development-session-secret',
    trustProxy: e.TRUST_PROXY === '1',
    signInRateLimit: e.SIGNIN_RATE_LIMIT,
    seedDemo: e.SEED_DEMO === '1',
    allowedOrigins: (e.ALLOWED_ORIGINS ?? '')
      .split(',')
      .map((o) => o.trim())
      .filter(Boolean)
      .map((o) => {
        try {
          return new URL(o).origin;
        } catch {
          throw new Error(`Invalid configuration:\n  ALLOWED_ORIGINS: "${o}" is not a URL`);
        }
      }),
    restoreByAnyUser: e.ALLOW_RESTORE_BY_ANY_USER === '1',
    restoreRateLimit: e.RESTORE_RATE_LIMIT,
    workers: {
      threads: e.WORKER_THREADS ?? defaultWorkerThreads(),
      perAgency: e.WORKER_TASKS_PER_AGENCY,
      perUser: e.WORKER_TASKS_PER_USER,
    },
  };
}
