import { QueryTypes } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { sequelize } from '@/lib/platform/db';
import type { AppServer } from '../support/app-server';
import { sharedAppServer } from '../support/shared-app-server';
import { launchBrowser, screenshotPath, signedInPage } from '../support/browser';
import { DEMO_ACCOUNTS } from '../support/http-session';

let server: AppServer;
let browser: Browser;
let othersRun: number; // a run of another trainee in the demo instructor's cohort
let ownRun: number; // a run of the demo trainee

beforeAll(async () => {
  server = sharedAppServer();
  browser = await launchBrowser();
  const [other] = await sequelize.query<{ id: number }>(
    `SELECT r.id FROM runs r JOIN cohorts c ON c.id = r.cohort_id JOIN users i ON i.id = c.instructor_id JOIN users o ON o.id = r.operator_id
     WHERE i.email = ? AND o.email <> ? AND o.role = 'trainee' AND r.pass_count > 1 ORDER BY r.id LIMIT 1`,
    { type: QueryTypes.SELECT, replacements: [DEMO_ACCOUNTS.instructor, DEMO_ACCOUNTS.trainee] },
  );
  const [own] = await sequelize.query<{ id: number }>('SELECT r.id FROM runs r JOIN users o ON o.id = r.operator_id WHERE o.email = ? ORDER BY r.id LIMIT 1', {
    type: QueryTypes.SELECT,
    replacements: [DEMO_ACCOUNTS.trainee],
  });
  othersRun = other!.id;
  ownRun = own!.id;
});

afterAll(async () => {
  await browser?.close();
  await sequelize.close();
});

/** Console errors about the Content-Security-Policy: the app must work under its own CSP. */
const cspViolations: string[] = [];

async function signedIn(role: keyof typeof DEMO_ACCOUNTS): Promise<Page> {
  return signedInPage(browser, server.baseUrl, role, {
    viewport: { width: 1366, height: 900 },
    beforeSignIn: (page) =>
      page.on('console', (message) => {
        if (/Content Security Policy|Refused to (load|execute|apply|connect)/i.test(message.text())) cspViolations.push(message.text());
      }),
  });
}

describe('run report in Chromium', () => {
  it('shows an instructor the report with flange, charts and figures, and the replay moves the flange', async () => {
    const page = await signedIn('instructor');
    await page.goto(`${server.baseUrl}/runs/${othersRun}`);
    await page.getByRole('heading', { name: 'The figures' }).waitFor();
    await page.locator('figure svg').first().waitFor();
    expect(await page.getByRole('group', { name: /Flange view, final loads/ }).count()).toBe(1);
    await page.getByRole('button', { name: 'First step' }).click();
    await expect.poll(() => page.getByRole('group', { name: /after step 1 of/ }).count()).toBe(1);
    const live = await page.locator('p[aria-live="polite"]').filter({ hasText: 'Step 1 of' }).textContent();
    expect(live).toMatch(/Step 1 of \d+: stud \d+ tightened in pass 1/);
    await page.getByRole('button', { name: 'Next step' }).click();
    await expect.poll(() => page.getByRole('group', { name: /after step 2 of/ }).count()).toBe(1);
    await page.getByRole('button', { name: 'Last step' }).click();
    await page.screenshot({ path: screenshotPath('run-report-instructor'), fullPage: true });
    await page.context().close();
  });

  it('lets a researcher see the report with the operator pseudonymised', async () => {
    const page = await signedIn('researcher');
    await page.goto(`${server.baseUrl}/runs/${othersRun}`);
    await page.getByRole('heading', { name: 'The figures' }).waitFor();
    const operator = await page.locator('dt:text-is("Operator") + dd').textContent();
    expect(operator).toMatch(/^Operator [A-Z2-9]{6}$/);
    await page.context().close();
  });

  it("gives a trainee their own report and a 404 for another trainee's run", async () => {
    const page = await signedIn('trainee');
    await page.goto(`${server.baseUrl}/runs/${ownRun}`);
    await page.getByRole('heading', { name: 'How even were your final loads?' }).waitFor();
    await page.screenshot({ path: screenshotPath('run-report-trainee'), fullPage: true });
    const response = await page.goto(`${server.baseUrl}/runs/${othersRun}`);
    expect(response?.status()).toBe(404);
    await page.getByRole('heading', { name: 'Run not found' }).waitFor();
    await page.context().close();
  });
});

describe('comparison in Chromium', () => {
  it('compares methods for a researcher, with tests and readings, and the choice round-trips through the URL', async () => {
    const page = await signedIn('researcher');
    await page.goto(`${server.baseUrl}/compare?by=method`);
    await page.getByRole('heading', { name: 'Is the difference real?' }).waitFor();
    await expect.poll(() => page.locator('section[aria-labelledby="tests-heading"] li').count()).toBeGreaterThan(2);
    expect(await page.locator('figure svg').count()).toBeGreaterThanOrEqual(2);
    // Drift by position is drawn within one stud count: when the demo mixes them, pick one.
    const pick = page.getByRole('button', { name: /^\d+ studs$/ }).first();
    if (await pick.count()) {
      await pick.click();
      await page.waitForURL(/studCount=\d+/);
    }
    await expect.poll(() => page.locator('figure svg').count()).toBeGreaterThanOrEqual(3);
    await page.getByText(/^To tell a 1\.5× difference in CV apart, plan about \d+ runs per group\.$/).waitFor();
    await page.locator('#compare-by').selectOption('lubricant');
    await page.waitForURL(/by=lubricant/);
    await page.getByRole('heading', { name: 'Nut factor by lubricant' }).waitFor();
    const url = page.url();
    await page.screenshot({ path: screenshotPath('compare-researcher'), fullPage: true });
    const second = await page.context().newPage();
    await second.goto(url);
    await second.getByRole('heading', { name: 'Nut factor by lubricant' }).waitFor();
    expect(await second.locator('#compare-by').inputValue()).toBe('lubricant');
    await page.context().close();
  });

  it('ran every page above without a Content-Security-Policy violation', () => {
    expect(cspViolations).toEqual([]);
  });

  it('keeps trainees out of the comparison', async () => {
    const page = await signedIn('trainee');
    await page.goto(`${server.baseUrl}/compare`);
    await page.waitForURL(`${server.baseUrl}/?notice=not-allowed`);
    await page.getByText('That page is not open to your role').waitFor();
    await page.context().close();
  });
});
