import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import type { AppServer } from '../support/app-server';
import { sharedAppServer } from '../support/shared-app-server';
import { launchBrowser, screenshotPath, signedInPage } from '../support/browser';

let server: AppServer;
let browser: Browser;

beforeAll(async () => {
  server = sharedAppServer();
  browser = await launchBrowser();
});

afterAll(async () => {
  await browser?.close();
});

// The term that starts with the label (the gasket section has terms such as "… at the target preload" too).
const row = (page: Page, label: string) => page.locator('dt').filter({ hasText: new RegExp(`^\\s*${label.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')}`) }).first().locator('xpath=following-sibling::dd[1]');
const numberIn = (text: string | null) => Number((text ?? '').replace(/[^0-9.]/g, ''));

// The page opens on a 3/4-10 UNC ASTM A193 B7 stud at 50 % of yield with K = 0.20, the worked check
// in docs/REFERENCE.md §3: F = 0.5 × 105 ksi × As and T = K·D·F/12 ≈ 219 ft-lb (short form, common practice).
// With As from the ASME B1.1 formula (0.3345 in², the table gives 0.334 ✓ [EE-AREA]) the force is
// 0.5 × 105,000 × 0.33446 = 17,559 lbf = 78.1 kN, and the torque 0.2 × 0.75 × 17,559 / 12 = 219.5 ft-lb
// = 297.6 N·m (computed).
describe('the calculator in Chromium, in both unit systems', () => {
  it('computes the worked 3/4-10 B7 example in SI, then in US customary units after switching', async () => {
    const page = await signedInPage(browser, server.baseUrl, 'trainee', { viewport: { width: 1280, height: 1000 } });
    await page.getByRole('link', { name: 'Calculator' }).click();
    await page.getByRole('heading', { name: 'Preload and torque calculator' }).waitFor();

    const siForce = await row(page, 'Target preload').textContent();
    expect(siForce).toMatch(/kN/);
    expect(Math.abs(numberIn(siForce) - 78.1) / 78.1).toBeLessThan(0.005);
    const siTorque = await row(page, 'Torque, short form').textContent();
    expect(siTorque).toMatch(/N·m/);
    expect(Math.abs(numberIn(siTorque) - 297.6) / 297.6).toBeLessThan(0.005);
    await page.screenshot({ path: screenshotPath('calculator-si'), fullPage: true });

    await page.getByLabel('US customary (in, lbf, ksi, ft-lb)').check();
    await expect.poll(async () => (await row(page, 'Target preload').textContent()) ?? '').toMatch(/lbf/);
    const usForce = numberIn(await row(page, 'Target preload').textContent());
    expect(Math.abs(usForce - 17_559) / 17_559).toBeLessThan(0.002);
    const usTorque = await row(page, 'Torque, short form').textContent();
    expect(usTorque).toMatch(/ft-lb/);
    expect(Math.abs(numberIn(usTorque) - 219.5) / 219.5).toBeLessThan(0.005);
    await expect.poll(() => page.getByText('Caution', { exact: false }).count()).toBeGreaterThan(0);
    await page.screenshot({ path: screenshotPath('calculator-us'), fullPage: true });
    await page.context().close();
  });
});
