import { defineConfig } from 'vitest/config';
import react from '@vitejs/plugin-react';
import path from 'node:path';

const alias = { '@': path.resolve(import.meta.dirname), 'server-only': path.resolve(import.meta.dirname, 'tests/support/server-only-stub.ts') };

// Five projects: pure units (node), components (jsdom), integration against the real MariaDB
// the test command starts, faults (a MariaDB of their own) and end-to-end against the built app in
// Debian's Chromium. Integration and e2e share one app server for the run (global-app-server.ts);
// e2e also shares one Chromium (global-browser.ts).
const sharedServer = 'tests/support/global-app-server.ts';
export default defineConfig({
  test: {
    projects: [
      {
        resolve: { alias },
        test: { name: 'unit', environment: 'node', include: ['tests/{stats,lib,charts,ingest,calc,sim}/**/*.test.ts'] },
      },
      {
        plugins: [react()],
        resolve: { alias },
        test: {
          name: 'component',
          environment: 'jsdom',
          include: ['tests/components/**/*.test.tsx'],
          setupFiles: ['tests/support/component-setup.ts'],
          // jsdom renders of Plot charts take seconds on a busy 2-core machine; not a speed check.
          testTimeout: 30_000,
        },
      },
      {
        resolve: { alias },
        test: {
          name: 'integration',
          environment: 'node',
          include: ['tests/{integration,api}/**/*.test.ts'],
          globalSetup: [sharedServer],
          fileParallelism: false,
          testTimeout: 60_000,
          hookTimeout: 180_000,
        },
      },
      {
        resolve: { alias },
        test: {
          name: 'faults',
          environment: 'node',
          include: ['tests/faults/**/*.test.ts'],
          fileParallelism: false,
          testTimeout: 180_000,
          hookTimeout: 180_000,
        },
      },
      {
        resolve: { alias },
        test: {
          name: 'e2e',
          environment: 'node',
          include: ['tests/e2e/**/*.test.ts'],
          globalSetup: [sharedServer, 'tests/support/global-browser.ts'],
          fileParallelism: false,
          testTimeout: 120_000,
          hookTimeout: 180_000,
        },
      },
    ],
  },
});
