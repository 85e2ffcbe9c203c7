import { execFileSync, spawn } from 'node:child_process';
import { mkdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { QueryTypes, type Sequelize } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createSequelize } from '@/lib/platform/db';
import { startAppServer, type AppServer } from '../support/app-server';
import { DEMO_ACCOUNTS, signInAs, type HttpSession } from '../support/http-session';

// These tests kill MariaDB by its pid, so they run against a private instance of their own (own
// data directory, port and database) and an app server of their own: nothing else is disturbed.
const root = path.resolve(__dirname, '../..');
const dbEnv = {
  EVENLOAD_DB_DIR: path.join(root, '.data/mariadb-fault'),
  DB_PORT: process.env.EVENLOAD_FAULT_DB_PORT ?? '3319',
  DB_NAME: 'evenload_fault',
};
const appPort = Number(process.env.EVENLOAD_FAULT_APP_PORT ?? 3140);
const pidFile = path.join(dbEnv.EVENLOAD_DB_DIR, 'mariadb.pid');
const run = (command: string, args: string[]) => execFileSync(command, args, { cwd: root, env: { ...process.env, ...dbEnv }, stdio: 'pipe' });
const startDb = () => run('bash', ['scripts/db.sh', 'start']);
const killDb = () => {
  const pid = Number(readFileSync(pidFile, 'utf8').trim());
  process.kill(pid, 'SIGKILL');
  for (let i = 0; i < 100; i += 1) {
    try {
      process.kill(pid, 0);
    } catch {
      return;
    }
    execFileSync('sleep', ['0.05']);
  }
};

let server: AppServer;
let db: Sequelize;
let researcher: HttpSession;

async function counts() {
  const [row] = await db.query<{ runs: number; steps: number; readings: number }>(
    'SELECT (SELECT COUNT(*) FROM runs) AS runs, (SELECT COUNT(*) FROM tightening_steps) AS steps, (SELECT COUNT(*) FROM readings) AS readings',
    { type: QueryTypes.SELECT },
  );
  return { runs: Number(row!.runs), steps: Number(row!.steps), readings: Number(row!.readings) };
}

beforeAll(async () => {
  startDb();
  run('node_modules/.bin/tsx', ['scripts/migrate.ts', 'up']);
  run('node_modules/.bin/tsx', ['scripts/migrate.ts', 'seed']);
  db = createSequelize(dbEnv.DB_NAME, { port: Number(dbEnv.DB_PORT) });
  server = await startAppServer(appPort, dbEnv);
  researcher = await signInAs(server.baseUrl, DEMO_ACCOUNTS.researcher);
});

afterAll(async () => {
  await server?.stop();
  await db?.close();
  try {
    run('bash', ['scripts/db.sh', 'stop']);
  } catch {
    // already stopped
  }
});

describe('MariaDB going away', () => {
  it('answers 503 with a clear message while the database is down, and recovers by itself when it is back', async () => {
    expect((await researcher.get('/api/runs?pageSize=5')).status).toBe(200);
    killDb();
    const down = await researcher.get('/api/runs?pageSize=5');
    expect(down.status).toBe(503);
    expect(((await down.json()) as { error: { message: string } }).error.message).toMatch(/database is not answering/i);
    expect((await researcher.get('/api/health')).status).toBe(503);

    startDb();
    const back = performance.now();
    let recoveredAfterMs = -1;
    // Poll for up to 20 s (no timing assertion: the measured recovery time is reported below).
    while (performance.now() - back < 20_000) {
      const response = await researcher.get('/api/runs?pageSize=5');
      if (response.status === 200) {
        recoveredAfterMs = performance.now() - back;
        break;
      }
      await new Promise((resolve) => setTimeout(resolve, 100));
    }
    console.log(`[faults] the app answered 200 again ${recoveredAfterMs.toFixed(0)} ms after MariaDB came back (no restart of Next)`);
    expect(recoveredAfterMs).toBeGreaterThanOrEqual(0);
  });

  it('leaves no partial run and no orphan readings when MariaDB is killed mid-upload, and the retry succeeds', async () => {
    const [ids] = await db.query<{ joint: number; method: number; lubricant: number; operator: number }>(
      `SELECT (SELECT id FROM joints WHERE stud_count = 8 LIMIT 1) AS joint, (SELECT id FROM methods LIMIT 1) AS method,
              (SELECT id FROM lubricants LIMIT 1) AS lubricant, (SELECT id FROM users WHERE role = 'researcher' LIMIT 1) AS operator`,
      { type: QueryTypes.SELECT },
    );
    const dir = path.join(root, '.data/fault-files');
    mkdirSync(dir, { recursive: true });
    const file = path.join(dir, 'wide-400k.csv');
    const lines = ['time_s,step,Stud 1,Stud 2,Stud 3,Stud 4,Stud 5,Stud 6,Stud 7,Stud 8'];
    for (let s = 0; s < 50_000; s += 1) lines.push(`${s},${s + 1},${Array.from({ length: 8 }, (_, i) => 40_000 + ((s + i * 31) % 997)).join(',')}`);
    writeFileSync(file, `${lines.join('\n')}\n`);
    const before = await counts();
    const args = ['scripts/bench/ingest-child.ts', file, String(ids!.joint), String(ids!.method), String(ids!.lubricant), String(ids!.operator)];

    const child = spawn(path.join(root, 'node_modules/.bin/tsx'), args, { cwd: root, env: { ...process.env, ...dbEnv } });
    let stderr = '';
    await new Promise<void>((resolve) => {
      child.stderr.on('data', (chunk) => {
        stderr += String(chunk);
        if (stderr.includes('parsed; storing')) resolve();
      });
    });
    await new Promise((resolve) => setTimeout(resolve, 700)); // let the transaction write a good part
    killDb();
    const exitCode = await new Promise<number | null>((resolve) => child.on('exit', resolve));
    expect(exitCode, 'the upload must fail when the database dies under it').not.toBe(0);

    startDb();
    await db.close();
    db = createSequelize(dbEnv.DB_NAME, { port: Number(dbEnv.DB_PORT) });
    expect(await counts()).toEqual(before);
    const [orphans] = await db.query<{ n: number }>('SELECT COUNT(*) AS n FROM readings g LEFT JOIN runs r ON r.id = g.run_id WHERE r.id IS NULL', { type: QueryTypes.SELECT });
    expect(Number(orphans!.n)).toBe(0);

    const retry = JSON.parse(execFileSync(path.join(root, 'node_modules/.bin/tsx'), args, { cwd: root, env: { ...process.env, ...dbEnv }, encoding: 'utf8' }).trim().split('\n').pop() as string) as { runId: number; readings: number };
    expect(retry.readings).toBe(400_000);
    const after = await counts();
    expect(after).toEqual({ runs: before.runs + 1, steps: before.steps + 50_000, readings: before.readings + 400_000 });
    await db.query('DELETE FROM runs WHERE id = ?', { replacements: [retry.runId] });
    rmSync(dir, { recursive: true, force: true });
  });
});
