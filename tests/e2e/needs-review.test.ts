/**
 * Issue 15 item 5 in Chromium: a run held by the run check shows a "Needs review" badge in the
 * runs list (and the status filter finds it), and its report shows the reasons, the over-yield
 * caution and the confirm form; confirming with a note makes it count. The run: 4 passes of the
 * demo's 8-stud joint stored as "One pass, cross order" with every stud at 210 % of target, above
 * the yield load (the demo targets are 50 % of the B7 minimum yield: lib/demo/demo-library.ts).
 * The screenshot of the report goes to the lead's notes (EVENLOAD_REVIEW_SHOT, or test-results).
 */
import { mkdirSync } from 'node:fs';
import path from 'node:path';
import { QueryTypes } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { sequelize } from '@/lib/platform/db';
import { storeRun } from '@/lib/data/runs/store-run';
import type { NormalisedRun } from '@/lib/record/run-types';
import { startAppServer, type AppServer } from '../support/app-server';
import { launchBrowser, screenshotPath, signInThroughForm } from '../support/browser';
import { DEMO_ACCOUNTS } from '../support/http-session';

let server: AppServer;
let browser: Browser;
let runId: number;

beforeAll(async () => {
  server = await startAppServer();
  browser = await launchBrowser();
  const [row] = await sequelize.query<{ joint: number; target: number; method: number; lubricant: number; trainee: number; cohort: number }>(
    `SELECT j.id AS joint, j.target_load_n AS target, m.id AS method, (SELECT id FROM lubricants ORDER BY id LIMIT 1) AS lubricant, t.id AS trainee, c.id AS cohort
     FROM joints j JOIN methods m ON m.name LIKE 'One pass, cross order%' JOIN users t ON t.email = ? JOIN cohort_members cm ON cm.user_id = t.id
     JOIN cohorts c ON c.id = cm.cohort_id JOIN users i ON i.id = c.instructor_id AND i.email = ?
     WHERE j.stud_count = 8 ORDER BY j.id, c.id LIMIT 1`,
    { type: QueryTypes.SELECT, replacements: [DEMO_ACCOUNTS.trainee, DEMO_ACCOUNTS.instructor] },
  );
  const target = Number(row!.target);
  const cross = [1, 5, 3, 7, 2, 6, 4, 8]; // the 8-stud cross order (common practice)
  const steps: NormalisedRun['steps'] = [];
  [0.3, 0.6, 1, 1].forEach((fraction, p) => {
    for (const position of cross) steps.push({ order: steps.length + 1, pass: p + 1, position, loadsN: new Array<number>(8).fill(2.1 * target * fraction) });
  });
  runId = await sequelize.transaction((transaction) =>
    storeRun(
      {
        jointId: Number(row!.joint), methodId: Number(row!.method), lubricantId: Number(row!.lubricant), operatorId: Number(row!.trainee), cohortId: Number(row!.cohort),
        targetLoadN: target, bandPercent: 10, source: 'manual', status: 'complete', recordedAt: new Date('2031-01-01T09:00:00Z'), notes: 'Invented test run (needs review).',
      },
      { studCount: 8, targetLoadN: target, steps },
      transaction,
    ),
  );
});

afterAll(async () => {
  if (runId) await sequelize.query('DELETE FROM runs WHERE id = ?', { replacements: [runId] });
  await browser?.close();
  await server?.stop();
  await sequelize.close();
});

describe('a run held for review in Chromium', () => {
  it('shows the badge in the runs list, the reasons and confirm form on the report, and counts after confirming', async () => {
    const context = await browser.newContext({ viewport: { width: 1366, height: 1000 } });
    const page = await context.newPage();
    await signInThroughForm(page, server.baseUrl, DEMO_ACCOUNTS.instructor);

    await page.goto(`${server.baseUrl}/runs`);
    await page.getByLabel('Status').selectOption('needs_review');
    const row = page.locator('tbody tr').filter({ has: page.locator(`a[href="/runs/${runId}"]`) });
    // The filter applied: every row listed is one held for review (the table keeps the previous page while it loads).
    await expect.poll(() => page.locator('tbody tr').filter({ hasText: /Complete$/ }).count(), { timeout: 20_000 }).toBe(0);
    await row.waitFor();
    expect(await row.locator('span', { hasText: 'Needs review' }).count()).toBe(1);

    await row.locator(`a[href="/runs/${runId}"]`).click();
    await page.getByRole('heading', { name: 'Needs review' }).waitFor();
    const reasons = page.getByRole('list', { name: 'Reasons' });
    expect(await reasons.locator('li').allTextContents()).toEqual([
      expect.stringMatching(/^The run has 4 passes and 32 steps; the method "One pass, cross order.*" prescribes 1 pass and 8 steps for 8 studs\.$/),
      expect.stringMatching(/minimum yield load of .* kN \(ASTM A193, Table 2\); 8 of 8 studs end at or above it\.$/),
      expect.stringMatching(/^Every stud ended above the ±10 % band/),
    ]);
    expect(await page.getByRole('note').filter({ hasText: "Caution: loads above the stud’s yield load." }).count()).toBe(1);
    await page.getByLabel(/^Note/).fill('Gauges checked against the calibration bar; the method was chosen wrongly.');
    const shot = process.env.EVENLOAD_REVIEW_SHOT ?? screenshotPath('needs-review');
    mkdirSync(path.dirname(shot), { recursive: true });
    await page.screenshot({ path: shot, fullPage: false });

    await page.getByRole('button', { name: 'Confirm: the run counts' }).click();
    // The report re-renders as a counted run: the form gives way to who confirmed it, when, and the note.
    await page.getByRole('heading', { name: 'Checked before it counted' }).waitFor({ timeout: 20_000 });
    expect(await page.getByText(/^Confirmed by .+ on .+: “Gauges checked against the calibration bar; the method was chosen wrongly\.”$/).count()).toBe(1);
    expect(await page.getByRole('button', { name: 'Confirm: the run counts' }).count()).toBe(0);
    const [stored] = await sequelize.query<{ status: string; review_note: string }>('SELECT status, review_note FROM runs WHERE id = ?', { type: QueryTypes.SELECT, replacements: [runId] });
    expect(stored).toEqual({ status: 'complete', review_note: 'Gauges checked against the calibration bar; the method was chosen wrongly.' });
    await context.close();
  });
});
