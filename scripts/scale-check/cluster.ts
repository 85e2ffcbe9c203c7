/**
 * What scale-check.sh started, as the driver sees it: the balancer's address, the pid files of the
 * app instances and the replica, and SQL on the primary (through the app's own connection, DB_PORT)
 * and on the replica.
 */
import { readFileSync } from 'node:fs';
import path from 'node:path';
import * as mariadb from 'mariadb';
import { QueryTypes } from 'sequelize';
import { sequelize } from '../../lib/platform/db';
import { env } from '../../lib/platform/env';

const need = (name: string) => {
  const value = process.env[name];
  if (!value) throw new Error(`scale-check: ${name} is not set (run it through npm run scale-check)`);
  return value;
};

export const cluster = {
  dir: need('SCALE_DIR'),
  balancer: process.env.SCALE_LB_URL ?? `http://127.0.0.1:${need('SCALE_LB_PORT')}`,
  replicaHost: process.env.SCALE_REPLICA_HOST ?? '127.0.0.1',
  replicaPort: Number(need('SCALE_REPLICA_PORT')),
  /** 1: only the checks that stop nothing (e.g. against machines this driver did not start). */
  skipFaults: process.env.SCALE_SKIP_FAULTS === '1',
  replicaDelayS: Number(need('SCALE_REPLICA_DELAY_S')),
};

export const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

function pidOf(file: string): number {
  return Number(readFileSync(path.join(cluster.dir, file), 'utf8').trim());
}

const alive = (pid: number) => {
  try {
    process.kill(pid, 0);
    return true;
  } catch {
    return false;
  }
};

/**
 * Stops a process scale-check.sh started (by its pid file) with its process group (setsid made it the
 * leader: an app instance is tsx with its node child), and waits until they have gone.
 */
export async function stopProcess(file: string, signal: NodeJS.Signals): Promise<void> {
  const pid = pidOf(file);
  try {
    process.kill(-pid, signal);
  } catch {
    process.kill(pid, signal); // not a group leader
  }
  for (let i = 0; i < 200; i++) {
    if (!alive(pid) && !alive(-pid)) return;
    await sleep(50);
  }
  throw new Error(`${file}: process ${pid} did not stop`);
}

export async function primaryRows<T extends object>(sql: string, replacements: unknown[] = []): Promise<T[]> {
  return sequelize.query<T>(sql, { type: QueryTypes.SELECT, replacements });
}

export async function primaryCount(sql: string, replacements: unknown[] = []): Promise<number> {
  const [row] = await primaryRows<{ n: number }>(sql, replacements);
  return Number(row?.n ?? 0);
}

/** Waits until the replica has applied everything the primary wrote so far; returns the wait in ms. */
export async function replicaCaughtUp(timeoutS = 30): Promise<number> {
  const [row] = await primaryRows<{ pos: string }>('SELECT @@gtid_binlog_pos AS pos');
  const started = Date.now();
  const connection = await mariadb.createConnection({ host: cluster.replicaHost, port: cluster.replicaPort, user: env.DB_USER, password: env.DB_PASSWORD });
  try {
    const [wait] = (await connection.query('SELECT MASTER_GTID_WAIT(?, ?) AS r', [row!.pos, timeoutS])) as Array<{ r: number }>;
    if (Number(wait!.r) !== 0) throw new Error(`the replica did not reach ${row!.pos} within ${timeoutS} s`);
  } finally {
    await connection.end();
  }
  return Date.now() - started;
}
