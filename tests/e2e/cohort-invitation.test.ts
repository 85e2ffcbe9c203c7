import { execFileSync } from 'node:child_process';
import { writeFileSync } from 'node:fs';
import { QueryTypes } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, BrowserContext } from 'playwright-core';
import { sequelize } from '@/lib/platform/db';
import { storeFixtureRun } from '../integration/run-fixture';
import { DEFAULT_CHECKLIST } from '@/lib/qualification/course-outcome';
import type { AppServer } from '../support/app-server';
import { sharedAppServer } from '../support/shared-app-server';
import { launchBrowser, screenshotPath, signedInPage, signInThroughForm } from '../support/browser';
import { DEMO_ACCOUNTS } from '../support/http-session';

let server: AppServer;
let browser: Browser;
const stamp = Date.now().toString(36);
const traineeEmail = `new.trainee.${stamp}@test.evenload.test`;
const cohortName = `Flange assembly basics ${stamp}`;
let cohortId = 0;

const count = async (sql: string, replacements: unknown[] = []) =>
  Number((await sequelize.query<{ n: number }>(sql, { type: QueryTypes.SELECT, replacements }))[0]!.n);

async function waitForMail(to: string, subjectPart: string): Promise<string> {
  const deadline = Date.now() + 15_000;
  while (Date.now() < deadline) {
    const rows = await sequelize.query<{ text_body: string; subject: string }>(
      'SELECT text_body, subject FROM captured_mail WHERE FIND_IN_SET(?, envelope_to) ORDER BY id DESC',
      { type: QueryTypes.SELECT, replacements: [to] },
    );
    const hit = rows.find((r) => r.subject.includes(subjectPart));
    if (hit) return hit.text_body;
    await new Promise((resolve) => setTimeout(resolve, 250));
  }
  throw new Error(`no mail to ${to} with "${subjectPart}" in the fake within 15 s`);
}

/** Independent figures from the stored readings (not lib/stats): sample CV and share within ±10 %. */
function figures(loads: number[], target: number) {
  const n = loads.length;
  const mean = loads.reduce((a, b) => a + b, 0) / n;
  const sd = Math.sqrt(loads.reduce((a, b) => a + (b - mean) ** 2, 0) / (n - 1)); // docs/REFERENCE.md §9 ✓ [CV]: s/x̄
  const inBand = loads.filter((l) => Math.abs(l - target) <= 0.1 * target * (1 + 1e-12)).length;
  return { cvPercent: (sd / mean) * 100, sharePercent: (inBand / n) * 100, inBand };
}

const asShown = (percent: number) => `${percent.toPrecision(3)}\u00a0%`;

beforeAll(async () => {
  server = sharedAppServer();
  browser = await launchBrowser();
});

afterAll(async () => {
  await browser?.close();
  if (cohortId) {
    await sequelize.query('DELETE FROM runs WHERE cohort_id = ?', { replacements: [cohortId] });
    await sequelize.query("DELETE FROM sign_in_attempts WHERE attempt_key LIKE 'verify:%'");
    await sequelize.query('DELETE FROM cohorts WHERE id = ?', { replacements: [cohortId] });
  }
  await sequelize.query('DELETE FROM users WHERE email = ?', { replacements: [traineeEmail] });
  await sequelize.close();
});

describe('a cohort invitation from the instructor to a signed result e-mail, in Chromium', () => {
  let instructorContext: BrowserContext;

  it('creates a cohort, refuses a list with a bad address, invites a new trainee', async () => {
    const page = await signedInPage(browser, server.baseUrl, 'instructor', { viewport: { width: 1280, height: 900 } });
    instructorContext = page.context();
    await page.getByRole('link', { name: 'Cohorts', exact: true }).click();
    await page.waitForURL(`${server.baseUrl}/cohorts`);
    await page.getByLabel('Course name').fill(cohortName);
    await page.getByLabel('Site').fill('Brackwater Bolting School, test bay (invented)');
    await page.getByLabel('First day').fill('2026-12-01');
    await page.getByLabel('Last day').fill('2026-12-04');
    await page.getByRole('button', { name: 'Create cohort' }).click();
    await page.waitForURL(/\/cohorts\/\d+$/);
    cohortId = Number(new URL(page.url()).pathname.split('/').pop());
    await page.getByRole('heading', { name: cohortName }).waitFor();

    const users = await count('SELECT COUNT(*) AS n FROM users');
    await page.getByLabel('E-mail addresses').fill(`${traineeEmail}, not-an-address`);
    await page.getByRole('button', { name: 'Send invitations' }).click();
    await expect.poll(() => page.locator('#addresses-error').textContent()).toContain('"not-an-address"');
    expect(await count('SELECT COUNT(*) AS n FROM users')).toBe(users);
    await page.screenshot({ path: screenshotPath('cohort-invite-rejected'), fullPage: true });

    await page.getByLabel('E-mail addresses').fill(traineeEmail);
    await page.getByRole('button', { name: 'Send invitations' }).click();
    await expect.poll(() => page.getByRole('status').filter({ hasText: 'Invited' }).count(), { timeout: 15_000 }).toBe(1);
    await page.getByRole('cell', { name: traineeEmail }).waitFor();
    await page.screenshot({ path: screenshotPath('cohort-invited'), fullPage: true });
  });

  it('the trainee follows the link from the captured mail, sets a password and lands signed in; the link then refuses', async () => {
    const body = await waitForMail(traineeEmail, 'invitation');
    const link = body.match(/https?:\/\/\S+\/welcome\/[A-Za-z0-9_-]{43}/)?.[0];
    expect(link, 'welcome link in the mail').toBeTruthy();
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const page = await context.newPage();
    await page.goto(link!);
    await page.getByRole('heading', { name: 'Welcome to Evenload' }).waitFor();
    expect(await page.getByLabel('Your name').inputValue()).toBe('');
    await page.getByLabel('Your name').fill('Ilse Marrow');
    await page.getByLabel('New password').fill('short');
    await page.getByLabel('Type it again').fill('short');
    await page.getByRole('button', { name: 'Set password and sign in' }).click();
    await expect.poll(() => page.locator('#password-error').textContent()).toContain('at least 10 characters');
    expect(await page.getByLabel('Your name').inputValue(), 'the name survives a refused submit').toBe('Ilse Marrow');
    await page.screenshot({ path: screenshotPath('cohort-welcome-error'), fullPage: true });
    await page.getByLabel('New password').fill('tight in three passes');
    await page.getByLabel('Type it again').fill('tight in three passes');
    await page.getByRole('button', { name: 'Set password and sign in' }).click();
    await page.waitForURL(`${server.baseUrl}/`, { timeout: 20_000 });
    await page.getByRole('heading', { name: 'Your runs', exact: true }).waitFor();
    await page.getByText('Ilse Marrow').first().waitFor();
    await page.screenshot({ path: screenshotPath('cohort-trainee-home'), fullPage: true });

    const other = await browser.newPage();
    await other.goto(link!);
    await other.getByText('This link has already been used').waitFor();
    await other.screenshot({ path: screenshotPath('cohort-link-used'), fullPage: true });
    await other.close();
    await context.close();
  });

  it('the instructor judges a run, signs it off, sends the results; the mail carries the right figures', async () => {
    const [trainee] = await sequelize.query<{ id: number }>('SELECT id FROM users WHERE email = ?', { type: QueryTypes.SELECT, replacements: [traineeEmail] });
    const [joint] = await sequelize.query<{ target_load_n: number }>('SELECT target_load_n FROM joints WHERE stud_count = 8 ORDER BY id LIMIT 1', { type: QueryTypes.SELECT });
    const target = Number(joint!.target_load_n);
    const runId = await storeFixtureRun({ operatorId: Number(trainee!.id), cohortId, finalLoadsN: [0.93, 1.04, 1.0, 0.97, 1.12, 1.01, 0.99, 1.02].map((f) => f * target) });
    const stored = await sequelize.query<{ load_n: number }>(
      `SELECT r.load_n FROM readings r JOIN tightening_steps s ON s.id = r.step_id
        WHERE s.run_id = ? AND s.step_order = (SELECT MAX(step_order) FROM tightening_steps WHERE run_id = ?) ORDER BY r.position`,
      { type: QueryTypes.SELECT, replacements: [runId, runId] },
    );
    const expected = figures(stored.map((r) => Number(r.load_n)), target);
    expect(expected.inBand).toBe(7);

    const page = await instructorContext.newPage();
    await page.goto(`${server.baseUrl}/cohorts/${cohortId}`);
    const card = page.getByRole('article', { name: `Run ${runId} by Ilse Marrow` });
    // The lists are folded with their counts until opened.
    const awaiting = page.locator('#awaiting > summary');
    expect(await awaiting.textContent()).toContain('Runs awaiting a verdict (1)');
    expect(await card.isVisible()).toBe(false);
    await awaiting.click();
    await card.waitFor();
    await expect.poll(() => card.textContent()).toContain(asShown(expected.cvPercent));
    await card.getByLabel('Comment for the trainee').fill('Stud 5 ended high: slow down on the final pass.');
    await card.getByRole('button', { name: 'Sign off this result' }).click();
    const signed = page.getByRole('article', { name: `Signed-off run ${runId} by Ilse Marrow` });
    await expect.poll(() => page.locator('#signed > summary').textContent(), { timeout: 15_000 }).toContain('Signed off (1)');
    await page.locator('#signed > summary').click();
    await signed.waitFor({ timeout: 15_000 });
    expect(await count('SELECT COUNT(*) AS n FROM run_verdicts WHERE run_id = ? AND all_met = 0', [runId])).toBe(1);
    await signed.getByRole('button', { name: 'Send results e-mail' }).click();
    await expect.poll(() => signed.getByRole('status').filter({ hasText: 'Results sent to' }).count(), { timeout: 15_000 }).toBe(1);
    await signed.scrollIntoViewIfNeeded();
    await page.screenshot({ path: screenshotPath('cohort-signed-off'), fullPage: true });

    const mail = await waitForMail(traineeEmail, 'run result');
    expect(mail).toContain(`CV of the final loads: ${asShown(expected.cvPercent)}`);
    expect(mail).toContain(`Studs within the band: ${asShown(expected.sharePercent)} (7 of 8)`);
    expect(mail).toContain('Stud 5 ended high');
    expect(mail).toContain(`/runs/${runId}`);

    // The printable sheets, as printed (the shell's navigation and buttons are .no-print).
    await page.emulateMedia({ media: 'print' });
    await page.goto(`${server.baseUrl}/cohorts/${cohortId}/sheet`);
    await page.getByRole('heading', { name: `${cohortName}: summary` }).waitFor();
    expect(await page.getByRole('navigation', { name: 'Main' }).isVisible()).toBe(false);
    await page.getByRole('cell', { name: 'Ilse Marrow' }).waitFor();
    await page.screenshot({ path: screenshotPath('cohort-summary-sheet'), fullPage: true });
    await page.goto(`${server.baseUrl}/cohorts/${cohortId}/trainees/${trainee!.id}`);
    await page.getByRole('heading', { name: 'Result sheet: Ilse Marrow' }).waitFor();
    expect(await page.getByText('Stud 5 ended high').count()).toBe(1);
    await page.screenshot({ path: screenshotPath('cohort-result-sheet'), fullPage: true });
    await page.close();
  });

  it('the trainee sees the progress page with the chart, criteria and the comment', async () => {
    const page = await signedInPage(browser, server.baseUrl, { email: traineeEmail, password: 'tight in three passes' }, { viewport: { width: 1280, height: 900 } });
    await page.getByRole('link', { name: 'Progress', exact: true }).click();
    await page.waitForURL(`${server.baseUrl}/progress`);
    await page.locator('svg').filter({ has: page.locator('text') }).first().waitFor();
    await page.getByText('Stud 5 ended high').waitFor();
    await page.screenshot({ path: screenshotPath('cohort-progress'), fullPage: true });
    await page.context().close();
  });

  it('the instructor decides a pass and issues the record of training; a stranger checks it by its code; revoked shows "revoked"', async () => {
    const [trainee] = await sequelize.query<{ id: number }>('SELECT id FROM users WHERE email = ?', { type: QueryTypes.SELECT, replacements: [traineeEmail] });
    const page = await instructorContext.newPage();
    await page.goto(`${server.baseUrl}/cohorts/${cohortId}/trainees/${trainee!.id}`);
    await page.getByRole('heading', { name: 'Course outcome' }).waitFor();
    expect(await page.getByRole('button', { name: 'Issue the record of training' }).count(), 'no record before a pass').toBe(0);
    // Before the decision: the cohort's checklist from the starting list, the theory result, every item ticked.
    await page.getByRole('button', { name: 'Save the checklist' }).click();
    for (const item of DEFAULT_CHECKLIST) await page.getByRole('form', { name: item, exact: true }).waitFor({ timeout: 15_000 });
    await page.getByLabel('Theory score (%)').fill('85');
    await page.getByRole('button', { name: 'Save the theory result' }).click();
    // 85 % against the training default of 70 %: passed (lib/qualification/course-outcome.ts, score ≥ mark).
    await page.getByTestId('theory-summary').filter({ hasText: 'Passed: 85 % against the pass mark of 70 %' }).waitFor({ timeout: 15_000 });
    for (const item of DEFAULT_CHECKLIST) {
      const tick = page.getByRole('form', { name: item, exact: true });
      await tick.getByRole('button', { name: 'Observed', exact: true }).click();
      await tick.getByRole('button', { name: 'Not observed', exact: true }).waitFor({ timeout: 15_000 });
    }
    await page.getByTestId('checklist-summary').filter({ hasText: '5 of 5 observed' }).waitFor({ timeout: 15_000 });
    expect(await count("SELECT COUNT(*) AS n FROM checklist_ticks t JOIN checklist_items i ON i.id = t.item_id WHERE i.cohort_id = ? AND t.user_id = ? AND t.observed = 1", [cohortId, trainee!.id])).toBe(5);

    // The signed-off attempt above did not meet every criterion, so a pass is refused without an override reason.
    await page.getByLabel('Pass', { exact: true }).check();
    await page.getByLabel('Hand torque').check();
    await page.getByRole('button', { name: 'Save the decision' }).click();
    await page.getByText(/^Outstanding: No signed-off assessed attempt meets every criterion\./).waitFor({ timeout: 15_000 });
    expect(await count('SELECT COUNT(*) AS n FROM course_outcomes WHERE cohort_id = ?', [cohortId]), 'the refusal saved nothing').toBe(0);
    await page.getByLabel('Reason for a pass with something outstanding').fill('Stud 5 ran high once; corrected and watched on the joint afterwards.');
    await page.getByRole('button', { name: 'Save the decision' }).click();
    await page.getByText('Saved: pass, with the override reason on record.').waitFor({ timeout: 15_000 });
    await page.getByRole('button', { name: 'Issue the record of training' }).click({ timeout: 15_000 });
    // The issue button gives way to the record itself (code, dates, downloads) once it is issued.
    await expect.poll(() => count('SELECT COUNT(*) AS n FROM training_records WHERE cohort_id = ?', [cohortId]), { timeout: 15_000 }).toBe(1);
    const [record] = await sequelize.query<{ id: number; code: string; issued_on: string; valid_until: string }>(
      'SELECT id, code, issued_on, valid_until FROM training_records WHERE cohort_id = ? AND user_id = ?', { type: QueryTypes.SELECT, replacements: [cohortId, trainee!.id] },
    );
    expect(record, 'one record stored').toBeTruthy();
    await page.getByText(record!.code.match(/.{4}/g)!.join('-')).first().waitFor({ timeout: 15_000 });
    await page.screenshot({ path: screenshotPath('record-of-training-sheet'), fullPage: true });

    // The PDF as the instructor downloads it, read back and rendered with Debian's poppler-utils.
    const pdf = await page.request.get(`${server.baseUrl}/api/training-records/${record!.id}/pdf?paper=a4`);
    expect(pdf.headers()['content-type']).toBe('application/pdf');
    const pdfFile = screenshotPath('record-pdf').replace(/\.png$/, '.pdf');
    writeFileSync(pdfFile, await pdf.body());
    const text = execFileSync('pdftotext', ['-layout', pdfFile, '-'], { encoding: 'utf8' });
    for (const expected of ['Ilse Marrow', cohortName, 'Hand torque', record!.code.match(/.{4}/g)!.join('-'), `/verify/${record!.code}`]) expect(text).toContain(expected);
    execFileSync('pdftoppm', ['-png', '-r', '60', '-singlefile', pdfFile, screenshotPath('record-pdf').replace(/\.png$/, '')]);

    // A stranger: no cookies at all.
    const stranger = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const visit = await stranger.newPage();
    await visit.goto(`${server.baseUrl}/verify/${record!.code}`);
    await visit.getByText('Status: Valid').waitFor();
    for (const shown of ['Ilse Marrow', cohortName, 'Hand torque']) await visit.getByText(shown, { exact: true }).waitFor();
    expect(await visit.getByText('Brackwater Bolting School').count(), 'the site is not shown').toBe(0);
    expect(await visit.getByText(traineeEmail).count(), 'no e-mail address').toBe(0);
    await visit.screenshot({ path: screenshotPath('verify-page'), fullPage: true });
    await visit.goto(`${server.baseUrl}/verify/ZZZZZZZZZZZZZZZZ`);
    await visit.getByText('No record with this code.').waitFor();

    const reason = page.getByLabel('Reason for revoking');
    await reason.fill('Issued to the wrong cohort');
    await page.getByRole('button', { name: 'Revoke', exact: true }).click();
    await expect.poll(() => count('SELECT COUNT(*) AS n FROM training_records WHERE id = ? AND revoked_at IS NOT NULL', [record!.id]), { timeout: 15_000 }).toBe(1);
    await visit.goto(`${server.baseUrl}/verify/${record!.code}`);
    await visit.getByText('Status: Revoked').waitFor();
    await visit.screenshot({ path: screenshotPath('verify-page-revoked'), fullPage: true });
    await stranger.close();
    // The trainee still finds it on Progress, marked revoked, and can download it.
    const own = await signedInPage(browser, server.baseUrl, { email: traineeEmail, password: 'tight in three passes' }, { viewport: { width: 1280, height: 900 } });
    await own.goto(`${server.baseUrl}/progress`);
    await own.getByRole('heading', { name: 'Your records of training' }).waitFor();
    await own.getByText('Revoked', { exact: true }).first().waitFor();
    const download = await own.request.get(`${server.baseUrl}/api/training-records/${record!.id}/pdf`);
    expect(download.status()).toBe(200);
    expect(execFileSync('pdftotext', ['-', '-'], { input: await download.body(), encoding: 'utf8' })).toContain('Ilse Marrow');
    await own.context().close();

    await page.close();
  });

  it('hides the development outbox in a production build without EVENLOAD_OUTBOX=1', async () => {
    expect((await fetch(`${server.baseUrl}/dev/outbox`)).status).toBe(404);
  });

  it('the admin sees People; the sign-in page offers a reset that does not reveal accounts', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const page = await context.newPage();
    await page.goto(`${server.baseUrl}/sign-in`);
    await page.getByRole('link', { name: 'Forgot password?' }).click();
    await page.waitForURL(`${server.baseUrl}/forgot-password`);
    await page.getByRole('heading', { name: 'Forgot your password?' }).waitFor();
    await page.getByLabel('E-mail').fill(`nobody.${stamp}@test.evenload.test`);
    await page.getByRole('button', { name: 'Send a reset link' }).click();
    await page.getByText('If an account exists for that address').waitFor();
    await page.screenshot({ path: screenshotPath('cohort-forgot-password'), fullPage: true });
    await signInThroughForm(page, server.baseUrl, DEMO_ACCOUNTS.admin);
    await page.getByRole('link', { name: 'People', exact: true }).click();
    await page.waitForURL(`${server.baseUrl}/people`);
    await page.getByRole('heading', { name: 'People' }).waitFor();
    await page.getByRole('cell', { name: traineeEmail }).waitFor();
    await page.screenshot({ path: screenshotPath('cohort-people'), fullPage: true });
    await context.close();
    await instructorContext.close();
  });
});
