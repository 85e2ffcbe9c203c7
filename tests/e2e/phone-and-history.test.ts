import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { sequelize } from '@/lib/platform/db';
import { startAppServer, type AppServer } from '../support/app-server';
import { launchBrowser, screenshotPath, signInThroughForm } from '../support/browser';
import { DEMO_ACCOUNTS } from '../support/http-session';

/** The first week on a phone (390 px) and a laptop: the header, the home cohort table, the runs table in the history. */
let server: AppServer;
let browser: Browser;

beforeAll(async () => {
  server = await startAppServer();
  browser = await launchBrowser();
});

afterAll(async () => {
  await browser?.close();
  await server?.stop();
  await sequelize.close();
});

async function openAs(role: keyof typeof DEMO_ACCOUNTS, width: number): Promise<Page> {
  const context = await browser.newContext({ viewport: { width, height: 844 } });
  const page = await context.newPage();
  await signInThroughForm(page, server.baseUrl, DEMO_ACCOUNTS[role]);
  return page;
}

describe('on a phone (390 px wide)', () => {
  it('keeps the header to one line (at most 64 px) with the links behind a Menu button', async () => {
    for (const role of ['instructor', 'researcher', 'trainee', 'admin'] as const) {
      const page = await openAs(role, 390);
      // Home fits the phone: its tables scroll inside their panels instead of widening the page.
      expect(await page.evaluate(() => document.documentElement.scrollWidth), `${role}: home page width`).toBeLessThanOrEqual(390);
      const header = page.locator('body header').first();
      const height = (await header.boundingBox())!.height;
      expect(height, `${role}: header height`).toBeLessThanOrEqual(64);
      const runsLink = page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Runs' });
      expect(await runsLink.isVisible()).toBe(false);
      await page.getByRole('button', { name: /^Menu/ }).click();
      await runsLink.click();
      await page.waitForURL(`${server.baseUrl}/runs`);
      // The menu closes after the move; the header is compact again.
      await expect.poll(async () => (await header.boundingBox())!.height).toBeLessThanOrEqual(64);
      await page.context().close();
    }
  });

  it('keeps the home cohort table headers apart ("Trainees" and "Runs" never touch)', async () => {
    const page = await openAs('instructor', 390);
    const table = page.getByRole('region', { name: 'Your cohorts' }).locator('table');
    const trainees = await table.getByRole('columnheader', { name: 'Trainees' }).evaluate((th) => {
      const range = document.createRange();
      range.selectNodeContents(th);
      return range.getBoundingClientRect().right;
    });
    const runsLeft = await table.getByRole('columnheader', { name: 'Runs' }).evaluate((th) => {
      const range = document.createRange();
      range.selectNodeContents(th);
      return range.getBoundingClientRect().left;
    });
    expect(runsLeft - trainees).toBeGreaterThanOrEqual(8);
    await page.screenshot({ path: screenshotPath('home-phone'), fullPage: true });
    await page.context().close();
  });

  it('folds the runs filters behind a button; a filter in use shows as a chip', async () => {
    const page = await openAs('researcher', 390);
    await page.goto(`${server.baseUrl}/runs`);
    await page.getByText(/^\d+ runs?/).waitFor();
    const form = page.getByRole('form', { name: 'Filters' });
    expect(await form.isVisible()).toBe(false);
    await page.getByRole('button', { name: /^Filters/ }).click();
    const method = page.getByLabel('Method');
    const first = await method.locator('option').nth(1).textContent();
    await method.selectOption({ index: 1 });
    await page.getByRole('button', { name: `Remove filter Method: ${first}` }).waitFor();
    await page.context().close();
  });
});

describe('the runs table at 1280 px', () => {
  it('puts filters and pages in the history (Back returns to them) and opens a report from a row by mouse or Enter', async () => {
    const page = await openAs('researcher', 1280);
    await page.goto(`${server.baseUrl}/runs`);
    await page.getByText(/^\d+ runs?/).waitFor();
    await page.getByRole('button', { name: 'Next' }).click();
    await page.waitForURL(/page=2/);
    await page.getByLabel('Method').selectOption({ index: 1 });
    await page.waitForURL(/methodId=/);
    await page.goBack();
    await page.waitForURL((url) => url.search === '?page=2');
    await page.goBack();
    await page.waitForURL(`${server.baseUrl}/runs`);
    // A sortable header says it can sort before it is active.
    expect(await page.getByRole('columnheader', { name: /CV/ }).getAttribute('aria-sort')).toBe('none');
    // Click a cell that is not the link: the row opens the report.
    const row = page.locator('tbody tr').first();
    const href = await row.getByRole('link').getAttribute('href');
    await row.locator('td').nth(3).click();
    await page.waitForURL(`${server.baseUrl}${href}`);
    await page.goBack();
    await page.locator('tbody tr').first().focus();
    await page.keyboard.press('Enter');
    await page.waitForURL(`${server.baseUrl}${href}`);
    await page.context().close();
  });
});
