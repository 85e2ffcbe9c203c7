/**
 * npm run screenshots [-- --url http://127.0.0.1:3000] [--out .data/screenshots/NAME]
 *
 * Signs in as each demo role and shoots every page the role can open (the main navigation, plus
 * the first run report, cohort, cohort sheet, trainee sheet, joint, method, lubricant and saved
 * comparison it links to; `tests/support/role-pages.ts`) at 1280 and 390 px
 * wide, in the light and the dark scheme, full page, into a folder under .data/ (not committed).
 * Needs a running app with the demo data (`npm start`); uses playwright-core with Debian's
 * Chromium, as the browser tests do.
 */
import { mkdirSync } from 'node:fs';
import path from 'node:path';
import type { Browser } from 'playwright-core';
import { launchBrowser, signInThroughForm } from '../tests/support/browser';
import { DEMO_ACCOUNTS } from '../tests/support/http-session';
import { pagesOfRole } from '../tests/support/role-pages';

const WIDTHS = [1280, 390] as const;
const SCHEMES = ['light', 'dark'] as const;

function argument(name: string): string | undefined {
  const i = process.argv.indexOf(`--${name}`);
  return i > 0 ? process.argv[i + 1] : undefined;
}

const baseUrl = (argument('url') ?? `http://127.0.0.1:${process.env.PORT ?? 3000}`).replace(/\/$/, '');
const out = path.resolve(argument('out') ?? path.join('.data', 'screenshots', new Date().toISOString().slice(0, 19).replace(/[:T]/g, '-')));

const fileName = (role: string, url: string, width: number, scheme: string) =>
  `${role}-${url === '/' ? 'home' : url.slice(1).replace(/\//g, '-')}-${width}-${scheme}.png`;

async function shootRole(browser: Browser, role: keyof typeof DEMO_ACCOUNTS): Promise<number> {
  const discover = await browser.newContext({ viewport: { width: 1280, height: 900 } });
  const first = await discover.newPage();
  await signInThroughForm(first, baseUrl, DEMO_ACCOUNTS[role]);
  const urls = await pagesOfRole(first, baseUrl);
  const state = await discover.storageState();
  await discover.close();
  let shots = 0;
  for (const width of WIDTHS) {
    for (const scheme of SCHEMES) {
      const context = await browser.newContext({ viewport: { width, height: 900 }, colorScheme: scheme, storageState: state });
      const page = await context.newPage();
      for (const url of urls) {
        await page.goto(`${baseUrl}${url}`);
        await page.waitForLoadState('networkidle');
        await page.waitForTimeout(500); // charts redraw at the measured width
        await page.screenshot({ path: path.join(out, fileName(role, url, width, scheme)), fullPage: true });
        shots += 1;
      }
      await context.close();
    }
  }
  return shots;
}

async function main() {
  mkdirSync(out, { recursive: true });
  const browser = await launchBrowser();
  try {
    for (const role of Object.keys(DEMO_ACCOUNTS) as (keyof typeof DEMO_ACCOUNTS)[]) {
      const shots = await shootRole(browser, role);
      console.log(`${role}: ${shots} screenshots`);
    }
  } finally {
    await browser.close();
  }
  console.log(`screenshots in ${out}`);
}

main().catch((error) => {
  console.error(error);
  process.exit(1);
});
