import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { sequelize } from '@/lib/platform/db';
import type { AppServer } from '../support/app-server';
import { sharedAppServer } from '../support/shared-app-server';
import { launchBrowser, screenshotPath, signedInPage } from '../support/browser';
import { DEMO_ACCOUNTS } from '../support/http-session';
import { pagesOfRole } from '../support/role-pages';

/**
 * On a phone (390 px wide, the width of a common phone in CSS pixels) no page of any role is wider
 * than the screen: tables scroll inside their panels, long words break. Measured in Chromium as
 * `document.scrollingElement.scrollWidth`, and for the classroom (a fixed full-screen layer that
 * scrolls itself) as that layer's scrollWidth too.
 */
const PHONE_PX = 390;

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

describe(`every page at ${PHONE_PX} px`, () => {
  for (const role of Object.keys(DEMO_ACCOUNTS) as (keyof typeof DEMO_ACCOUNTS)[]) {
    it(`${role}: no page is wider than the screen`, async () => {
      const page = await signedInPage(browser, server.baseUrl, role, { viewport: { width: PHONE_PX, height: 844 } });
      const urls = await pagesOfRole(page, server.baseUrl);
      // The pages every role of this kind must have reached (so a broken discovery cannot pass quietly).
      expect(urls).toEqual(expect.arrayContaining(['/', '/runs', '/calculator']));
      expect(urls.some((u) => /^\/runs\/\d+$/.test(u)), `${role}: a run report among ${urls.join(', ')}`).toBe(true);
      const wide: string[] = [];
      for (const url of urls) {
        await page.goto(`${server.baseUrl}${url}`);
        await page.waitForLoadState('networkidle');
        await page.waitForTimeout(300); // charts redraw at the measured width
        const width = await page.evaluate(() =>
          Math.max(
            document.scrollingElement?.scrollWidth ?? 0,
            ...[...document.querySelectorAll<HTMLElement>('[data-testid="classroom-root"]')].map((e) => e.scrollWidth),
          ),
        );
        if (width > PHONE_PX) {
          wide.push(`${url}: ${width} px`);
          await page.screenshot({ path: screenshotPath(`page-width-${role}-${url === '/' ? 'home' : url.slice(1).replace(/\//g, '-')}`), fullPage: true });
        }
      }
      await page.context().close();
      expect(wide, `${role}: pages wider than ${PHONE_PX} px:\n${wide.join('\n')}`).toEqual([]);
    }, 240_000);
  }
});
