import * as mariadb from 'mariadb';

/**
 * The mariadb driver as Sequelize 6 should see it.
 *
 * With mariadb >= 3.1 every raw query through Sequelize 6 throws
 * "Cannot delete property 'meta' of [object Array]": the driver returns result arrays whose `meta`
 * property is non-configurable and Sequelize's raw-query path deletes it (sequelize issue 15701).
 * We wrap `createConnection` so each query result is copied onto a fresh array with an ordinary
 * `meta` property. tests/integration/database.test.ts runs a raw query and a migration `down`, so an
 * upgrade of either package shows at once whether this is still needed.
 */
type Connection = Awaited<ReturnType<typeof mariadb.createConnection>>;

function withPlainMeta<T>(result: T): T {
  if (!Array.isArray(result)) return result;
  const meta = (result as unknown as { meta?: unknown }).meta;
  const copy = Array.from(result) as unknown as T & { meta?: unknown };
  if (meta !== undefined) copy.meta = meta;
  return copy;
}

async function createConnection(config: mariadb.ConnectionConfig): Promise<Connection> {
  const connection = await mariadb.createConnection(config);
  const query = connection.query.bind(connection);
  const execute = connection.execute.bind(connection);
  connection.query = (async (...args: Parameters<typeof query>) => withPlainMeta(await query(...args))) as typeof query;
  connection.execute = (async (...args: Parameters<typeof execute>) =>
    withPlainMeta(await execute(...args))) as typeof execute;
  return connection;
}

export const mariadbDriver = { ...mariadb, createConnection };
