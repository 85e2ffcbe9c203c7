import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';

const root = path.resolve(__dirname, '../..');

export interface WorkerProcess {
  id: string;
  /** Every line the worker printed so far. */
  lines: string[];
  /** The ids of the jobs this worker logged as done. */
  doneJobIds: () => number[];
  /** SIGTERM, then its exit code (null when it had to be killed after `graceMs`). */
  stop: (graceMs?: number) => Promise<number | null>;
}

/**
 * Starts scripts/worker.ts as its own process (its own database pool and SMTP connection), as
 * `npm start` does, with the test database of this run and the given settings; resolves once it says
 * it is working the table.
 */
export async function startWorkerProcess(id: string, extraEnv: Record<string, string>, readyMs = 90_000): Promise<WorkerProcess> {
  const child: ChildProcess = spawn(path.join(root, 'node_modules/.bin/tsx'), ['--conditions=react-server', 'scripts/worker.ts'], {
    cwd: root,
    env: { ...process.env, EVENLOAD_WORKER_ID: id, ...extraEnv },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  const lines: string[] = [];
  let buffered = '';
  const take = (chunk: Buffer) => {
    buffered += chunk.toString('utf8');
    const parts = buffered.split('\n');
    buffered = parts.pop() ?? '';
    lines.push(...parts);
  };
  child.stdout!.on('data', take);
  child.stderr!.on('data', take);
  const exited = new Promise<number | null>((resolve) => child.once('exit', (code) => resolve(code)));
  const started = Date.now();
  while (!lines.some((line) => line.includes('working the job table'))) {
    if (child.exitCode !== null) throw new Error(`worker ${id} exited early:\n${lines.join('\n')}`);
    if (Date.now() - started > readyMs) throw new Error(`worker ${id} did not start within ${readyMs} ms:\n${lines.join('\n')}`);
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
  return {
    id,
    lines,
    doneJobIds: () => lines.flatMap((line) => {
      const match = /\] job (\d+) \([a-z_]+\) done$/.exec(line);
      return match ? [Number(match[1])] : [];
    }),
    stop: async (graceMs = 30_000) => {
      if (child.exitCode !== null) return child.exitCode;
      child.kill('SIGTERM');
      const timer = setTimeout(() => child.kill('SIGKILL'), graceMs);
      const code = await exited;
      clearTimeout(timer);
      return code;
    },
  };
}
