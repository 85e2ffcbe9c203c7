import 'server-only';
import { ConnectionError } from 'sequelize';
import { sequelize } from '@/models';
import { isConnectionFailure } from '../platform/read-routing';
import { expandListPlaceholders } from '../platform/expand-list-placeholders';

/**
 * Reads of many rows (a comparison's ten thousand runs) straight from the pool's mariadb connection,
 * each row an array in the column order of the SELECT. Sequelize's raw query path copies and walks
 * every row again, which for 10,000 rows costs more than the read itself (`npm run bench -- compare`).
 *
 * The connection comes from Sequelize's connection manager, so the pool, its limits and the replica
 * routing (read-your-writes, the fall-back to the primary, the lag rule) apply as to every other read.
 * The driver's own column decoders are used, not Sequelize's per-value type-cast callback (set on its
 * connections), which for 10,000 rows costs several times the read: integers and doubles arrive as
 * numbers, BLOBs as Buffers, text as strings, DATETIMEs as Dates in the connection's time zone (UTC).
 * Aggregates that MariaDB types DECIMAL or BIGINT would arrive otherwise: cast them in the SQL.
 * A connection that breaks during the read is asked once more of the primary, and a connection failure
 * reaches the caller as Sequelize's ConnectionError (answered 503 like any other). Parameters are the
 * driver's `?` placeholders; an array parameter becomes a list (`IN (?)`).
 */
interface DriverConnection {
  execute(options: { sql: string; rowsAsArray: true; typeCast: null }, values?: unknown[]): Promise<unknown[]>;
}
interface Manager {
  getConnection(options: { type: 'SELECT'; useMaster?: boolean }): Promise<DriverConnection>;
  releaseConnection(connection: DriverConnection): Promise<void> | void;
}

async function readOnce<Row extends unknown[]>(sql: string, params: readonly unknown[], useMaster: boolean): Promise<Row[]> {
  const manager = sequelize.connectionManager as unknown as Manager;
  const connection = await manager.getConnection({ type: 'SELECT', useMaster });
  try {
    const statement = expandListPlaceholders(sql, params);
    return (await connection.execute({ sql: statement.sql, rowsAsArray: true, typeCast: null }, statement.values)) as Row[];
  } finally {
    await manager.releaseConnection(connection);
  }
}

export async function readRowArrays<Row extends unknown[]>(sql: string, params: readonly unknown[] = [], options: { useMaster?: boolean } = {}): Promise<Row[]> {
  try {
    return await readOnce<Row>(sql, params, options.useMaster === true);
  } catch (error) {
    if (!isConnectionFailure(error)) throw error;
    if (!options.useMaster) {
      try {
        return await readOnce<Row>(sql, params, true);
      } catch (again) {
        if (!isConnectionFailure(again)) throw again;
        throw new ConnectionError(again as Error);
      }
    }
    throw new ConnectionError(error as Error);
  }
}
