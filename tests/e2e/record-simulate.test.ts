import { QueryTypes } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { sequelize } from '@/lib/platform/db';
import { startAppServer, type AppServer } from '../support/app-server';
import { launchBrowser, screenshotPath, signInThroughForm } from '../support/browser';
import { DEMO_ACCOUNTS } from '../support/http-session';

let server: AppServer;
let browser: Browser;
let savedRun: number | null = null;

beforeAll(async () => {
  server = await startAppServer();
  browser = await launchBrowser();
});

afterAll(async () => {
  if (savedRun) await sequelize.query('DELETE FROM runs WHERE id = ?', { replacements: [savedRun] });
  await browser?.close();
  await server?.stop();
  await sequelize.close();
});

describe('Simulate on the record page', () => {
  it('lets a trainee simulate a run, save it, and open its report', async () => {
    const page = await browser.newPage({ viewport: { width: 1280, height: 900 } });
    await signInThroughForm(page, server.baseUrl, DEMO_ACCOUNTS.trainee);
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
    // Issue 15 item 6: the same request again stores nothing and says which run holds it, with its link.
    await page.getByRole('button', { name: 'Simulate and save' }).click();
    await page.getByText(`This simulation (same header, gasket and seed) is already stored as run ${savedRun}; it was not stored again. Change the seed for another run.`).waitFor();
    const [stored] = await sequelize.query<{ n: number }>("SELECT COUNT(*) AS n FROM runs WHERE source = 'simulated' AND simulation_key = (SELECT simulation_key FROM runs WHERE id = ?)", { type: QueryTypes.SELECT, replacements: [savedRun] });
    expect(Number(stored!.n)).toBe(1);
    await page.getByRole('link', { name: `Open run ${savedRun}` }).click();
    await page.getByRole('heading', { name: 'How even were your final loads?' }).waitFor();
    await page.close();
  });
});
