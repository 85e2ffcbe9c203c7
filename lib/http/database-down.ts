import { ConnectionAcquireTimeoutError, ConnectionError } from 'sequelize';

/** True for the errors Sequelize raises when MariaDB does not answer (refused, lost, pool timeout, host unreachable). */
export function isDatabaseDown(error: unknown): boolean {
  if (error instanceof ConnectionError || error instanceof ConnectionAcquireTimeoutError) return true;
  const name = (error as { name?: string } | null)?.name ?? '';
  return name.startsWith('SequelizeConnection') || name === 'SequelizeHostNotReachableError';
}
