import type { TestProject } from 'vitest/node';
import { launchAppServer, type AppServer } from './app-server';

/**
 * vitest globalSetup of the integration and e2e projects: one app server (`next start` through scripts/serve.ts, default
 * settings, on EVENLOAD_TEST_PORT) for the whole run, handed to the files with `provide` (read it with `sharedAppServer()`
 * or `startAppServer()`). Each project's global set-up runs in its own module scope, so the server is kept on `globalThis`
 * with a count of the projects using it; the last teardown stops it. MariaDB and the mail fake are started once by the
 * test command (scripts/test.sh) before vitest.
 */
interface Shared {
  server: Promise<AppServer>;
  users: number;
}
const KEY = Symbol.for('evenload.sharedAppServer');
const registry = globalThis as unknown as Record<symbol, Shared | undefined>;

export default async function setup(project: TestProject): Promise<() => Promise<void>> {
  const shared = (registry[KEY] ??= { server: launchAppServer(Number(process.env.EVENLOAD_TEST_PORT ?? 3100)), users: 0 });
  shared.users += 1;
  const server = await shared.server;
  project.provide('sharedAppServer', { baseUrl: server.baseUrl, pid: server.pid });
  return async () => {
    shared.users -= 1;
    if (shared.users > 0) return;
    registry[KEY] = undefined;
    await server.stop();
  };
}
