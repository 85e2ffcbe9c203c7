import { QueryTypes } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { sequelize } from '@/lib/platform/db';
import type { AppServer } from '../support/app-server';
import { sharedAppServer } from '../support/shared-app-server';
import { launchBrowser, screenshotPath, signedInPage } from '../support/browser';
import { DEMO_ACCOUNTS } from '../support/http-session';

let server: AppServer;
let browser: Browser;
let savedRun: number | null = null;

beforeAll(async () => {
  server = sharedAppServer();
  browser = await launchBrowser();
});

afterAll(async () => {
  if (savedRun) await sequelize.query('DELETE FROM runs WHERE id = ?', { replacements: [savedRun] });
  await browser?.close();
  await sequelize.close();
});

describe('Simulate on the record page', () => {
  it('lets a trainee simulate a run, save it, and open its report', async () => {
    const page = await signedInPage(browser, server.baseUrl, 'trainee', { viewport: { width: 1280, height: 900 } });
    await page.goto(`${server.baseUrl}/record`);
    await page.getByRole('tab', { name: 'Simulate' }).click();
    await page.getByLabel('Seed').fill('31415');
    await page.getByRole('button', { name: 'Simulate and save' }).click();
    const message = page.getByText(/Simulated and saved run \d+/);
    await message.waitFor();
    savedRun = Number(((await message.textContent()) ?? '').match(/run (\d+)/)?.[1]);
    const [row] = await sequelize.query<{ source: string; email: string }>('SELECT r.source, u.email FROM runs r JOIN users u ON u.id = r.operator_id WHERE r.id = ?', { type: QueryTypes.SELECT, replacements: [savedRun] });
    expect(row).toEqual({ source: 'simulated', email: DEMO_ACCOUNTS.trainee });
    await page.screenshot({ path: screenshotPath('record-simulate'), fullPage: true });
    await page.getByRole('link', { name: `Open run ${savedRun}` }).click();
    await page.getByRole('heading', { name: 'How even were your final loads?' }).waitFor();
    await page.context().close();
  });
});
