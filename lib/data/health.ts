import 'server-only';
import { sequelize } from '@/models';

/** Whether MariaDB answers a trivial query within the timeout. */
export async function databaseReachable(timeoutMs = 2000): Promise<boolean> {
  let timer: NodeJS.Timeout | undefined;
  try {
    await Promise.race([
      sequelize.query('SELECT 1 AS ok'),
      new Promise((_, reject) => {
        timer = setTimeout(() => reject(new Error('timeout')), timeoutMs);
      }),
    ]);
    return true;
  } catch {
    return false;
  } finally {
    if (timer) clearTimeout(timer);
  }
}
