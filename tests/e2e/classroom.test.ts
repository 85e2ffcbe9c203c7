import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { sequelize } from '@/lib/platform/db';
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
  await sequelize.close();
});

describe('the classroom in Chromium', () => {
  it('sends a trainee away from /classroom and shows no Classroom link', async () => {
    const page = await signedInPage(browser, server.baseUrl, 'trainee');
    expect(await page.getByRole('link', { name: 'Classroom', exact: true }).count()).toBe(0);
    await page.goto(`${server.baseUrl}/classroom`);
    await page.waitForURL(/notice=not-allowed/);
    await page.context().close();
  });

  it('lets an instructor pick a scene and step through it with the keyboard to the figures and the reading', async () => {
    const page = await signedInPage(browser, server.baseUrl, 'instructor', { viewport: { width: 1280, height: 720 } });
    await page.getByRole('link', { name: 'Classroom', exact: true }).click();
    await page.waitForURL(`${server.baseUrl}/classroom`);
    // Reorder: move "Cross or circle" to the top; the order lands in the URL.
    await page.getByRole('button', { name: 'Move Cross or circle up' }).click();
    await page.waitForURL(/scenes=pattern%2Cpasses|scenes=pattern,passes/);
    await page.screenshot({ path: screenshotPath('classroom-picker') });
    await page.getByRole('button', { name: 'Start here' }).nth(1).click(); // "One pass or several", now second
    await page.getByRole('heading', { name: 'One pass or several', level: 1 }).waitFor();
    for (let i = 0; i < 4; i += 1) await page.keyboard.press('Space');
    await page.getByText('step 4 of 32').waitFor();
    await page.keyboard.press('ArrowLeft');
    await page.getByText('step 3 of 32').waitFor();
    const statuses = await page.getByTestId('side-status').allTextContents();
    expect(statuses[0]).toMatch(/^Stud \d tightened, pass 1$/);
    await page.screenshot({ path: screenshotPath('classroom-mid') });
    await page.keyboard.press('?');
    await page.getByRole('dialog', { name: 'Keys' }).waitFor();
    await page.keyboard.press('Escape');
    await page.keyboard.press('End');
    await page.getByTestId('end-figures').waitFor();
    await page.getByText('over 30 simulated runs each').first().waitFor();
    const reading = await page.getByTestId('reading').innerText();
    expect(reading).toMatch(/Within-run scatter differs between these methods at the 5 % level/);
    expect(reading).toMatch(/Run CV differs between these methods/);
    expect(await page.getByRole('rowheader', { name: 'CV' }).count()).toBe(1);
    await page.screenshot({ path: screenshotPath('classroom-end') });
    await page.setViewportSize({ width: 1920, height: 1080 });
    await page.screenshot({ path: screenshotPath('classroom-end-1080') });
    // Save the scene's runs to the instructor's cohort and follow the link to Compare.
    await page.getByRole('button', { name: 'Save to cohort' }).click();
    await page.getByText(/Saved 60 simulated runs/).waitFor({ timeout: 30_000 });
    const href = await page.getByRole('link', { name: 'Compare them' }).getAttribute('href');
    expect(href).toMatch(/^\/compare\?by=method&ids=\d+,\d+&jointId=\d+/);
    await page.keyboard.press('Home');
    await page.getByText('all studs snug, nothing tightened yet').waitFor();
    await page.keyboard.press('n');
    await page.getByRole('heading', { name: 'Dry or lubricated', level: 1 }).waitFor();
    await page.context().close();
  });
});
