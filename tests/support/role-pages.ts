import type { Page } from 'playwright-core';

/**
 * Every page a signed-in role can open, found the way a person would: the main navigation's links,
 * then the first detail page each list links to (a run report, a cohort, its sheet, a trainee sheet,
 * a joint, a method, a lubricant, a saved comparison on Home). Shared by `npm run screenshots` and
 * `tests/e2e/page-width.test.ts`. `page` must be signed in.
 */
export async function pagesOfRole(page: Page, baseUrl: string): Promise<string[]> {
  await page.goto(`${baseUrl}/`);
  const nav = await page.locator('nav[aria-label="Main"] a').evaluateAll((links) => links.map((a) => a.getAttribute('href') ?? '/'));
  const firstLink = async (list: string, pattern: RegExp) => {
    await page.goto(`${baseUrl}${list}`);
    await page.waitForLoadState('networkidle');
    const hrefs = await page.locator('main a').evaluateAll((links) => links.map((a) => a.getAttribute('href') ?? ''));
    return hrefs.find((h) => pattern.test(h));
  };
  const details: (string | undefined)[] = [await firstLink('/', /^\/compare\/saved\/[\w-]+$/), await firstLink('/runs', /^\/runs\/\d+$/)];
  if (nav.includes('/cohorts')) {
    const cohort = await firstLink('/cohorts', /^\/cohorts\/\d+$/);
    details.push(cohort);
    if (cohort) details.push(`${cohort}/sheet`, await firstLink(cohort, /^\/cohorts\/\d+\/trainees\/\d+$/));
  }
  if (nav.includes('/joints')) {
    details.push(
      await firstLink('/joints', /^\/joints\/\d+$/),
      await firstLink('/joints', /^\/joints\/methods\/\d+$/),
      await firstLink('/joints', /^\/joints\/lubricants\/\d+$/),
      '/joints/new',
    );
  }
  return [...new Set([...nav, ...details.filter((d): d is string => Boolean(d))])];
}
