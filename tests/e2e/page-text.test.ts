import { QueryTypes } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { sequelize } from '@/lib/platform/db';
import { DEMO_NOTICE } from '@/lib/demo/notice';
import type { AppServer } from '../support/app-server';
import { sharedAppServer } from '../support/shared-app-server';
import { launchBrowser, signedInPage } from '../support/browser';
import { DEMO_ACCOUNTS } from '../support/http-session';
import { freezeDemoComparison } from '../support/saved-comparison';

// Screens are projected in front of trainees and auditors: they must not carry notes meant for
// engineers (how far a value is trusted, source tags of docs/REFERENCE.md, how the app computes).
// Those notes belong in code comments, tests and docs. The list is kept here, beside the check.
const DEVELOPER_NOTES: { name: string; pattern: RegExp }[] = [
  { name: 'from memory', pattern: /from memory/i },
  { name: 'unverified', pattern: /unverified/i },
  { name: 'invented (outside the one demo-data line)', pattern: /invented/i },
  { name: 'bracketed source tag', pattern: /\[[A-Z][A-Z0-9]{2,}[0-9-]*\]/ },
  { name: 'REFERENCE citation', pattern: /REFERENCE/ },
  { name: 'SQL talk', pattern: /\bSQL\b/ },
  { name: '(computed) marker', pattern: /\(computed\)/ },
];

type Role = keyof typeof DEMO_ACCOUNTS;

interface Finding {
  role: Role;
  url: string;
  note: string;
  excerpt: string;
}

let server: AppServer;
let browser: Browser;
let saved: Awaited<ReturnType<typeof freezeDemoComparison>> | undefined;
const ids = {} as Record<'joint' | 'lubricant' | 'method' | 'instructorCohort' | 'cohortTrainee' | 'instructorRun' | 'traineeRun' | 'anyRun', number>;

async function firstId(sql: string, replacements: unknown[] = []): Promise<number> {
  const [row] = await sequelize.query<{ id: number }>(sql, { type: QueryTypes.SELECT, replacements });
  if (!row) throw new Error(`the demo data has no row for: ${sql}`);
  return Number(row.id);
}

beforeAll(async () => {
  server = sharedAppServer();
  browser = await launchBrowser();
  ids.joint = await firstId('SELECT id FROM joints ORDER BY id LIMIT 1');
  ids.lubricant = await firstId('SELECT id FROM lubricants ORDER BY id LIMIT 1');
  ids.method = await firstId('SELECT id FROM methods ORDER BY id LIMIT 1');
  ids.instructorCohort = await firstId('SELECT c.id FROM cohorts c JOIN users i ON i.id = c.instructor_id WHERE i.email = ? ORDER BY c.id LIMIT 1', [DEMO_ACCOUNTS.instructor]);
  ids.cohortTrainee = await firstId('SELECT m.user_id AS id FROM cohort_members m WHERE m.cohort_id = ? ORDER BY m.user_id LIMIT 1', [ids.instructorCohort]);
  ids.instructorRun = await firstId('SELECT r.id FROM runs r WHERE r.cohort_id = ? AND r.pass_count > 1 ORDER BY r.id LIMIT 1', [ids.instructorCohort]);
  ids.traineeRun = await firstId('SELECT r.id FROM runs r JOIN users o ON o.id = r.operator_id WHERE o.email = ? ORDER BY r.id LIMIT 1', [DEMO_ACCOUNTS.trainee]);
  ids.anyRun = await firstId('SELECT id FROM runs WHERE pass_count > 1 ORDER BY id LIMIT 1');
  saved = await freezeDemoComparison('Methods on simulated runs (page text check)');
});

afterAll(async () => {
  await saved?.remove();
  await browser?.close();
  await sequelize.close();
});

/** Every page a role can open (app/(lab)), with the ids of the demo data it needs. */
function pagesFor(role: Role): string[] {
  const common = ['/', '/runs', '/calculator'];
  const library = ['/joints', `/joints/${ids.joint}`, `/joints/${ids.joint}/calibration`, '/joints/new', `/joints/lubricants/${ids.lubricant}`, '/joints/lubricants/new', `/joints/methods/${ids.method}`, '/joints/methods/new', '/joints/hardware'];
  const cohort = ['/cohorts', `/cohorts/${ids.instructorCohort}`, `/cohorts/${ids.instructorCohort}/sheet`, `/cohorts/${ids.instructorCohort}/trainees/${ids.cohortTrainee}`];
  const compare = ['/compare?by=method', '/compare?by=lubricant', '/compare?by=cohort'];
  switch (role) {
    case 'admin':
      return [...common, `/runs/${ids.anyRun}`, ...cohort, ...library, '/people', '/equipment', '/admin/jobs'];
    case 'instructor':
      return [...common, `/runs/${ids.instructorRun}`, '/record', ...compare, '/classroom', ...cohort, ...library];
    case 'researcher':
      return [...common, `/runs/${ids.anyRun}`, '/record', ...compare, `/compare/saved/${saved!.slug}`];
    case 'trainee':
      return [...common, `/runs/${ids.traineeRun}`, '/record', '/progress'];
  }
}

/** Opens every <details> and returns the visible text. */
async function visibleText(page: Page): Promise<string> {
  await page.evaluate(() => document.querySelectorAll('details').forEach((d) => d.setAttribute('open', '')));
  return page.evaluate(() => document.body.innerText);
}

/** The page's visible text in every state worth reading: each Record tab, the classroom's end figures. */
async function textsOf(page: Page, url: string): Promise<string[]> {
  const response = await page.goto(`${server.baseUrl}${url}`);
  expect(response?.status(), url).toBe(200);
  await page.waitForLoadState('networkidle');
  if (url.startsWith('/compare')) await page.getByRole('heading', { name: 'Is the difference real?' }).waitFor();
  const texts = [await visibleText(page)];
  if (url === '/record') {
    for (const tab of await page.getByRole('tab').all()) {
      await tab.click();
      await page.waitForLoadState('networkidle');
      texts.push(await visibleText(page));
    }
  }
  if (url === '/classroom') {
    await page.keyboard.press('End');
    await page.waitForLoadState('networkidle');
    texts.push(await visibleText(page));
  }
  return texts;
}

function findingsIn(role: Role, url: string, text: string): Finding[] {
  // The one place the invented demo data is declared; it is allowed once, quietly, per page.
  const parts = text.split(DEMO_NOTICE);
  const rest = parts.join('\n');
  const found: Finding[] = [];
  if (parts.length > 2) found.push({ role, url, note: 'demo-data line shown more than once', excerpt: DEMO_NOTICE });
  for (const { name, pattern } of DEVELOPER_NOTES) {
    const m = pattern.exec(rest);
    if (m) found.push({ role, url, note: name, excerpt: rest.slice(Math.max(0, m.index - 60), m.index + 60).replace(/\s+/g, ' ') });
  }
  return found;
}

describe('visible page text carries no developer notes', () => {
  for (const role of Object.keys(DEMO_ACCOUNTS) as Role[]) {
    it(`shows the ${role} no developer note on any page, and the demo-data line once`, async () => {
      const page = await signedInPage(browser, server.baseUrl, role, { viewport: { width: 1366, height: 900 } });
      const findings: Finding[] = [];
      let demoLines = 0;
      for (const url of pagesFor(role)) {
        for (const text of await textsOf(page, url)) {
          findings.push(...findingsIn(role, url, text));
          if (text.includes(DEMO_NOTICE)) demoLines += 1;
        }
      }
      await page.context().close();
      expect(findings).toEqual([]);
      // The test database holds the demo data, so the footer line is on the pages.
      expect(demoLines).toBeGreaterThan(0);
    });
  }
});
