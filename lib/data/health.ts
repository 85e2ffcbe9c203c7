import 'server-only';
import { QueryTypes } from 'sequelize';
import { sequelize } from '@/models';

/** Whether MariaDB (the primary, where writes go) answers a trivial query within the timeout. */
export async function databaseReachable(timeoutMs = 2000): Promise<boolean> {
  let timer: NodeJS.Timeout | undefined;
  try {
    await Promise.race([
      sequelize.query('SELECT 1 AS ok', { type: QueryTypes.SELECT, useMaster: true }),
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

/** Where reads go now: 'none' without replicas, 'replica', or 'primary' while the replicas do not answer or lag; and the lag the probe saw. */
export { replicaLagMs, replicaReadState } from '@/lib/platform/replica-routing';
