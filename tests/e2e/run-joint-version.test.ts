import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { sequelize } from '@/lib/platform/db';
import { getJoint, saveJoint } from '@/lib/data/joints';
import { storeRun } from '@/lib/data/runs/store-run';
import { lbfToN } from '@/lib/calc/units';
import type { JointInput } from '@/lib/joints/joint-input';
import { NO_GASKET_DATA } from '@/lib/joints/gasket-input';
import type { SessionUser } from '@/lib/auth/session';
import { startAppServer, type AppServer } from '../support/app-server';
import { launchBrowser, screenshotPath, signInThroughForm } from '../support/browser';
import { DEMO_ACCOUNTS } from '../support/http-session';

let server: AppServer;
let browser: Browser;
const NAME = `E2E versioned joint ${Date.now()}`;
// User 1 of the demo seed is the admin (sees every run); user 2 an instructor who records.
const admin: SessionUser = { id: 1, name: 'Admin', email: 'admin@demo.evenload.test', role: 'admin', units: 'si' };

const jointInput = (name: string, gasketType: string): JointInput => ({
  name, nominalSize: 'NPS 4', pressureClass: 'Class 150', studCount: 4,
  thread: { system: 'inch', diameterIn: 0.625, threadsPerInch: 11 }, studGrade: 'A193-B7', nutGrade: null,
  washer: null, gasketType, gasket: NO_GASKET_DATA, bandPercent: 10, targetLoadN: lbfToN(11_865), notes: null,
  positions: Array.from({ length: 4 }, (_, i) => ({ position: i + 1, calibrationFactor: 1, note: null })),
});

beforeAll(async () => {
  server = await startAppServer();
  browser = await launchBrowser();
});

afterAll(async () => {
  await browser?.close();
  await server?.stop();
  await sequelize.query('DELETE r FROM runs r JOIN joints j ON j.id = r.joint_id WHERE j.name LIKE ?', { replacements: [`${NAME}%`] });
  await sequelize.query('DELETE FROM joints WHERE name LIKE ?', { replacements: [`${NAME}%`] });
  await sequelize.close();
});

describe('a run report after its joint was edited', () => {
  it('shows the joint as it was when the run was recorded', async () => {
    const { id } = await saveJoint(admin, null, jointInput(NAME, 'spiral-wound, graphite filled'));
    const runId = await sequelize.transaction((t) =>
      storeRun(
        { jointId: id, methodId: 1, lubricantId: 1, operatorId: 2, cohortId: null, targetLoadN: 50_000, bandPercent: 10, source: 'manual', status: 'complete', recordedAt: new Date() },
        { studCount: 4, targetLoadN: 50_000, steps: [{ order: 1, pass: 1, position: 1, loadsN: [50_000, 49_000, 51_000, 50_000] }] },
        t,
      ),
    );
    await saveJoint(admin, id, jointInput(`${NAME} renamed`, 'ring-joint'), (await getJoint(admin, id))!.version);

    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const page = await context.newPage();
    await signInThroughForm(page, server.baseUrl, DEMO_ACCOUNTS.admin);
    await page.goto(`${server.baseUrl}/runs/${runId}`);
    const joint = page.locator('dl').getByText(NAME, { exact: true });
    await joint.waitFor();
    const detail = await page.locator('dd', { hasText: 'as recorded (version 1)' }).textContent();
    expect(detail).toContain('spiral-wound, graphite filled');
    expect(await page.getByText('ring-joint').count()).toBe(0);
    await page.screenshot({ path: screenshotPath('run-joint-version'), fullPage: true });
    await context.close();
  });
});
