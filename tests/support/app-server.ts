import { spawn, type ChildProcess } from 'node:child_process';
import { appendFileSync, createWriteStream } from 'node:fs';
import { createServer } from 'node:net';
import path from 'node:path';

const root = path.resolve(__dirname, '../..');

export interface AppServer {
  baseUrl: string;
  /** Process id of `next start` (the server process, for memory readings in the bench). */
  pid: number;
  stop: () => Promise<void>;
}

/**
 * The app server a test file should use. Inside the integration and e2e projects the one server their global set-up
 * (tests/support/global-app-server.ts) started for the whole run is returned, with a `stop` that leaves it running,
 * unless the file asks for settings of its own (`extraEnv`) or a port other than the shared one: then a server of its
 * own is started, on a free port when none is given. Outside vitest (the bench) it always starts a server.
 */
export async function startAppServer(port?: number, extraEnv: Record<string, string> = {}): Promise<AppServer> {
  const shared = await sharedServerOfThisRun();
  if (!shared) return launchAppServer(port ?? Number(process.env.EVENLOAD_TEST_PORT ?? 3100), extraEnv);
  const sharedPort = Number(new URL(shared.baseUrl).port);
  if (port !== undefined && port !== sharedPort) return launchAppServer(port, extraEnv);
  if (Object.keys(extraEnv).length === 0) return shared;
  return launchAppServer(await freePort(), extraEnv);
}

/** The run's shared server, when this code runs in a vitest worker of a project with the shared-server global set-up. */
async function sharedServerOfThisRun(): Promise<AppServer | undefined> {
  if (!process.env.VITEST_WORKER_ID) return undefined;
  const { sharedAppServerIfAny } = await import('./shared-app-server');
  return sharedAppServerIfAny();
}

/** A port the system has free right now (asked of the OS with port 0). */
async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const probe = createServer();
    probe.once('error', reject);
    probe.listen(0, '127.0.0.1', () => {
      const address = probe.address();
      probe.close(() => (typeof address === 'object' && address ? resolve(address.port) : reject(new Error('no free port'))));
    });
  });
}

/**
 * Starts the built app (through scripts/serve.ts, as `npm start` does) against the test database on the given port and
 * waits until /api/health answers. The test command builds the app first.
 */
export async function launchAppServer(port: number, extraEnv: Record<string, string> = {}): Promise<AppServer> {
  const baseUrl = `http://127.0.0.1:${port}`;
  // EVENLOAD_SERVER_NODE_FLAGS: node flags for the server (tsx passes them on), e.g. the bench's --cpu-prof.
  const nodeFlags = (extraEnv.EVENLOAD_SERVER_NODE_FLAGS ?? '').split(' ').filter(Boolean);
  const child: ChildProcess = spawn(path.join(root, 'node_modules/.bin/tsx'), [...nodeFlags, 'scripts/serve.ts', '-H', '127.0.0.1', '-p', String(port)], {
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
        // A server writing a CPU profile on exit (--cpu-prof) may need longer than 5 s on a loaded machine.
        setTimeout(() => child.kill('SIGKILL'), nodeFlags.includes('--cpu-prof') ? 60_000 : 5000).unref();
      }),
  };
}
