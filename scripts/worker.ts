/**
 * The background worker: works the job table (lib/data/jobs/worker.ts) until SIGTERM or SIGINT, then
 * finishes the job in hand and exits. Stateless: run one beside each app instance, or several.
 *   npx tsx --conditions=react-server scripts/worker.ts
 * (The condition lets lib/data's `import 'server-only'` load outside Next, as it does in the app.)
 * Settings: EVENLOAD_JOB_POLL_MS, EVENLOAD_JOB_LOCK_MS, EVENLOAD_JOB_BATCH, EVENLOAD_JOB_RETRY_BASE_MS, EVENLOAD_JOB_RETRY_CAP_MS,
 * EVENLOAD_WORKER_ID (default host:pid), and the DB_* and SMTP_* settings of the app.
 */
import { hostname } from 'node:os';
import { sequelize } from '../models';
import { env } from '../lib/platform/env';
import { DEFAULT_WORKER_OPTIONS, startWorkLoop } from '../lib/data/jobs/worker';

const workerId = env.EVENLOAD_WORKER_ID ?? `${hostname()}:${process.pid}`;
const loop = startWorkLoop({
  ...DEFAULT_WORKER_OPTIONS,
  workerId,
  pollMs: env.EVENLOAD_JOB_POLL_MS,
  lockMs: env.EVENLOAD_JOB_LOCK_MS,
  batch: env.EVENLOAD_JOB_BATCH,
  retry: { baseMs: env.EVENLOAD_JOB_RETRY_BASE_MS, capMs: env.EVENLOAD_JOB_RETRY_CAP_MS },
});
console.log(`[worker ${workerId}] working the job table of ${env.DB_NAME} on port ${env.DB_PORT}`);

let stopping = false;
const stop = (signal: string) => {
  if (stopping) return;
  stopping = true;
  console.log(`[worker ${workerId}] ${signal}: finishing the job in hand`);
  void loop.stop().then(() => sequelize.close()).then(() => {
    console.log(`[worker ${workerId}] stopped`);
    process.exit(0);
  });
};
process.on('SIGTERM', () => stop('SIGTERM'));
process.on('SIGINT', () => stop('SIGINT'));
