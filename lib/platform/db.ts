import { Sequelize } from 'sequelize';
import { env } from './env';
import { mariadbDriver } from './mariadb-driver';
import { installReplicaRouting } from './replica-routing';

/**
 * The one Sequelize instance (cached on globalThis so dev reloads reuse the pool).
 * Pool size and acquire timeout are set deliberately (DB_POOL_MAX, DB_POOL_ACQUIRE_MS): a request
 * that cannot get a connection within the timeout fails fast with a clear 503 instead of queueing
 * for ever. With DB_READ_HOSTS set, Sequelize sends reads to the replicas and writes to DB_HOST;
 * replica-routing.ts adds read-your-writes and the fall-back to the primary when a replica is down.
 */
export function createSequelize(database: string = env.DB_NAME, overrides: { port?: number } = {}): Sequelize {
  const common = { username: env.DB_USER, password: env.DB_PASSWORD, database };
  const readHosts = (env.DB_READ_HOSTS ?? '')
    .split(',')
    .map((entry) => entry.trim())
    .filter(Boolean)
    .map((entry) => {
      const [host, port] = entry.split(':');
      return { ...common, host: host ?? '127.0.0.1', port: Number(port ?? env.DB_PORT) };
    });
  const instance = new Sequelize(database, env.DB_USER, env.DB_PASSWORD, {
    dialect: 'mariadb',
    dialectModule: mariadbDriver,
    host: env.DB_HOST,
    port: overrides.port ?? env.DB_PORT,
    logging: env.EVENLOAD_LOG_SQL === '1' ? console.log : false,
    timezone: '+00:00',
    dialectOptions: { connectTimeout: 3000, permitLocalInfile: true },
    pool: { max: env.DB_POOL_MAX, min: 0, acquire: env.DB_POOL_ACQUIRE_MS, idle: 10_000, evict: 5_000 },
    retry: { max: 0 },
    ...(readHosts.length
      ? { replication: { read: readHosts, write: { ...common, host: env.DB_HOST, port: env.DB_PORT } } }
      : {}),
    define: { underscored: true },
  });
  if (readHosts.length) {
    const probeUser = { user: env.DB_USER, password: env.DB_PASSWORD };
    installReplicaRouting(instance, {
      readPrimaryAfterWriteMs: env.DB_READ_PRIMARY_AFTER_WRITE_MS,
      replicaRetryMs: env.DB_REPLICA_RETRY_MS,
      maxLagMs: env.DB_REPLICA_MAX_LAG_MS,
      lagProbeMs: env.DB_REPLICA_LAG_PROBE_MS,
      primary: { host: env.DB_HOST, port: overrides.port ?? env.DB_PORT, ...probeUser },
      replicas: readHosts.map((h) => ({ host: h.host, port: h.port, ...probeUser })),
    });
  }
  return instance;
}

const globalForDb = globalThis as unknown as { evenloadSequelize?: Sequelize };

export const sequelize: Sequelize = globalForDb.evenloadSequelize ?? createSequelize();
globalForDb.evenloadSequelize = sequelize;
