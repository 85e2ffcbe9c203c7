/**
 * Every good file of the logger corpus (tests/ingest/logger-corpus, written by
 * scripts/generate-logger-corpus.ts, all invented) uploaded through the Record page in Chromium
 * without editing: channel names of every kind, six languages, metadata units, tare and noise, check
 * passes, long files and an Excel workbook whose table is on its second sheet. Gauge serial names
 * give a guessed mapping that must be confirmed before saving. The expected step counts are the
 * generator's own inputs (manifest.json). The mapping step of a channel-named file
 * (CH1 (kN) … CH8 (kN)) is shot for the notes.
 */
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { QueryTypes } from 'sequelize';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sequelize } from '@/lib/platform/db';
import { startAppServer, type AppServer } from '../support/app-server';
import { launchBrowser, screenshotPath, signInThroughForm } from '../support/browser';
import { DEMO_ACCOUNTS } from '../support/http-session';
import { createTestJoint, dropTestJoints } from '../support/record-fixtures';

const DIR = path.resolve(__dirname, '../ingest/logger-corpus');
const manifest = JSON.parse(readFileSync(path.join(DIR, 'manifest.json'), 'utf8')) as { good: Array<{ file: string; steps: number; sheet?: string }> };
const stepsOf = (file: string) => manifest.good.find((g) => g.file === file)!.steps;

let server: AppServer;
let browser: Browser;
let page: Page;
let jointId: number;
let jointName: string;

beforeAll(async () => {
  server = await startAppServer();
  jointId = await createTestJoint(8, 'e2e-logger');
  const [row] = await sequelize.query<{ name: string }>('SELECT name FROM joints WHERE id = ?', { type: QueryTypes.SELECT, replacements: [jointId] });
  jointName = row!.name;
  browser = await launchBrowser();
  page = await browser.newPage({ viewport: { width: 1280, height: 1000 } });
  await signInThroughForm(page, server.baseUrl, DEMO_ACCOUNTS.instructor);
});

afterAll(async () => {
  await browser?.close();
  await dropTestJoints([jointId]);
  await server?.stop();
  await sequelize.close();
});

async function upload(file: string) {
  await page.goto(`${server.baseUrl}/record`);
  // Record opens on the way in this person chose last: choose the upload.
  await page.getByRole('tab', { name: 'Upload a file' }).click();
  await page.getByLabel('Joint', { exact: true }).selectOption({ label: `${jointName} (8 studs)` });
  // A method with a check pass, while these files hold none (the generator's plan): the page must not
  // take the short hold after the last pull for 8 check steps (it did: 32 steps for 24).
  await page.getByLabel('Method', { exact: true }).selectOption({ label: 'Three cross passes 30/60/100 % + circular check' });
  await page.locator('input[type=file]').setInputFiles(path.join(DIR, 'good', file));
  const save = page.getByRole('button', { name: new RegExp(`^Save run \\(${stepsOf(file)} steps`) });
  await save.waitFor({ timeout: 30_000 });
  return save;
}

describe('Record page with logger files', () => {
  it('covers every good file of the corpus (at least 15)', () => {
    expect(manifest.good.length).toBeGreaterThanOrEqual(15);
  });

  // Gauge serial names are the one good file whose mapping is a guess to confirm: its own case below.
  for (const { file, sheet } of manifest.good.filter((g) => g.file !== 'gauge-serials.csv')) {
    it(`uploads ${file} without editing`, async () => {
      const save = await upload(file);
      const confirmSteps = page.getByLabel(`These ${stepsOf(file)} steps are right`);
      if (file.startsWith('long-')) {
        // A long file names its steps (one snapshot per step): nothing is derived, nothing to confirm.
        expect(await confirmSteps.count()).toBe(0);
      } else {
        await confirmSteps.check();
      }
      if (sheet) await expect(page.getByLabel('Sheet').inputValue()).resolves.toBe(sheet);
      await save.click();
      await page.getByText(/^Saved run \d+ with/).waitFor({ timeout: 30_000 });
    });
  }

  it('shows the mapping step of a channel-named file filled with its guess', async () => {
    await upload('channels-ch-kn.csv');
    await page.getByText('Column mapping', { exact: true }).waitFor();
    // CH1 (kN) … CH8 (kN): channel k is stud k (the joint has no channel map), unit kN from the headers.
    for (let k = 1; k <= 8; k++) await expect(page.getByLabel(`Stud position of column CH${k} (kN)`).inputValue()).resolves.toBe(String(k));
    await page.screenshot({ path: screenshotPath('record-upload-mapping-channels-ch-kn'), fullPage: true });
  });

  it('asks to confirm a guessed mapping (gauge serial names) before saving', async () => {
    const save = await upload('gauge-serials.csv');
    await page.getByLabel(`These ${stepsOf('gauge-serials.csv')} steps are right`).check();
    expect(await save.isDisabled()).toBe(true);
    await page.getByText('Column mapping', { exact: true }).waitFor();
    await page.screenshot({ path: screenshotPath('record-upload-mapping-step'), fullPage: true });
    await page.getByLabel(/The column mapping above is right/).check();
    expect(await save.isDisabled()).toBe(false);
    await save.click();
    await page.getByText(/^Saved run \d+ with/).waitFor({ timeout: 30_000 });
  });
});
