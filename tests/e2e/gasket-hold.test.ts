import { QueryTypes } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { sequelize } from '@/lib/platform/db';
import { startAppServer, type AppServer } from '../support/app-server';
import { launchBrowser, screenshotPath, signInThroughForm } from '../support/browser';
import { DEMO_ACCOUNTS } from '../support/http-session';

// A measured demo run on a joint with gasket data (the demo seed gives both demo joints a contact ring):
// the report shows gasket stress after each pass; an instructor types hold readings and the report shows
// relaxation per stud with its chart. Screenshots go to test-results/screenshots for the note.
let server: AppServer;
let browser: Browser;
let runId: number;
let studCount: number;
let finalKn: number[];

beforeAll(async () => {
  server = await startAppServer();
  browser = await launchBrowser();
  const [run] = await sequelize.query<{ id: number; stud_count: number; final_loads_json: string }>(
    `SELECT r.id, r.stud_count, r.final_loads_json FROM runs r JOIN joints j ON j.id = r.joint_id JOIN cohorts c ON c.id = r.cohort_id JOIN users i ON i.id = c.instructor_id
     WHERE i.email = ? AND j.gasket_outer_mm IS NOT NULL AND r.pass_count > 1 AND r.source <> 'simulated' ORDER BY r.id LIMIT 1`,
    { type: QueryTypes.SELECT, replacements: [DEMO_ACCOUNTS.instructor] },
  );
  runId = run!.id;
  studCount = run!.stud_count;
  finalKn = (JSON.parse(run!.final_loads_json) as number[]).map((n) => n / 1000);
  await sequelize.query('DELETE FROM run_holds WHERE run_id = ?', { replacements: [runId] });
});

afterAll(async () => {
  await sequelize.query('DELETE FROM run_holds WHERE run_id = ?', { replacements: [runId] });
  await browser?.close();
  await server?.stop();
  await sequelize.close();
});

async function signedIn(role: keyof typeof DEMO_ACCOUNTS): Promise<Page> {
  const page = await (await browser.newContext({ viewport: { width: 1366, height: 900 } })).newPage();
  await signInThroughForm(page, server.baseUrl, DEMO_ACCOUNTS[role]);
  return page;
}

describe('gasket stress and hold readings on the run report', () => {
  it('shows the average gasket stress after each pass and per position against the limits', async () => {
    const page = await signedIn('instructor');
    await page.goto(`${server.baseUrl}/runs/${runId}`);
    const section = page.locator('section', { has: page.getByRole('heading', { name: 'Gasket stress' }) });
    await section.waitFor();
    expect(await section.locator('tbody tr').count()).toBeGreaterThan(1);
    await expect.poll(() => section.getByTestId('gasket-final-positions').locator('li').count()).toBe(studCount);
    expect(await section.textContent()).toMatch(/Limits: seating 69(\.0)?\s?MPa, maximum 207\s?MPa \(training default: set your own\)/);
    await section.screenshot({ path: screenshotPath('gasket-stress-report') });
  });

  it('takes typed hold readings and shows relaxation per stud with its chart', async () => {
    const page = await signedIn('instructor');
    await page.goto(`${server.baseUrl}/runs/${runId}`);
    const header = `elapsed,${Array.from({ length: studCount }, (_, i) => i + 1).join(',')}`;
    // Each stud keeps a share of its final load (invented hold readings: 100 %, 98.5 %, 97.5 %, 97 %, less for even studs).
    const row = (time: string, kept: number) => `${time},${finalKn.map((kN, i) => (kN * (kept - (i % 2) * 0.004)).toFixed(2)).join(',')}`;
    await page.getByRole('form', { name: 'Add hold readings' }).locator('textarea[name="holdText"]').fill([header, row('0', 1), row('10 min', 0.985), row('1 h', 0.975), row('4 h', 0.97)].join('\n'));
    await page.getByRole('button', { name: 'Save hold readings' }).click();
    await page.getByText('4 hold times saved.').waitFor();
    const section = page.locator('section', { has: page.getByRole('heading', { name: 'Hold and relaxation' }) });
    await expect.poll(() => section.locator('table').first().locator('tbody tr').count()).toBe(4);
    await section.locator('figure svg').first().waitFor();
    expect(await section.textContent()).toContain('Relaxation during the hold after pass');
    await section.screenshot({ path: screenshotPath('hold-relaxation-report') });
  });
});
