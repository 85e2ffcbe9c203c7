import { mkdirSync } from 'node:fs';
import path from 'node:path';
import { chromium, type Browser, type BrowserContextOptions, type LaunchOptions, type Page } from 'playwright-core';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from './http-session';

export const SCREENSHOT_DIR = path.resolve(__dirname, '../../test-results/screenshots');

/** Debian's Chromium, headless, with the flags this machine's closed network needs. */
export const CHROMIUM_OPTIONS: LaunchOptions = {
  executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
  headless: true,
  args: ['--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
};

/**
 * The browser for a test file: in the e2e project a connection to the one Chromium its global set-up launched
 * (tests/support/global-browser.ts; `close()` then closes this file's pages and disconnects), elsewhere a Chromium of
 * its own.
 */
export async function launchBrowser(): Promise<Browser> {
  mkdirSync(SCREENSHOT_DIR, { recursive: true });
  const endpoint = process.env.VITEST_WORKER_ID ? (await import('./shared-app-server')).sharedBrowserEndpointIfAny() : undefined;
  return endpoint ? chromium.connect(endpoint) : chromium.launch(CHROMIUM_OPTIONS);
}

export async function signInThroughForm(page: Page, baseUrl: string, email: string, password = DEMO_PASSWORD): Promise<void> {
  await page.goto(`${baseUrl}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL(`${baseUrl}/`);
}

/** Who signs in: a demo role, or an account with its password. */
export type Account = keyof typeof DEMO_ACCOUNTS | { email: string; password: string };

/** Options of the context (viewport, …) and a hook that sees the page before it signs in (e.g. to listen to its console). */
export type SignedInPageOptions = BrowserContextOptions & { beforeSignIn?: (page: Page) => void };

/**
 * The e2e tests' signed-in page: a page in a browser context of its own, signed in through the sign-in form and standing
 * on the home page. Close it with `page.context().close()`.
 */
export async function signedInPage(browser: Browser, baseUrl: string, who: Account, { beforeSignIn, ...options }: SignedInPageOptions = {}): Promise<Page> {
  const { email, password } = typeof who === 'string' ? { email: DEMO_ACCOUNTS[who], password: DEMO_PASSWORD } : who;
  const context = await browser.newContext(options);
  const page = await context.newPage();
  beforeSignIn?.(page);
  await signInThroughForm(page, baseUrl, email, password);
  return page;
}

export function screenshotPath(name: string): string {
  return path.join(SCREENSHOT_DIR, `${name}.png`);
}
