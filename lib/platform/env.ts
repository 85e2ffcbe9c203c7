import { z } from 'zod';
import { parseTrustedProxies } from '../http/client-address';

/**
 * Environment settings, parsed once with zod. Local defaults let `npm start` run with nothing set;
 * in production NEXTAUTH_SECRET must be set (start-up fails with a message naming it).
 */
const schema = z.object({
  NODE_ENV: z.enum(['development', 'production', 'test']).default('development'),
  DB_HOST: z.string().min(1).default('127.0.0.1'),
  DB_PORT: z.coerce.number().int().min(1).max(65535).default(3307),
  DB_NAME: z.string().regex(/^[A-Za-z0-9_]+$/, 'DB_NAME may use letters, digits and _ only').default('evenload'),
  DB_USER: z.string().min(1).default('evenload'),
  DB_PASSWORD: z.string().default('evenload-local'),
  /** Comma-separated host:port list of read replicas; reads may go there (Sequelize replication). */
  DB_READ_HOSTS: z.string().optional(),
  /** With replicas: how long a browser reads from the primary after a write (read-your-writes), and
   *  how long replicas are left alone after one did not answer (reads go to the primary meanwhile). */
  DB_READ_PRIMARY_AFTER_WRITE_MS: z.coerce.number().int().min(0).max(600_000).default(5000),
  DB_REPLICA_RETRY_MS: z.coerce.number().int().min(100).default(10_000),
  /** With replicas: reads go to the primary while a replica has not applied, for longer than this, a
   *  position the primary had reached (keep it below DB_READ_PRIMARY_AFTER_WRITE_MS, so a browser's
   *  window after its write outlasts the lag allowed); the probe runs every DB_REPLICA_LAG_PROBE_MS. */
  DB_REPLICA_MAX_LAG_MS: z.coerce.number().int().min(0).default(3000),
  DB_REPLICA_LAG_PROBE_MS: z.coerce.number().int().min(100).max(60_000).default(1000),
  DB_POOL_MAX: z.coerce.number().int().min(1).max(500).default(20),
  DB_POOL_ACQUIRE_MS: z.coerce.number().int().min(100).default(4000),
  NEXTAUTH_SECRET: z.string().min(16).optional(),
  NEXTAUTH_URL: z.string().url().optional(),
  /** Sessions: absolute lifetime from sign-in (renewal never extends it), idle timeout, and how long an
   *  instance may reuse its last database check of a session (at most 60 s, so an ended session ends
   *  everywhere within a minute). */
  EVENLOAD_SESSION_MAX_AGE_S: z.coerce.number().int().min(1).default(12 * 60 * 60),
  EVENLOAD_SESSION_IDLE_S: z.coerce.number().int().min(1).default(2 * 60 * 60),
  EVENLOAD_SESSION_CHECK_TTL_MS: z.coerce.number().int().min(0).max(60_000).default(30_000),
  EVENLOAD_LOG_SQL: z.enum(['0', '1']).default('0'),
  /** Outgoing mail (nodemailer over SMTP). Locally the SMTP fake (scripts/mail-fake.ts) listens here. */
  SMTP_HOST: z.string().min(1).default('127.0.0.1'),
  SMTP_PORT: z.coerce.number().int().min(1).max(65535).default(2525),
  SMTP_FROM: z.string().min(3).default('Evenload <no-reply@evenload.test>'),
  SMTP_USER: z.string().optional(),
  SMTP_PASS: z.string().optional(),
  /** The address links in e-mails point to; falls back to NEXTAUTH_URL, then http://127.0.0.1:3000. */
  APP_BASE_URL: z.string().url().optional(),
  /** 1 shows the development outbox (/dev/outbox) in a production build, for the demo. */
  EVENLOAD_OUTBOX: z.enum(['0', '1']).default('0'),
  /** The background worker (scripts/worker.ts, lib/data/jobs): idle poll interval (±50 %), how long a
   *  claimed job is held, jobs taken per claim, the first retry delay and its cap (lib/jobs/backoff.ts), and its name in the job table. */
  EVENLOAD_JOB_POLL_MS: z.coerce.number().int().min(50).default(5000),
  EVENLOAD_JOB_LOCK_MS: z.coerce.number().int().min(1000).default(5 * 60_000),
  EVENLOAD_JOB_BATCH: z.coerce.number().int().min(1).max(100).default(5),
  EVENLOAD_JOB_RETRY_BASE_MS: z.coerce.number().int().min(10).default(30_000),
  EVENLOAD_JOB_RETRY_CAP_MS: z.coerce.number().int().min(10).default(6 * 60 * 60_000),
  EVENLOAD_WORKER_ID: z.string().min(1).max(80).optional(),
  /**
   * Load balancers / reverse proxies whose X-Forwarded-For is believed, as IPs or CIDR ranges
   * ("10.0.0.5, 10.1.0.0/16"). Empty: the socket's peer is the client (scripts/serve.ts).
   */
  EVENLOAD_TRUSTED_PROXIES: z
    .string()
    .default('')
    .refine((list) => {
      try {
        parseTrustedProxies(list);
        return true;
      } catch {
        return false;
      }
    }, 'a comma-separated list of IP addresses or CIDR ranges, e.g. 10.0.0.5, 10.1.0.0/16'),
});

export type Env = z.infer<typeof schema>;

function parseEnv(): Env {
  const parsed = schema.safeParse(process.env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((issue) => `  ${issue.path.join('.')}: ${issue.message}`);
    throw new Error(`Evenload cannot start: invalid environment settings\n${lines.join('\n')}`);
  }
  return parsed.data;
}

export const env: Env = parseEnv();

/** The signing secret for session JWTs. A fixed local value is used outside production only. */
export function authSecret(): string {
  if (env.NEXTAUTH_SECRET) return env.NEXTAUTH_SECRET;
  if (env.NODE_ENV === 'production' && process.env.EVENLOAD_ALLOW_LOCAL_SECRET !== '1') {
    throw new Error('Evenload cannot start: NEXTAUTH_SECRET is not set (at least 16 characters).');
  }
  return 'evenload-local-development-secret-not-for-production';
}

/** The base of links in e-mails, without a trailing slash. */
export function appBaseUrl(): string {
  return (env.APP_BASE_URL ?? env.NEXTAUTH_URL ?? 'http://127.0.0.1:3000').replace(/\/+$/, '');
}

/** The captured-mail outbox is shown outside production, or when EVENLOAD_OUTBOX=1. */
export function outboxEnabled(): boolean {
  return env.NODE_ENV !== 'production' || env.EVENLOAD_OUTBOX === '1';
}
