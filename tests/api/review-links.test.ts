/**
 * Review links of saved comparisons, over HTTP against the built app: a link opens the saved
 * comparison without a session and hands out its data package; no trainee's name or e-mail address
 * is anywhere in the page or in any file of the package (searched in the bytes); the link stops
 * after it is withdrawn and after it expires; a wrong token is a plain 404; only the author makes
 * and withdraws links, and each is written to the audit log.
 */
import { QueryTypes } from 'sequelize';
import { strFromU8, unzipSync } from 'fflate';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sequelize } from '@/lib/platform/db';
import { compareQuerySchema } from '@/lib/data/compare';
import { createReviewLink, revokeReviewLink } from '@/lib/data/review-links';
import { freezeComparison } from '@/lib/data/saved-comparisons';
import { startAppServer, type AppServer } from '../support/app-server';
import { anonymous, DEMO_ACCOUNTS, type HttpSession } from '../support/http-session';
import { sessionUserFor } from '../integration/support';
import { freezeDemoComparison } from '../support/saved-comparison';

let server: AppServer;
let visitor: HttpSession;
const slugs: string[] = [];
const removals: (() => Promise<void>)[] = [];

/**
 * Every trainee among the operators of the saved comparison's runs: the names and addresses that must
 * never reach a reviewer (the author, an instructor who may have run some of them too, is named as author).
 */
async function operatorsOf(slug: string): Promise<{ names: string[]; emails: string[] }> {
  const [row] = await sequelize.query<{ run_ids_json: string }>('SELECT run_ids_json FROM saved_comparisons WHERE slug = ?', { type: QueryTypes.SELECT, replacements: [slug] });
  const ids = (JSON.parse(row!.run_ids_json) as [number, string][]).map(([id]) => id);
  const people = await sequelize.query<{ name: string; email: string }>("SELECT DISTINCT u.name, u.email FROM runs r JOIN users u ON u.id = r.operator_id WHERE r.id IN (?) AND u.role = 'trainee'", { type: QueryTypes.SELECT, replacements: [ids] });
  return { names: people.map((p) => p.name), emails: people.map((p) => p.email) };
}

const tokenOf = (link: string) => link.split('/review/')[1]!;
const clearThrottle = () => sequelize.query("DELETE FROM sign_in_attempts WHERE attempt_key LIKE 'review:%'");

/** The page and every file of the package as text, plus the package's raw bytes as latin1 text. */
async function whatAReviewerGets(token: string): Promise<{ page: string; files: Record<string, string>; raw: string }> {
  const page = await visitor.get(`/review/${token}`);
  expect(page.status).toBe(200);
  const pkg = await visitor.get(`/api/review/${token}/package`);
  expect(pkg.status).toBe(200);
  expect(pkg.headers.get('content-type')).toBe('application/zip');
  const bytes = new Uint8Array(await pkg.arrayBuffer());
  const files = Object.fromEntries(Object.entries(unzipSync(bytes)).map(([name, data]) => [name, strFromU8(data)]));
  return { page: await page.text(), files, raw: Buffer.from(bytes).toString('latin1') };
}

function expectNoPerson(text: string, where: string, people: { names: string[]; emails: string[] }) {
  for (const name of people.names) expect(text.includes(name), `${where} holds the trainee name "${name}"`).toBe(false);
  for (const email of people.emails) expect(text.includes(email), `${where} holds the address "${email}"`).toBe(false);
}

beforeAll(async () => {
  await clearThrottle();
  const byMethod = await freezeDemoComparison('Methods on simulated runs (review link test)');
  slugs.push(byMethod.slug);
  removals.push(byMethod.remove);
  // An instructor's comparison by trainee: its frozen groups are labelled with the trainees' names.
  const instructor = await sessionUserFor(DEMO_ACCOUNTS.instructor);
  const { slug } = await freezeComparison(instructor, { title: 'Trainees side by side (review link test)', query: compareQuerySchema.parse({ by: 'trainee', source: 'both' }) });
  slugs.push(slug);
  removals.push(async () => void (await sequelize.query('DELETE FROM saved_comparisons WHERE slug = ?', { replacements: [slug] })));
  server = await startAppServer();
  visitor = anonymous(server.baseUrl);
});

afterAll(async () => {
  for (const remove of removals) await remove();
  await sequelize.query("DELETE FROM audit_log WHERE object_type = 'saved_comparison' AND action IN ('review_link', 'review_revoke')");
  await clearThrottle();
  await server?.stop();
  await sequelize.close();
});

describe('review links', () => {
  it('open the saved comparison and its package without a session, with no trainee name or address anywhere (page, package bytes, every file)', async () => {
    const researcher = await sessionUserFor(DEMO_ACCOUNTS.researcher);
    const { link } = await createReviewLink(researcher, slugs[0]!, { days: 30 });
    expect(link).toMatch(/\/review\/[A-Za-z0-9_-]{43}$/);
    const got = await whatAReviewerGets(tokenOf(link));
    expect(got.page).toContain('Methods on simulated runs (review link test)');
    expect(got.page).not.toContain('Open with today');
    const people = await operatorsOf(slugs[0]!);
    expect(people.names.length).toBeGreaterThan(0);
    expectNoPerson(got.page, 'the review page', people);
    expectNoPerson(got.raw, 'the package bytes', people);
    for (const [name, text] of Object.entries(got.files)) expectNoPerson(text, name, people);
    const runsCsv = Object.entries(got.files).find(([name]) => name.endsWith('data/runs.csv'))![1];
    expect(runsCsv).toMatch(/Operator [A-Z2-9]{6}/);
    // Stable pseudonyms: a second download of the same comparison names the operators alike.
    const again = await whatAReviewerGets(tokenOf(link));
    expect(Object.entries(again.files).find(([name]) => name.endsWith('data/runs.csv'))![1]).toBe(runsCsv);
  });

  it('pseudonymise a comparison by trainee whose frozen groups carry the trainees’ names', async () => {
    const instructor = await sessionUserFor(DEMO_ACCOUNTS.instructor);
    const [frozen] = await sequelize.query<{ results_json: string }>('SELECT results_json FROM saved_comparisons WHERE slug = ?', { type: QueryTypes.SELECT, replacements: [slugs[1]] });
    const people = await operatorsOf(slugs[1]!);
    // The frozen results name trainees (so the check below can fail).
    expect(people.names.some((name) => frozen!.results_json.includes(name))).toBe(true);
    const { link } = await createReviewLink(instructor, slugs[1]!, { days: 7 });
    const got = await whatAReviewerGets(tokenOf(link));
    expectNoPerson(got.page, 'the review page', people);
    for (const [name, text] of Object.entries(got.files)) expectNoPerson(text, name, people);
    expect(got.files[Object.keys(got.files).find((n) => n.endsWith('results.json'))!]).toMatch(/Operator [A-Z2-9]{6}/);
  });

  it('stop after they are withdrawn and after they expire; a wrong token is a plain 404', async () => {
    const researcher = await sessionUserFor(DEMO_ACCOUNTS.researcher);
    const { id, link } = await createReviewLink(researcher, slugs[0]!, { days: 1 });
    const token = tokenOf(link);
    expect((await visitor.get(`/review/${token}`)).status).toBe(200);
    await revokeReviewLink(researcher, slugs[0]!, id);
    expect((await visitor.get(`/review/${token}`)).status).toBe(404);
    expect((await visitor.get(`/api/review/${token}/package`)).status).toBe(404);

    // Made two days ago for one day: expired a day ago.
    const old = await createReviewLink(researcher, slugs[0]!, { days: 1 }, new Date(Date.now() - 2 * 86_400_000));
    expect((await visitor.get(`/review/${tokenOf(old.link)}`)).status).toBe(404);
    expect((await visitor.get(`/api/review/${tokenOf(old.link)}/package`)).status).toBe(404);

    const wrong = 'A'.repeat(43);
    expect((await visitor.get(`/review/${wrong}`)).status).toBe(404);
    const api = await visitor.get(`/api/review/${wrong}/package`);
    expect(api.status).toBe(404);
    expect(await api.text()).not.toContain('Methods on simulated runs');
    expect((await visitor.get('/review/not-a-token')).status).toBe(404);
  });

  it('are made and withdrawn only by the comparison’s author, and each is written to the audit log', async () => {
    const instructor = await sessionUserFor(DEMO_ACCOUNTS.instructor);
    const researcher = await sessionUserFor(DEMO_ACCOUNTS.researcher);
    await expect(createReviewLink(instructor, slugs[0]!, { days: 1 })).rejects.toThrow('does not exist');
    const { id } = await createReviewLink(researcher, slugs[0]!, { days: 1 });
    await expect(revokeReviewLink(instructor, slugs[0]!, id)).rejects.toThrow('does not exist');
    await revokeReviewLink(researcher, slugs[0]!, id);
    const [audit] = await sequelize.query<{ made: number; withdrawn: number }>(
      "SELECT SUM(action = 'review_link') AS made, SUM(action = 'review_revoke') AS withdrawn FROM audit_log WHERE object_type = 'saved_comparison' AND actor_id = ?",
      { type: QueryTypes.SELECT, replacements: [researcher.id] },
    );
    expect(Number(audit!.made)).toBeGreaterThanOrEqual(3);
    expect(Number(audit!.withdrawn)).toBeGreaterThanOrEqual(2);
  });
});
