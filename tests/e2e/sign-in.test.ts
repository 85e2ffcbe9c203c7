import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser } from 'playwright-core';
import type { AppServer } from '../support/app-server';
import { sharedAppServer } from '../support/shared-app-server';
import { launchBrowser, screenshotPath, signedInPage } from '../support/browser';
import { DEMO_ACCOUNTS } from '../support/http-session';

let server: AppServer;
let browser: Browser;

beforeAll(async () => {
  server = sharedAppServer();
  browser = await launchBrowser();
});

afterAll(async () => {
  await browser?.close();
});

const HOME_MARKERS = {
  admin: 'Newest accounts',
  instructor: 'Your cohorts',
  researcher: 'Scatter by method (complete runs)',
  trainee: 'Your runs',
} as const;

describe('signing in through the form in Chromium', () => {
  it('sends a signed-out visitor to the sign-in page', async () => {
    const page = await browser.newPage();
    await page.goto(`${server.baseUrl}/runs`);
    expect(new URL(page.url()).pathname).toBe('/sign-in');
    await page.close();
  });

  it('shows one generic message for a wrong password', async () => {
    const page = await browser.newPage();
    await page.goto(`${server.baseUrl}/sign-in`);
    await page.getByLabel('E-mail').fill(DEMO_ACCOUNTS.researcher);
    await page.getByLabel('Password').fill('definitely-wrong');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await expect.poll(() => page.getByRole('status').textContent(), { timeout: 15_000 }).toContain('do not match an account');
    await page.close();
  });

  for (const role of ['admin', 'instructor', 'researcher', 'trainee'] as const) {
    it(`signs in as ${role}, sees the ${role} home and the runs table`, async () => {
      const page = await signedInPage(browser, server.baseUrl, role, { viewport: { width: 1280, height: 900 } });
      await page.getByRole('heading', { name: HOME_MARKERS[role], exact: true }).waitFor();
      await page.screenshot({ path: screenshotPath(`home-${role}`), fullPage: true });
      await page.getByRole('link', { name: 'Runs', exact: true }).click();
      await page.waitForURL(`${server.baseUrl}/runs`);
      await expect.poll(() => page.locator('tbody tr').count(), { timeout: 15_000 }).toBeGreaterThan(0);
      await page.screenshot({ path: screenshotPath(`runs-${role}`), fullPage: true });
      await page.context().close();
    });
  }
});
