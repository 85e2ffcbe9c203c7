import { z } from 'zod';

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
  DB_POOL_MAX: z.coerce.number().int().min(1).max(500).default(20),
  DB_POOL_ACQUIRE_MS: z.coerce.number().int().min(100).default(4000),
  NEXTAUTH_SECRET: z.string().min(16).optional(),
  NEXTAUTH_URL: z.string().url().optional(),
  EVENLOAD_LOG_SQL: z.enum(['0', '1']).default('0'),
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
