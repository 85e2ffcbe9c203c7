import { spawn, type ChildProcess } from 'node:child_process';
import { appendFileSync, createWriteStream } from 'node:fs';
import path from 'node:path';

const root = path.resolve(__dirname, '../..');

export interface AppServer {
  baseUrl: string;
  /** Process id of `next start` (the server process, for memory readings in the bench). */
  pid: number;
  stop: () => Promise<void>;
}

/**
 * Starts the built app (through scripts/serve.ts, as `npm start` does) against the test database on its own port and waits until
 * /api/health answers. The test command builds the app first.
 */
export async function startAppServer(port = Number(process.env.EVENLOAD_TEST_PORT ?? 3100), extraEnv: Record<string, string> = {}): Promise<AppServer> {
  const baseUrl = `http://127.0.0.1:${port}`;
  const child: ChildProcess = spawn(path.join(root, 'node_modules/.bin/tsx'), ['scripts/serve.ts', '-H', '127.0.0.1', '-p', String(port)], {
    cwd: root,
    env: { ...process.env, NODE_ENV: 'production', NEXTAUTH_URL: baseUrl, NEXT_TELEMETRY_DISABLED: '1', ...extraEnv },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let output = '';
  child.stdout?.on('data', (chunk) => (output += String(chunk)));
  child.stderr?.on('data', (chunk) => (output += String(chunk)));
  if (process.env.EVENLOAD_TEST_SERVER_LOG) {
    const log = createWriteStream(`${process.env.EVENLOAD_TEST_SERVER_LOG}-${port}.log`);
    child.stdout?.pipe(log);
    child.stderr?.pipe(log);
  }
  const deadline = Date.now() + 150_000;
  while (Date.now() < deadline) {
    if (child.exitCode !== null) throw new Error(`the app server exited early:\n${output}`);
    try {
      const response = await fetch(`${baseUrl}/api/health`);
      if (response.status === 200) break;
    } catch {
      // not listening yet
    }
    await new Promise((resolve) => setTimeout(resolve, 250));
  }
  if (Date.now() >= deadline) throw new Error(`the app did not become healthy within 150 s:\n${output}`);
  return {
    baseUrl,
    pid: child.pid ?? 0,
    stop: () =>
      new Promise<void>((resolve) => {
        // EVENLOAD_SERVER_LOG=file keeps the server's output for debugging a failing test.
        if (process.env.EVENLOAD_SERVER_LOG) appendFileSync(process.env.EVENLOAD_SERVER_LOG, output);
        if (child.exitCode !== null) return resolve();
        child.once('exit', () => resolve());
        child.kill('SIGTERM');
        setTimeout(() => child.kill('SIGKILL'), 5000).unref();
      }),
  };
}
