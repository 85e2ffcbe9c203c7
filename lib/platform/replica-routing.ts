import type { Sequelize } from 'sequelize';
import { chooseReadTarget, isConnectionFailure, parsePrimaryUntil, READ_PRIMARY_COOKIE } from './read-routing';

/**
 * Read-replica routing for a Sequelize instance with `replication` (DB_READ_HOSTS): read-your-writes
 * through a short-lived cookie and falling back to the primary while a replica does not answer. The
 * rules are in read-routing.ts; this file only connects them to Sequelize's connection manager and
 * to the request's cookies (next/headers; outside a request, e.g. in scripts, reads go to the replica).
 */

interface Options {
  /** How long a browser reads from the primary after a write. */
  readPrimaryAfterWriteMs: number;
  /** How long replicas are left alone after one refused a connection. */
  replicaRetryMs: number;
}

type AcquireOptions = { type?: string; useMaster?: boolean } & Record<string, unknown>;
type CookieStore = { get(name: string): { value: string } | undefined; set(name: string, value: string, options: Record<string, unknown>): void };

const state = { replicaDownUntilMs: 0, installed: false };

/** For the health route: 'none' without replicas, else whether reads currently go to them. */
export function replicaReadState(nowMs = Date.now()): 'none' | 'replica' | 'primary' {
  if (!state.installed) return 'none';
  return nowMs < state.replicaDownUntilMs ? 'primary' : 'replica';
}

async function requestCookies(): Promise<CookieStore | null> {
  try {
    const { cookies } = await import('next/headers');
    return (await cookies()) as unknown as CookieStore;
  } catch {
    return null; // not inside a request (scripts, background work)
  }
}

function markWrite(store: CookieStore | null, options: Options): void {
  if (!store) return;
  try {
    store.set(READ_PRIMARY_COOKIE, String(Date.now() + options.readPrimaryAfterWriteMs), {
      httpOnly: true,
      sameSite: 'lax',
      path: '/',
      maxAge: Math.ceil(options.readPrimaryAfterWriteMs / 1000),
    });
  } catch {
    // Server components cannot set cookies; their writes are rare (session touch) and harmless here.
  }
}

export function installReplicaRouting(sequelize: Sequelize, options: Options): void {
  const manager = sequelize.connectionManager as unknown as { getConnection(o?: AcquireOptions): Promise<unknown> };
  const acquire = manager.getConnection.bind(manager);
  state.installed = true;
  manager.getConnection = async (acquireOptions: AcquireOptions = {}) => {
    const store = await requestCookies();
    const nowMs = Date.now();
    const target = chooseReadTarget({
      queryType: acquireOptions.type,
      useMaster: acquireOptions.useMaster === true,
      nowMs,
      primaryUntilMs: parsePrimaryUntil(store?.get(READ_PRIMARY_COOKIE)?.value, nowMs, options.readPrimaryAfterWriteMs),
      replicaDownUntilMs: state.replicaDownUntilMs,
    });
    if (target === 'primary') {
      if (acquireOptions.type !== 'SELECT') markWrite(store, options);
      return acquire({ ...acquireOptions, useMaster: true });
    }
    try {
      return await acquire(acquireOptions);
    } catch (error) {
      if (!isConnectionFailure(error)) throw error;
      replicaFailed(error, options);
      return acquire({ ...acquireOptions, useMaster: true });
    }
  };
  // A replica that stops during a read breaks that read's connection: the read is asked again of the primary.
  const query = sequelize.query.bind(sequelize) as (sql: unknown, queryOptions?: AcquireOptions) => Promise<unknown>;
  (sequelize as unknown as { query: typeof query }).query = async (sql, queryOptions) => {
    try {
      return await query(sql, queryOptions);
    } catch (error) {
      const retryable = queryOptions?.type === 'SELECT' && !queryOptions.transaction && queryOptions.useMaster !== true;
      if (!retryable || !isConnectionFailure(error)) throw error;
      replicaFailed(error, options);
      return query(sql, { ...queryOptions, useMaster: true });
    }
  };
}

function replicaFailed(error: unknown, options: Options): void {
  state.replicaDownUntilMs = Date.now() + options.replicaRetryMs;
  console.warn(`evenload: a read replica did not answer (${(error as Error).message}); reading from the primary for ${options.replicaRetryMs} ms`);
}
