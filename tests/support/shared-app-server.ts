import { inject } from 'vitest';
import type { AppServer } from './app-server';

declare module 'vitest' {
  export interface ProvidedContext {
    /** The app server tests/support/global-app-server.ts started once for the run (integration and e2e projects). */
    sharedAppServer?: { baseUrl: string; pid: number };
    /** The Chromium tests/support/global-browser.ts launched once for the run (e2e project). */
    sharedBrowserEndpoint?: string;
  }
}

/** The run's shared server, or undefined in a project without the shared-server global set-up. */
export function sharedAppServerIfAny(): AppServer | undefined {
  const shared = inject('sharedAppServer');
  // The run's global set-up stops it; a file only lets go of it.
  return shared && { ...shared, stop: async () => {} };
}

/**
 * The one app server of the run (default settings, the test database, the tests' mail fake), started by the integration
 * and e2e projects' global set-up. Files that need other settings call `startAppServer(port, extraEnv)` for a server of
 * their own.
 */
export function sharedAppServer(): AppServer {
  const shared = sharedAppServerIfAny();
  if (!shared) throw new Error('no shared app server: this project has no tests/support/global-app-server.ts in its globalSetup');
  return shared;
}

/** The websocket endpoint of the run's shared Chromium, or undefined outside the e2e project. */
export function sharedBrowserEndpointIfAny(): string | undefined {
  return inject('sharedBrowserEndpoint');
}
