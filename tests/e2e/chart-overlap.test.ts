import { mkdirSync } from 'node:fs';
import path from 'node:path';
import { QueryTypes } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { sequelize } from '@/lib/platform/db';
import type { AppServer } from '../support/app-server';
import { sharedAppServer } from '../support/shared-app-server';
import { launchBrowser, screenshotPath, signedInPage } from '../support/browser';
import { DEMO_ACCOUNTS } from '../support/http-session';
import { recordCalibration } from '@/lib/data/calibration';
import { saveJoint } from '@/lib/data/joints';
import { saveRunHolds } from '@/lib/data/run-holds';
import type { SessionUser } from '@/lib/auth/session';
import { calibrationSession, fourStudJoint } from '../integration/calibration-fixture';

/**
 * Every chart of the product, drawn in Chromium at 1280 px and 390 px wide: no two <text> labels in
 * one chart's <svg> overlap (beyond 1 px), and no label overlaps a dot (<circle>) of the chart.
 * The boxes are the browser's own (getBoundingClientRect), not estimates.
 */

const WIDTHS = [1280, 390] as const;
const TOLERANCE_PX = 1;
const SHOTS = process.env.EVENLOAD_CHART_SHOTS; // a folder: also keep a screenshot of each chart

/** Eight group names long enough to smear into each other under narrow columns. */
const LONG_NAMES = [
  'Molybdenum disulphide paste, heavy coat',
  'Copper-graphite anti-seize compound',
  'Nickel anti-seize for high temperature',
  'Light machine oil, brushed on threads only',
  'PTFE dry film spray on nut faces',
  'As-supplied zinc flake coating, no lubricant',
  'Graphite in petroleum grease, thin coat',
  'Food-grade white grease on threads and nut faces',
];

let server: AppServer;
let browser: Browser;
let demoRun: number;
const lubricantIds: number[] = [];
const copiedRuns: number[] = [];
let calibratedJoint = 0;
const CALIBRATED_JOINT = `Chart check calibrated joint ${Date.now()}`;

beforeAll(async () => {
  server = sharedAppServer();
  browser = await launchBrowser();
  const [run] = await sequelize.query<{ id: number }>(
    `SELECT r.id FROM runs r JOIN cohorts c ON c.id = r.cohort_id JOIN users i ON i.id = c.instructor_id
     WHERE i.email = ? AND r.status = 'complete' AND r.pass_count > 1 ORDER BY r.id LIMIT 1`,
    { type: QueryTypes.SELECT, replacements: [DEMO_ACCOUNTS.instructor] },
  );
  demoRun = run!.id;
  // Eight lubricants with long names, each given copies of three complete demo runs (the runs row
  // carries the per-run figures a comparison reads).
  const sources = await sequelize.query<{ id: number }>(
    "SELECT id FROM runs WHERE status = 'complete' AND final_loads_json IS NOT NULL ORDER BY source = 'simulated', id LIMIT 24",
    { type: QueryTypes.SELECT },
  );
  const columns = (
    await sequelize.query<{ name: string }>(
      "SELECT COLUMN_NAME AS name FROM information_schema.COLUMNS WHERE TABLE_SCHEMA = DATABASE() AND TABLE_NAME = 'runs' AND COLUMN_NAME NOT IN ('id', 'lubricant_id') ORDER BY ORDINAL_POSITION",
      { type: QueryTypes.SELECT },
    )
  ).map((c) => `\`${c.name}\``);
  for (const [i, name] of LONG_NAMES.entries()) {
    const [id] = await sequelize.query('INSERT INTO lubricants (name, nominal_nut_factor, notes, created_at, updated_at) VALUES (?, 0.15, NULL, NOW(), NOW())', {
      replacements: [`${name} (chart check)`],
    });
    lubricantIds.push(Number(id));
    for (const source of sources.slice(i * 3, i * 3 + 3)) {
      const [runId] = await sequelize.query(
        `INSERT INTO runs (lubricant_id, ${columns.join(', ')}) SELECT ?, ${columns.join(', ')} FROM runs WHERE id = ?`,
        { replacements: [Number(id), source.id] },
      );
      copiedRuns.push(Number(runId));
      // The copies carry no steps: dated a year back, they never become a page's latest run to replay.
      await sequelize.query('UPDATE runs SET recorded_at = recorded_at - INTERVAL 1 YEAR WHERE id = ?', { replacements: [Number(runId)] });
    }
  }
  // The run report's relaxation chart: invented hold readings on the demo run (every stud at 50, 49.2,
  // 48.8 and 48.5 kN after 0, 10 min, 1 h and 4 h).
  const [admin] = await sequelize.query<{ id: number; name: string }>('SELECT id, name FROM users WHERE email = ?', { type: QueryTypes.SELECT, replacements: [DEMO_ACCOUNTS.admin] });
  const adminUser: SessionUser = { id: admin!.id, name: admin!.name, email: DEMO_ACCOUNTS.admin, role: 'admin', units: 'si' };
  const [studs] = await sequelize.query<{ n: number }>('SELECT stud_count AS n FROM runs WHERE id = ?', { type: QueryTypes.SELECT, replacements: [demoRun] });
  const holdRow = (time: string, kN: number) => `${time},${Array.from({ length: Number(studs!.n) }, () => kN).join(',')}`;
  await saveRunHolds(adminUser, demoRun, [`elapsed,${Array.from({ length: Number(studs!.n) }, (_, i) => i + 1).join(',')}`, holdRow('0', 50), holdRow('10 min', 49.2), holdRow('1 h', 48.8), holdRow('4 h', 48.5)].join('\n'), 'si');
  // The calibration history chart: a 4-stud joint (invented) calibrated twice, the second time with a drifted gauge.
  calibratedJoint = (await saveJoint(adminUser, null, fourStudJoint(CALIBRATED_JOINT))).id;
  await recordCalibration(adminUser, calibratedJoint, calibrationSession('2026-02-01', [1, 1.02, 0.98, 1]));
  await recordCalibration(adminUser, calibratedJoint, calibrationSession('2026-08-01', [1, 1.02, 0.95, 1]));
  if (SHOTS) mkdirSync(SHOTS, { recursive: true });
});

afterAll(async () => {
  await sequelize.query('DELETE FROM run_holds WHERE run_id = ?', { replacements: [demoRun] });
  if (calibratedJoint) await sequelize.query('DELETE FROM joints WHERE id = ?', { replacements: [calibratedJoint] });
  if (copiedRuns.length) await sequelize.query('DELETE FROM runs WHERE id IN (?)', { replacements: [copiedRuns] });
  if (lubricantIds.length) await sequelize.query('DELETE FROM lubricants WHERE id IN (?)', { replacements: [lubricantIds] });
  await browser?.close();
  await sequelize.close();
});

interface Overlap {
  chart: string;
  a: string;
  b: string;
}

/** The overlaps in every chart on the page (each plot's <svg>, legends' swatch svgs have no text). */
async function overlaps(page: Page): Promise<Overlap[]> {
  return page.evaluate((tolerance) => {
    const found: { chart: string; a: string; b: string }[] = [];
    const hit = (p: DOMRect, q: DOMRect) =>
      Math.min(p.right, q.right) - Math.max(p.left, q.left) > tolerance && Math.min(p.bottom, q.bottom) - Math.max(p.top, q.top) > tolerance;
    for (const container of document.querySelectorAll('[data-testid="plot-container"]')) {
      const chart = container.closest('figure')?.querySelector('figcaption')?.textContent ?? 'chart';
      for (const svg of container.querySelectorAll('svg')) {
        const texts = [...svg.querySelectorAll('text')]
          .filter((t) => (t.textContent ?? '').trim() !== '')
          .map((t) => ({ label: t.textContent!.trim(), box: t.getBoundingClientRect() }))
          .filter((t) => t.box.width > 0 && t.box.height > 0);
        const dots = [...svg.querySelectorAll('circle')].map((c) => c.getBoundingClientRect()).filter((b) => b.width > 0);
        for (let i = 0; i < texts.length; i += 1) {
          for (let j = i + 1; j < texts.length; j += 1) {
            if (hit(texts[i]!.box, texts[j]!.box)) found.push({ chart, a: texts[i]!.label, b: texts[j]!.label });
          }
          const dot = dots.find((d) => hit(texts[i]!.box, d));
          if (dot) found.push({ chart, a: texts[i]!.label, b: `dot at ${Math.round(dot.x)},${Math.round(dot.y)}` });
        }
      }
    }
    return found;
  }, TOLERANCE_PX);
}

async function openAt(role: keyof typeof DEMO_ACCOUNTS, width: number): Promise<Page> {
  const page = await signedInPage(browser, server.baseUrl, role, {
    viewport: { width, height: 900 },
    beforeSignIn: (page) => {
      page.on('pageerror', (error) => console.error(`page error at ${width} px: ${error.message}`));
      page.on('console', (message) => {
        if (message.type() === 'error') console.error(`console error at ${width} px: ${message.text().slice(0, 2000)}`);
      });
    },
  });
  return page;
}

/** Waits for at least `count` drawn charts and for their sizes to settle, then measures. */
async function measure(page: Page, count: number, name: string): Promise<Overlap[]> {
  await expect.poll(() => page.locator('[data-testid="plot-container"] > svg, [data-testid="plot-container"] > figure svg').count(), { timeout: 30_000 }).toBeGreaterThanOrEqual(count);
  await page.waitForTimeout(400); // ResizeObserver → redraw at the measured width
  if (SHOTS) {
    const figures = page.locator('figure:has([data-testid="plot-container"])');
    for (let i = 0; i < (await figures.count()); i += 1) await figures.nth(i).screenshot({ path: path.join(SHOTS, `${name}-${i + 1}.png`) });
  }
  return overlaps(page);
}

const CASES: { name: string; role: keyof typeof DEMO_ACCOUNTS; charts: number; open: (page: Page) => Promise<void> }[] = [
  {
    name: 'run-report',
    role: 'instructor',
    charts: 5, // four of the run, and the relaxation during the hold
    open: async (page) => {
      await page.goto(`${server.baseUrl}/runs/${demoRun}`);
      await page.getByRole('heading', { name: 'The figures' }).waitFor();
    },
  },
  {
    name: 'calibration-history',
    role: 'instructor',
    charts: 1,
    open: async (page) => {
      await page.goto(`${server.baseUrl}/joints/${calibratedJoint}/calibration`);
      await page.getByRole('heading', { name: 'History' }).waitFor();
    },
  },
  {
    name: 'compare-eight-long-names',
    role: 'researcher',
    charts: 2, // final loads and run CV; drift is drawn only for one chosen stud count
    open: async (page) => {
      await page.goto(`${server.baseUrl}/compare?by=lubricant&ids=${lubricantIds.join(',')}`);
      await page.getByRole('heading', { name: 'Is the difference real?' }).waitFor();
    },
  },
  {
    name: 'compare-lubricants-nut-factor',
    role: 'researcher',
    charts: 3,
    open: async (page) => {
      await page.goto(`${server.baseUrl}/compare?by=lubricant`);
      await page.getByRole('heading', { name: 'Nut factor by lubricant' }).waitFor();
    },
  },
  {
    name: 'progress',
    role: 'trainee',
    charts: 1,
    open: async (page) => {
      await page.goto(`${server.baseUrl}/progress`);
    },
  },
  {
    // The classroom draws its charts in the scene (one per side, large type, replay cursor); its
    // end screen is a table of figures.
    name: 'classroom-scene',
    role: 'instructor',
    charts: 2,
    open: async (page) => {
      await page.goto(`${server.baseUrl}/classroom`);
      // A click before React has hydrated the picker does nothing; the layer says when it has (data-hydrated,
      // set in an effect), and then one click starts the scene.
      await page.locator('[data-testid="classroom-root"][data-hydrated="true"]').waitFor({ timeout: 60_000 });
      await page.locator('li', { hasText: 'One pass or several' }).getByRole('button', { name: 'Start here' }).click();
      await page.getByTestId('side-status').first().waitFor();
      for (let i = 0; i < 6; i += 1) await page.keyboard.press('Space');
      await page.getByText('step 6 of').waitFor();
    },
  },
];

describe('chart labels in Chromium', () => {
  for (const width of WIDTHS) {
    for (const c of CASES) {
      it(`${c.name} at ${width} px: no label overlaps another label or a dot`, async () => {
        const page = await openAt(c.role, width);
        try {
          await c.open(page);
        } catch (error) {
          await page.screenshot({ path: screenshotPath(`chart-overlap-${c.name}-${width}-failed`) });
          throw error;
        }
        const found = await measure(page, c.charts, `${c.name}-${width}`);
        await page.context().close();
        const lines = found.map((o) => `${o.chart}: "${o.a}" over "${o.b}"`);
        expect(lines, `${lines.length} overlaps:\n${lines.join('\n')}`).toEqual([]);
      });
    }
  }
});
