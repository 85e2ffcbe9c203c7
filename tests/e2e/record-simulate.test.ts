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
  // Other files open Record expecting the first way in (Upload): forget what this file chose.
  await sequelize.query('DELETE p FROM user_preferences p JOIN users u ON u.id = p.user_id WHERE u.email = ?', { replacements: [DEMO_ACCOUNTS.trainee] });
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
    // Saved: the button stays off until something changes (the same seed would store the same run again).
    const saved = page.getByRole('button', { name: /^Saved/ });
    expect(await saved.isDisabled()).toBe(true);
    await page.getByLabel('Seed').fill('31416');
    expect(await page.getByRole('button', { name: 'Simulate and save' }).isEnabled()).toBe(true);
    await page.getByLabel('Seed').fill('31415');
    await page.screenshot({ path: screenshotPath('record-simulate'), fullPage: true });
    // Issue 15 item 6: the same request again (a fresh page, so the form does not know it was saved)
    // stores nothing and says which run holds it, with its link.
    await page.reload();
    await page.getByRole('tab', { name: 'Simulate' }).click();
    await page.getByLabel('Seed').fill('31415');
    await page.getByRole('button', { name: 'Simulate and save' }).click();
    await page.getByText(`This simulation (same header, gasket and seed) is already stored as run ${savedRun}; it was not stored again. Change the seed for another run.`).waitFor();
    const [stored] = await sequelize.query<{ n: number }>("SELECT COUNT(*) AS n FROM runs WHERE source = 'simulated' AND simulation_key = (SELECT simulation_key FROM runs WHERE id = ?)", { type: QueryTypes.SELECT, replacements: [savedRun] });
    expect(Number(stored!.n)).toBe(1);
    await page.getByRole('link', { name: `Open run ${savedRun}` }).click();
    await page.getByRole('heading', { name: 'How even were your final loads?' }).waitFor();
    await page.context().close();
  });

  it('opens Record on the way in the person chose last, in another browser too (remembered on the server)', async () => {
    const page = await signedInPage(browser, server.baseUrl, 'trainee', { viewport: { width: 1280, height: 900 } });
    const context = page.context();
    await page.goto(`${server.baseUrl}/record`);
    expect(await page.getByRole('tab', { name: 'Simulate' }).getAttribute('aria-selected')).toBe('true');
    await page.getByRole('tab', { name: 'Enter by hand' }).click();
    await expect.poll(async () => (await sequelize.query<{ w: string }>(
      'SELECT p.record_way_in AS w FROM user_preferences p JOIN users u ON u.id = p.user_id WHERE u.email = ?', { type: QueryTypes.SELECT, replacements: [DEMO_ACCOUNTS.trainee] },
    ))[0]?.w, { timeout: 10_000 }).toBe('manual');
    await page.reload();
    expect(await page.getByRole('tab', { name: 'Enter by hand' }).getAttribute('aria-selected')).toBe('true');
    await context.close();
  });
});
