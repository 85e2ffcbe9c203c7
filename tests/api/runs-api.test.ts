import { QueryTypes } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sequelize } from '@/lib/platform/db';
import type { RunPage } from '@/lib/data/runs';
import type { AppServer } from '../support/app-server';
import { sharedAppServer } from '../support/shared-app-server';
import { DEMO_ACCOUNTS, signInAs, type HttpSession } from '../support/http-session';

let server: AppServer;
let researcher: HttpSession;
let trainee: HttpSession;
let instructor: HttpSession;

const count = async (sql: string, replacements: unknown[] = []) =>
  Number((await sequelize.query<{ n: number }>(sql, { type: QueryTypes.SELECT, replacements }))[0]!.n);

beforeAll(async () => {
  server = sharedAppServer();
  researcher = await signInAs(server.baseUrl, DEMO_ACCOUNTS.researcher);
  trainee = await signInAs(server.baseUrl, DEMO_ACCOUNTS.trainee);
  instructor = await signInAs(server.baseUrl, DEMO_ACCOUNTS.instructor);
});

afterAll(async () => {
  await sequelize.close();
});

const page = async (session: HttpSession, query: string) => {
  const response = await session.get(`/api/runs?${query}`);
  expect(response.status).toBe(200);
  return (await response.json()) as RunPage;
};

describe('GET /api/runs', () => {
  it('gives a researcher every run, with operators pseudonymised', async () => {
    const result = await page(researcher, 'pageSize=200');
    expect(result.total).toBe(await count('SELECT COUNT(*) AS n FROM runs'));
    const names = (await sequelize.query<{ name: string }>('SELECT name FROM users', { type: QueryTypes.SELECT })).map((u) => u.name);
    for (const row of result.rows) {
      expect(names).not.toContain(row.operatorName);
      expect(row.operatorName).toMatch(/^Operator [A-Z2-9]{6}$/);
    }
  });

  it('filters by method, lubricant, cohort and date range like SQL does', async () => {
    const [method] = await sequelize.query<{ id: number }>('SELECT id FROM methods ORDER BY id LIMIT 1', { type: QueryTypes.SELECT });
    const [lubricant] = await sequelize.query<{ id: number }>('SELECT id FROM lubricants ORDER BY id DESC LIMIT 1', { type: QueryTypes.SELECT });
    const [cohort] = await sequelize.query<{ id: number }>('SELECT id FROM cohorts ORDER BY id LIMIT 1', { type: QueryTypes.SELECT });
    expect((await page(researcher, `methodId=${method!.id}`)).total).toBe(await count('SELECT COUNT(*) AS n FROM runs WHERE method_id = ?', [method!.id]));
    expect((await page(researcher, `methodId=${method!.id}&lubricantId=${lubricant!.id}`)).total).toBe(
      await count('SELECT COUNT(*) AS n FROM runs WHERE method_id = ? AND lubricant_id = ?', [method!.id, lubricant!.id]),
    );
    expect((await page(researcher, `cohortId=${cohort!.id}`)).total).toBe(await count('SELECT COUNT(*) AS n FROM runs WHERE cohort_id = ?', [cohort!.id]));
    const inMarch = await page(researcher, 'from=2026-03-01&to=2026-03-31&pageSize=200');
    expect(inMarch.total).toBe(await count("SELECT COUNT(*) AS n FROM runs WHERE recorded_at >= '2026-03-01' AND recorded_at < '2026-04-01'"));
    for (const row of inMarch.rows) expect(row.recordedAt.slice(0, 7)).toBe('2026-03');
  });

  it('pages without overlap and sorts by CV when asked', async () => {
    const first = await page(researcher, 'pageSize=10&page=1&sort=finalCv&dir=asc');
    const second = await page(researcher, 'pageSize=10&page=2&sort=finalCv&dir=asc');
    expect(first.rows).toHaveLength(10);
    const ids = new Set(first.rows.map((r) => r.id));
    expect(second.rows.some((r) => ids.has(r.id))).toBe(false);
    const cvs = [...first.rows, ...second.rows].map((r) => r.finalCv ?? 0);
    for (let i = 1; i < cvs.length; i += 1) expect(cvs[i]!).toBeGreaterThanOrEqual(cvs[i - 1]!);
  });

  it('gives a trainee only their own runs', async () => {
    const result = await page(trainee, 'pageSize=200');
    const own = await count('SELECT COUNT(*) AS n FROM runs r JOIN users u ON u.id = r.operator_id WHERE u.email = ?', [DEMO_ACCOUNTS.trainee]);
    expect(own).toBeGreaterThan(0);
    expect(result.total).toBe(own);
    expect(new Set(result.rows.map((r) => r.operatorName)).size).toBe(1);
  });

  it('gives an instructor the runs of their cohorts and their own', async () => {
    const expected = await count(
      `SELECT COUNT(*) AS n FROM runs r JOIN users me ON me.email = ?
       WHERE r.operator_id = me.id OR r.cohort_id IN (SELECT id FROM cohorts WHERE instructor_id = me.id)`,
      [DEMO_ACCOUNTS.instructor],
    );
    expect((await page(instructor, 'pageSize=1')).total).toBe(expected);
    expect(expected).toBeLessThan(await count('SELECT COUNT(*) AS n FROM runs'));
  });

  it.each([
    ['pageSize=0', 'pageSize'],
    ['page=abc', 'page'],
    ['methodId=-3', 'methodId'],
    ['from=2026-13-45x', 'from'],
    ['sort=password', 'sort'],
    ['from=2026-05-01&to=2026-04-01', 'to'],
    ['unknownFilter=1', 'unknownFilter'],
  ])('answers 422 naming the field for %s', async (query, field) => {
    const response = await researcher.get(`/api/runs?${query}`);
    expect(response.status).toBe(422);
    const body = (await response.json()) as { error: { message: string; field?: string } };
    expect(body.error.message).toContain(field);
  });
});

describe('GET /api/runs/:id/export', () => {
  it('writes CSV loads to what the instrument resolves (10 N, 1 lbf) and keeps full precision in JSON', async () => {
    // A demo run with readings that are not whole tens of newtons (the simulator's loads are not).
    const [run] = await sequelize.query<{ id: number }>(
      `SELECT r.id FROM runs r JOIN readings g ON g.run_id = r.id WHERE MOD(g.load_n, 10) <> 0 ORDER BY r.id LIMIT 1`,
      { type: QueryTypes.SELECT },
    );
    const stored = await sequelize.query<{ load_n: number }>(
      'SELECT g.load_n FROM readings g JOIN tightening_steps s ON s.id = g.step_id WHERE g.run_id = ? ORDER BY s.step_order, g.position',
      { type: QueryTypes.SELECT, replacements: [run!.id] },
    );
    const csvLoads = async (units: string) => {
      const text = await (await researcher.get(`/api/runs/${run!.id}/export?format=csv&units=${units}`)).text();
      return text.trim().split('\r\n').slice(1).map((line) => line.split(',')[5]!);
    };
    const si = await csvLoads('si');
    expect(si).toHaveLength(stored.length);
    // 0.01 kN: a whole number of tens of newtons, within 5 N of the stored reading.
    si.forEach((cell, i) => {
      expect(cell).toMatch(/^-?\d*0$/);
      expect(Math.abs(Number(cell) - Number(stored[i]!.load_n))).toBeLessThanOrEqual(5);
    });
    // 1 lbf = 4.4482216152605 N (exact by definition): whole pound-force.
    (await csvLoads('us')).forEach((cell, i) => {
      expect(cell).toMatch(/^-?\d+$/);
      expect(Math.abs(Number(cell) - Number(stored[i]!.load_n) / 4.4482216152605)).toBeLessThanOrEqual(0.5);
    });
    const json = (await (await researcher.get(`/api/runs/${run!.id}/export?format=json&units=si`)).json()) as { rows: { load: number }[] };
    expect(json.rows.map((r) => r.load)).toEqual(stored.map((r) => Number(r.load_n)));
  });
});
