import { chromium } from 'playwright-core';
import type { TestProject } from 'vitest/node';
import { CHROMIUM_OPTIONS } from './browser';

/**
 * vitest globalSetup of the e2e project: one headless Chromium for the run (`launchServer`), handed to the files as its
 * websocket endpoint; `launchBrowser()` connects to it, so a file no longer waits for Chromium to start. Each file still
 * works in browser contexts of its own.
 */
export default async function setup(project: TestProject): Promise<() => Promise<void>> {
  const server = await chromium.launchServer(CHROMIUM_OPTIONS);
  project.provide('sharedBrowserEndpoint', server.wsEndpoint());
  return () => server.close();
}
