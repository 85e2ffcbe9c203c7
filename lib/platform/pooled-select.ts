import { QueryTypes, type Sequelize } from 'sequelize';

/**
 * A SELECT run on a connection of Sequelize's pool, straight through the mariadb driver: no query
 * formatting, hooks or result shaping, for a small statement asked on every request (the runs list's
 * version stamp). The connection is taken as Sequelize takes it for a read (`type: 'SELECT'`), so
 * the replica routing of replica-routing.ts applies unchanged. Any failure falls back to
 * `sequelize.query`, which retries a read on the primary when a replica breaks mid-query.
 */
type PooledConnection = { query(sql: string, values?: unknown[]): Promise<unknown>; isValid?(): boolean };
type Manager = { getConnection(options: { type: string }): Promise<PooledConnection>; releaseConnection(c: PooledConnection): void; destroyConnection(c: PooledConnection): Promise<void> };

export async function pooledSelect<T extends object>(sequelize: Sequelize, sql: string, values: unknown[] = []): Promise<T[]> {
  const manager = sequelize.connectionManager as unknown as Manager;
  let connection: PooledConnection | null = null;
  try {
    connection = await manager.getConnection({ type: 'SELECT' });
    const rows = (await connection.query(sql, values)) as T[];
    manager.releaseConnection(connection);
    return rows;
  } catch {
    if (connection) {
      if (connection.isValid?.() === false) await manager.destroyConnection(connection).catch(() => undefined);
      else manager.releaseConnection(connection);
    }
    return sequelize.query<T>(sql, { type: QueryTypes.SELECT, replacements: values });
  }
}
