import { QueryTypes } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { sequelize } from '@/lib/platform/db';
import { createCohort } from '@/lib/data/cohorts';
import { jointTarget, storeFixtureRun } from '../integration/run-fixture';
import { demoPeople } from '../integration/support';
import { startAppServer, type AppServer } from '../support/app-server';
import { launchBrowser, screenshotPath, signInThroughForm } from '../support/browser';
import { DEMO_ACCOUNTS } from '../support/http-session';

// Issue 17 in Chromium: a run the trainee recorded shows as practice with its source; the instructor
// confirms it, sets it aside with a reason and restores it; the history shows each step; print hides the controls.
let server: AppServer;
let browser: Browser;
let cohortId = 0;
let runId = 0;

beforeAll(async () => {
  const people = await demoPeople();
  cohortId = await createCohort(people.instructor, { name: `Attempt e2e ${Date.now().toString(36)}`, site: 'Test bay (invented)', startsOn: '2026-12-01', endsOn: '2026-12-05' });
  const target = await jointTarget();
  runId = await storeFixtureRun({ operatorId: people.trainee.id, cohortId, finalLoadsN: Array.from({ length: 8 }, () => target), source: 'upload', recordedById: people.trainee.id });
  server = await startAppServer();
  browser = await launchBrowser();
});

afterAll(async () => {
  await browser?.close();
  await server?.stop();
  await sequelize.query("DELETE FROM audit_log WHERE object_type = 'run' AND object_id = ?", { replacements: [runId] });
  await sequelize.query('DELETE FROM runs WHERE cohort_id = ?', { replacements: [cohortId] });
  await sequelize.query('DELETE FROM cohorts WHERE id = ?', { replacements: [cohortId] });
  await sequelize.close();
});

describe('a run as an attempt, in the browser', () => {
  it('practice until confirmed, then set aside and restored with reasons, each in the history', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const page = await context.newPage();
    await signInThroughForm(page, server.baseUrl, DEMO_ACCOUNTS.instructor);
    await page.goto(`${server.baseUrl}/runs/${runId}`);
    await page.getByText(/Logger file uploaded by .+/).first().waitFor();
    await page.getByText('Practice', { exact: false }).first().waitFor();

    await page.getByRole('button', { name: /I witnessed this run/ }).click();
    await page.getByText('Confirmed as a witnessed attempt').waitFor({ timeout: 15_000 });
    await page.getByText(/confirmed as witnessed by/).first().waitFor();

    await page.getByLabel('Reason for setting this run aside').fill('Load cell 3 out of calibration');
    await page.getByRole('button', { name: 'Set aside', exact: true }).click();
    await page.getByLabel('Reason for restoring this run').waitFor({ timeout: 15_000 });
    await page.getByText('Reason: Load cell 3 out of calibration').waitFor();
    const [row] = await sequelize.query<{ status: string }>('SELECT status FROM runs WHERE id = ?', { type: QueryTypes.SELECT, replacements: [runId] });
    expect(row!.status).toBe('set_aside');

    await page.getByLabel('Reason for restoring this run').fill('Calibration checked again: fine');
    await page.getByRole('button', { name: 'Restore', exact: true }).click();
    await page.getByText('Reason: Calibration checked again: fine').waitFor({ timeout: 15_000 });
    expect(await page.getByRole('listitem').filter({ hasText: /^(Confirmed as a witnessed attempt|Set aside|Restored) by/ }).count()).toBe(3);

    // Printed: the controls go, the signature lines come.
    await page.emulateMedia({ media: 'print' });
    expect(await page.getByRole('button', { name: 'Print sheet' }).isVisible()).toBe(false);
    expect(await page.getByText('Show the numbers').first().isVisible()).toBe(false);
    expect(await page.getByText('Instructor: name and signature').isVisible()).toBe(true);
    await page.screenshot({ path: screenshotPath('run-attempt-print.png'), fullPage: true });
    await context.close();
  });
});
