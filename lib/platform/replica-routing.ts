import * as mariadb from 'mariadb';
import type { Sequelize } from 'sequelize';
import { CAUGHT_UP, chooseReadTarget, isConnectionFailure, isLagging, nextLagState, parseGtidPosition, parsePrimaryUntil, READ_PRIMARY_COOKIE, type LagState } from './read-routing';

/**
 * Read-replica routing for a Sequelize instance with `replication` (DB_READ_HOSTS): read-your-writes
 * through a short-lived cookie and falling back to the primary while a replica does not answer. The
 * rules are in read-routing.ts; this file only connects them to Sequelize's connection manager and
 * to the request's cookies (next/headers; outside a request, e.g. in scripts, reads go to the replica),
 * and runs the lag probe: every `lagProbeMs` one small query on the primary and on each replica (a
 * connection of the probe's own, outside the pool) feeds `nextLagState`.
 */

interface Options {
  /** How long a browser reads from the primary after a write. */
  readPrimaryAfterWriteMs: number;
  /** How long replicas are left alone after one refused a connection. */
  replicaRetryMs: number;
  /** Reads go to the primary while a replica lags by more than this. */
  maxLagMs: number;
  /** How often the lag probe runs. */
  lagProbeMs: number;
  /** Where the probe connects: the primary and each replica. */
  primary: ProbeTarget;
  replicas: ProbeTarget[];
}

export interface ProbeTarget {
  host: string;
  port: number;
  user: string;
  password: string;
}

type AcquireOptions = { type?: string; useMaster?: boolean } & Record<string, unknown>;
type CookieStore = { get(name: string): { value: string } | undefined; set(name: string, value: string, options: Record<string, unknown>): void };

const state = { replicaDownUntilMs: 0, installed: false, lagging: false, lagMs: 0 };

/** For the health route: 'none' without replicas, else whether reads currently go to them (not while down or lagging). */
export function replicaReadState(nowMs = Date.now()): 'none' | 'replica' | 'primary' {
  if (!state.installed) return 'none';
  return nowMs < state.replicaDownUntilMs || state.lagging ? 'primary' : 'replica';
}

/** For the health route: the largest replica lag the last probe saw, in ms (null without replicas). */
export function replicaLagMs(): number | null {
  return state.installed ? state.lagMs : null;
}

/** One connection per server for the probe, opened when first needed and again after a failure. */
function probeConnection(target: ProbeTarget) {
  let connection: Promise<mariadb.Connection> | null = null;
  return async (sql: string): Promise<string | null> => {
    try {
      connection ??= mariadb.createConnection({ host: target.host, port: target.port, user: target.user, password: target.password, connectTimeout: 2000, queryTimeout: 2000 });
      const rows = (await (await connection).query(sql)) as Array<{ pos: string | null }>;
      return rows[0]?.pos ?? '';
    } catch {
      const failed = connection;
      connection = null;
      void failed?.then((c) => c.destroy()).catch(() => undefined);
      return null;
    }
  };
}

/** Starts the lag probe (once, on the first query; the timer does not keep the process alive). */
function startLagProbe(options: Options): void {
  const primary = probeConnection(options.primary);
  const replicas = options.replicas.map((target) => ({ ask: probeConnection(target), lag: CAUGHT_UP as LagState }));
  let running = false;
  const probe = async () => {
    if (running) return;
    running = true;
    try {
      const primaryPosition = parseGtidPosition(await primary('SELECT @@gtid_binlog_pos AS pos'));
      if (!primaryPosition) return;
      for (const replica of replicas) {
        const position = parseGtidPosition(await replica.ask('SELECT @@gtid_slave_pos AS pos'));
        // An unreachable replica keeps its last state: the connection fall-back covers it.
        if (position) replica.lag = nextLagState(replica.lag, { nowMs: Date.now(), primary: primaryPosition, replica: position });
      }
      const wasLagging = state.lagging;
      state.lagging = replicas.some((r) => isLagging(r.lag, options.maxLagMs));
      state.lagMs = Math.max(0, ...replicas.map((r) => r.lag.lagMs));
      if (state.lagging !== wasLagging) {
        console.warn(state.lagging ? `evenload: a read replica lags by ${state.lagMs} ms (over ${options.maxLagMs} ms); reading from the primary` : 'evenload: the read replicas caught up; reading from them again');
      }
    } finally {
      running = false;
    }
  };
  setInterval(() => void probe(), options.lagProbeMs).unref();
  void probe();
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
  let probing = false;
  manager.getConnection = async (acquireOptions: AcquireOptions = {}) => {
    if (!probing) {
      probing = true;
      startLagProbe(options);
    }
    const store = await requestCookies();
    const nowMs = Date.now();
    const target = chooseReadTarget({
      queryType: acquireOptions.type,
      useMaster: acquireOptions.useMaster === true,
      nowMs,
      primaryUntilMs: parsePrimaryUntil(store?.get(READ_PRIMARY_COOKIE)?.value, nowMs, options.readPrimaryAfterWriteMs),
      replicaDownUntilMs: state.replicaDownUntilMs,
      replicaLagging: state.lagging,
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
