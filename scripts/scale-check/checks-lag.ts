/**
 * A replica that answers but lags: its SQL thread is stopped (it still takes connections and reads,
 * but applies nothing), a run is uploaded, and another browser past its read-from-primary window
 * opens it. At once it usually does not find it (its reads go to the replica); once the lag
 * probe of each instance has seen the replica behind for longer than DB_REPLICA_MAX_LAG_MS, its reads
 * go to the primary and find it, and both instances' health says so. The SQL thread is started again
 * and, once the replica has caught up, reads go back to it.
 */
import * as mariadb from 'mariadb';
import path from 'node:path';
import { env } from '../../lib/platform/env';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from '../../tests/support/http-session';
import { Browser } from './client';
import { cluster, replicaCaughtUp, sleep } from './cluster';
import { type CheckResult, type Testbed, upload } from './fixtures';

interface Health {
  reads?: string;
  replicaLagMs?: number;
}

/** Each app instance's health, asked directly (not through the balancer). */
async function instanceHealth(): Promise<Health[]> {
  const ports = [process.env.SCALE_APP1_PORT, process.env.SCALE_APP2_PORT].filter(Boolean);
  return Promise.all(ports.map(async (port) => (await (await fetch(`http://127.0.0.1:${port}/api/health`)).json()) as Health));
}

const describeHealth = (health: Health[]) => health.map((h, i) => `app${i + 1} ${h.reads}${h.replicaLagMs ? ` (lag ${h.replicaLagMs} ms)` : ''}`).join(', ');

export async function checkReplicaLagging(testbed: Testbed, windowMs: number): Promise<CheckResult> {
  const other = new Browser(cluster.balancer);
  if (!(await other.signIn(DEMO_ACCOUNTS.instructor, DEMO_PASSWORD))) throw new Error('the instructor could not sign in');
  await sleep(windowMs + 500); // past the other browser's own window (its sign-in wrote)
  // root over the replica's socket, as scale-check.sh set it up.
  const root = await mariadb.createConnection({ socketPath: path.join(cluster.dir, 'replica', 'mariadb.sock'), user: 'root' });
  try {
    await root.query('STOP SLAVE SQL_THREAD');
    const stored = await upload(testbed.instructor, testbed);
    if (stored.status !== 201 || stored.runId === null) throw new Error(`the upload answered ${stored.status}`);
    const read = async () => {
      const response = await other.get(`/api/runs/${stored.runId}`);
      await response.body?.cancel();
      return response.status;
    };
    const early = await read();
    const wait = env.DB_REPLICA_MAX_LAG_MS + 2 * env.DB_REPLICA_LAG_PROBE_MS + 500;
    await sleep(wait);
    const whileLagging = await instanceHealth();
    const late = [await read(), await read(), await read(), await read()];
    await root.query('START SLAVE SQL_THREAD');
    const caughtUpMs = await replicaCaughtUp();
    await sleep(2 * env.DB_REPLICA_LAG_PROBE_MS + 500);
    const afterwards = await instanceHealth();
    // `early` is shown, not required: a slow upload may already have let the lag pass the limit.
    const ok =
      late.every((s) => s === 200) &&
      whileLagging.length === 2 &&
      whileLagging.every((h) => h.reads === 'primary') &&
      afterwards.every((h) => h.reads === 'replica');
    return {
      check: 'replica lagging but reachable: reads go to the primary',
      ok,
      figures: `SQL thread stopped; another browser at once: ${early}${early === 404 ? ' (read on the replica)' : ''}; after ${wait} ms: ${late.filter((s) => s === 200).length}/4 reads 200; ${describeHealth(whileLagging)}; caught up ${caughtUpMs} ms after restart, then ${describeHealth(afterwards)} (max lag ${env.DB_REPLICA_MAX_LAG_MS} ms)`,
    };
  } finally {
    await root.query('START SLAVE SQL_THREAD').catch(() => undefined);
    await root.end();
  }
}
