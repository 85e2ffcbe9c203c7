import { QueryTypes } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sequelize } from '@/lib/platform/db';
import type { AppServer } from '../support/app-server';
import { sharedAppServer } from '../support/shared-app-server';
import { DEMO_ACCOUNTS, signInAs, type HttpSession } from '../support/http-session';

/**
 * GET /api/runs/:id/analysis serves the analysis stored with the run, with its ETag, and answers
 * 304 Not Modified when If-None-Match names it (RFC 9110 §13.1.2, §15.4.5). Expected values are
 * the run's readings as SQL reads them.
 */
let server: AppServer;
let researcher: HttpSession;
let trainee: HttpSession;

const select = <T extends object>(sql: string, replacements: unknown[] = []) => sequelize.query<T>(sql, { type: QueryTypes.SELECT, replacements });

beforeAll(async () => {
  server = sharedAppServer();
  researcher = await signInAs(server.baseUrl, DEMO_ACCOUNTS.researcher);
  trainee = await signInAs(server.baseUrl, DEMO_ACCOUNTS.trainee);
});

afterAll(async () => {
  await sequelize.close();
});

/** A complete run with readings, and the loads after its last step as SQL reads them. */
async function runWithLastLoads(where = '1 = 1', replacements: unknown[] = []) {
  const [run] = await select<{ id: number; operator_id: number }>(
    `SELECT r.id, r.operator_id FROM runs r WHERE r.step_count > 8 AND ${where} ORDER BY r.id LIMIT 1`,
    replacements,
  );
  const loads = await select<{ load_n: number }>(
    `SELECT g.load_n FROM readings g JOIN tightening_steps s ON s.id = g.step_id
     WHERE s.run_id = ? AND s.step_order = (SELECT MAX(step_order) FROM tightening_steps WHERE run_id = ?) ORDER BY g.position`,
    [run!.id, run!.id],
  );
  return { id: run!.id, operatorId: run!.operator_id, lastLoads: loads.map((l) => Number(l.load_n)) };
}

describe('GET /api/runs/:id/analysis', () => {
  it('serves the stored analysis with its ETag, revalidated by the browser', async () => {
    const run = await runWithLastLoads();
    const response = await researcher.get(`/api/runs/${run.id}/analysis`);
    expect(response.status).toBe(200);
    const etag = response.headers.get('etag');
    expect(etag).toMatch(/^"[\w-]{32}"$/);
    expect(response.headers.get('cache-control')).toBe('private, no-cache');
    const body = (await response.json()) as { runId: number; finalLoadsN: number[]; figures: { meanN: number } };
    expect(body.runId).toBe(run.id);
    expect(body.finalLoadsN).toEqual(run.lastLoads);
    expect(body.figures.meanN).toBeCloseTo(run.lastLoads.reduce((a, b) => a + b, 0) / run.lastLoads.length, 6);
    const [stored] = await select<{ etag: string }>('SELECT etag FROM run_analyses WHERE run_id = ?', [run.id]);
    expect(stored?.etag).toBe(etag);
  });

  it('answers 304 with no body when If-None-Match names the ETag, 200 when it names another', async () => {
    const run = await runWithLastLoads();
    const etag = (await researcher.get(`/api/runs/${run.id}/analysis`)).headers.get('etag')!;
    const repeat = await researcher.send('GET', `/api/runs/${run.id}/analysis`, undefined, { 'if-none-match': etag });
    expect(repeat.status).toBe(304);
    expect(repeat.headers.get('etag')).toBe(etag);
    expect(await repeat.text()).toBe('');
    const other = await researcher.send('GET', `/api/runs/${run.id}/analysis`, undefined, { 'if-none-match': '"not-this-one"' });
    expect(other.status).toBe(200);
    expect(((await other.json()) as { finalLoadsN: number[] }).finalLoadsN).toEqual(run.lastLoads);
  });

  it('analyses and keeps a run stored before analyses were kept, under the same ETag', async () => {
    const run = await runWithLastLoads();
    const etag = (await researcher.get(`/api/runs/${run.id}/analysis`)).headers.get('etag');
    await sequelize.query('DELETE FROM run_analyses WHERE run_id = ?', { replacements: [run.id] });
    const again = await researcher.get(`/api/runs/${run.id}/analysis`);
    expect(again.status).toBe(200);
    expect(again.headers.get('etag')).toBe(etag);
    expect(((await again.json()) as { finalLoadsN: number[] }).finalLoadsN).toEqual(run.lastLoads);
    const [kept] = await select<{ etag: string }>('SELECT etag FROM run_analyses WHERE run_id = ?', [run.id]);
    expect(kept?.etag).toBe(etag);
  });

  it('refuses a run that is not the viewer’s even with its ETag (404, never 304)', async () => {
    const [me] = await select<{ id: number }>('SELECT id FROM users WHERE email = ?', [DEMO_ACCOUNTS.trainee]);
    const run = await runWithLastLoads('r.operator_id <> ?', [me!.id]);
    const etag = (await researcher.get(`/api/runs/${run.id}/analysis`)).headers.get('etag')!;
    const response = await trainee.send('GET', `/api/runs/${run.id}/analysis`, undefined, { 'if-none-match': etag });
    expect(response.status).toBe(404);
  });
});
