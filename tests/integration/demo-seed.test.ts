import { QueryTypes } from 'sequelize';
import { afterAll, describe, expect, it } from 'vitest';
import { sequelize } from '@/lib/platform/db';

afterAll(() => sequelize.close());

const one = async (sql: string) => (await sequelize.query<Record<string, number>>(sql, { type: QueryTypes.SELECT }))[0]!;

describe('the invented demo scenario in the test database', () => {
  it('has the people, cohorts, joints, methods and lubricants the foundation issue asks for', async () => {
    const roles = await sequelize.query<{ role: string; n: number }>('SELECT role, COUNT(*) AS n FROM users GROUP BY role', { type: QueryTypes.SELECT });
    const byRole = Object.fromEntries(roles.map((r) => [r.role, Number(r.n)]));
    expect(byRole.admin).toBeGreaterThanOrEqual(1);
    expect(byRole.instructor).toBeGreaterThanOrEqual(2);
    expect(byRole.researcher).toBeGreaterThanOrEqual(1);
    expect(byRole.trainee).toBeGreaterThanOrEqual(18);
    expect(Number((await one('SELECT COUNT(*) AS n FROM cohorts')).n)).toBeGreaterThanOrEqual(3);
    const studCounts = await sequelize.query<{ stud_count: number }>('SELECT stud_count FROM joints ORDER BY stud_count', { type: QueryTypes.SELECT });
    expect(studCounts.map((j) => Number(j.stud_count))).toEqual(expect.arrayContaining([8, 12]));
    expect(Number((await one('SELECT COUNT(*) AS n FROM methods')).n)).toBeGreaterThanOrEqual(4);
    expect(Number((await one('SELECT COUNT(*) AS n FROM lubricants')).n)).toBeGreaterThanOrEqual(3);
  });

  it('has at least 150 runs with a reading of every stud after every step', async () => {
    expect(Number((await one('SELECT COUNT(*) AS n FROM runs')).n)).toBeGreaterThanOrEqual(150);
    // Steps whose reading count differs from the run's stud count: there must be none.
    const incomplete = await one(`SELECT COUNT(*) AS n FROM (
      SELECT s.id FROM tightening_steps s JOIN runs r ON r.id = s.run_id LEFT JOIN readings g ON g.step_id = s.id
      GROUP BY s.id, r.stud_count HAVING COUNT(g.position) <> r.stud_count) AS t`);
    expect(Number(incomplete.n)).toBe(0);
    const stepless = await one('SELECT COUNT(*) AS n FROM runs r WHERE NOT EXISTS (SELECT 1 FROM tightening_steps s WHERE s.run_id = r.id)');
    expect(Number(stepless.n)).toBe(0);
  });

  it('stores per-run figures that agree with the readings (mean of the final loads)', async () => {
    const rows = await sequelize.query<{ id: number; stored: number; computed: number }>(
      `SELECT r.id, r.final_mean_n AS stored, AVG(g.load_n) AS computed FROM runs r
       JOIN tightening_steps s ON s.run_id = r.id AND s.step_order = r.step_count
       JOIN readings g ON g.step_id = s.id GROUP BY r.id, r.final_mean_n LIMIT 20`,
      { type: QueryTypes.SELECT },
    );
    expect(rows.length).toBe(20);
    for (const row of rows) expect(Math.abs(row.stored - row.computed) / row.computed).toBeLessThan(1e-9);
  });
});
