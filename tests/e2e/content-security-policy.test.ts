/**
 * Every page, as a visitor and as each role, in Chromium against the built app with its nonce-based
 * Content-Security-Policy enforced: no `securitypolicyviolation` event (CSP Level 3 §5.3) and no CSP
 * message on the console, while the page hydrates, draws its charts and (on Record) parses an upload
 * in its web worker.
 */
import path from 'node:path';
import { QueryTypes } from 'sequelize';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sequelize } from '@/lib/platform/db';
import type { AppServer } from '../support/app-server';
import { sharedAppServer } from '../support/shared-app-server';
import { launchBrowser, signedInPage } from '../support/browser';
import { createTestJoint, dropTestJoints, GOOD_DIR } from '../support/record-fixtures';
import { freezeDemoComparison } from '../support/saved-comparison';

let server: AppServer;
let browser: Browser;
let labPages: string[] = [];
let jointId: number;
let jointName: string;
let saved: Awaited<ReturnType<typeof freezeDemoComparison>> | undefined;

const PUBLIC_PAGES = ['/sign-in', '/forgot-password', '/reset/not-a-token', '/welcome/not-a-token', '/dev/outbox', '/verify/ZZZZZZZZZZZZZZZZ', '/review/not-a-token'];

async function firstId(sql: string): Promise<number> {
  const [row] = await sequelize.query<{ id: number }>(sql, { type: QueryTypes.SELECT });
  if (!row) throw new Error(`the demo data has no row for: ${sql}`);
  return Number(row.id);
}

beforeAll(async () => {
  server = sharedAppServer();
  browser = await launchBrowser();
  jointId = await createTestJoint(4, 'csp');
  const [joint] = await sequelize.query<{ name: string }>('SELECT name FROM joints WHERE id = ?', { type: QueryTypes.SELECT, replacements: [jointId] });
  jointName = joint!.name;
  const cohort = await firstId('SELECT cohort_id AS id FROM cohort_members ORDER BY cohort_id LIMIT 1');
  const member = await firstId(`SELECT user_id AS id FROM cohort_members WHERE cohort_id = ${cohort} ORDER BY user_id LIMIT 1`);
  const run = await firstId("SELECT id FROM runs WHERE status = 'complete' ORDER BY id LIMIT 1");
  saved = await freezeDemoComparison('Methods on simulated runs (CSP check)');
  labPages = [
    '/', '/calculator', '/classroom', '/compare', '/progress', '/people', '/record', '/runs', `/runs/${run}`,
    '/cohorts', `/cohorts/${cohort}`, `/cohorts/${cohort}/sheet`, `/cohorts/${cohort}/trainees/${member}`,
    '/joints', '/joints/new', `/joints/${await firstId('SELECT id FROM joints ORDER BY id LIMIT 1')}`,
    '/joints/hardware',
    `/joints/${await firstId('SELECT id FROM joints ORDER BY id LIMIT 1')}/calibration`,
    '/equipment',
    '/admin/jobs',
    '/joints/lubricants/new', `/joints/lubricants/${await firstId('SELECT id FROM lubricants ORDER BY id LIMIT 1')}`,
    '/joints/methods/new', `/joints/methods/${await firstId('SELECT id FROM methods ORDER BY id LIMIT 1')}`,
    `/compare/saved/${saved.slug}`,
    '/no-such-page',
  ];
});

afterAll(async () => {
  await browser?.close();
  await dropTestJoints([jointId]);
  await saved?.remove();
  await sequelize.close();
});

/** Opens each page and returns every CSP violation and CSP console message, named by page. */
async function violationsOn(page: Page, routes: string[], afterLoad?: (route: string) => Promise<void>): Promise<string[]> {
  const found: string[] = [];
  let current = '';
  page.on('console', (message) => {
    if (/Content Security Policy/i.test(message.text())) found.push(`${current}: console: ${message.text()}`);
  });
  page.on('pageerror', (error) => found.push(`${current}: page error: ${error.message}`));
  await page.exposeFunction('reportViolation', (text: string) => found.push(`${current}: ${text}`));
  await page.addInitScript(() => {
    document.addEventListener('securitypolicyviolation', (event) => {
      (window as unknown as { reportViolation: (text: string) => void }).reportViolation(`${event.violatedDirective} blocked ${event.blockedURI || 'inline'} (${event.sample}) at ${event.sourceFile}:${event.lineNumber}:${event.columnNumber}`);
    });
  });
  for (const route of routes) {
    current = route;
    const response = await page.goto(`${server.baseUrl}${route}`, { waitUntil: 'load' });
    expect(response?.headers()['content-security-policy'], route).toMatch(/script-src 'self' 'nonce-[^']+' 'strict-dynamic'/);
    await page.waitForLoadState('networkidle');
    await afterLoad?.(route);
  }
  return found;
}

describe('no CSP violation on any page', () => {
  it('as a visitor', async () => {
    const page = await browser.newPage();
    expect(await violationsOn(page, PUBLIC_PAGES)).toEqual([]);
    await page.close();
  });

  for (const role of ['admin', 'instructor', 'researcher', 'trainee'] as const) {
    it(`as ${role}`, async () => {
      const page = await signedInPage(browser, server.baseUrl, role, { viewport: { width: 1280, height: 900 } });
      const charts: Record<string, number> = {};
      const found = await violationsOn(page, labPages, async (route) => {
        // Hydrated: React has attached to the page (a blocked script would leave it inert).
        await page.waitForFunction(() => Array.from(document.querySelectorAll('*')).some((el) => Object.keys(el).some((key) => key.startsWith('__react'))));
        if (route.startsWith('/runs/')) charts[route] = await page.locator('svg').count();
        if (route === '/record' && role === 'instructor') {
          // The upload is parsed in a web worker; its preview appears only if the worker ran.
          // Record opens on the way in this person chose last: choose the upload.
          await page.getByRole('tab', { name: 'Upload a file' }).click();
          await page.getByLabel('Joint', { exact: true }).selectOption({ label: `${jointName} (4 studs)` });
          await page.locator('input[type=file]').setInputFiles(path.join(GOOD_DIR, 'wide-step-column.csv'));
          await page.getByText('What was detected').waitFor({ timeout: 20_000 });
        }
      });
      expect(found).toEqual([]);
      for (const [route, count] of Object.entries(charts)) expect(count, `charts drawn on ${route}`).toBeGreaterThan(0);
      await page.context().close();
    });
  }
});
