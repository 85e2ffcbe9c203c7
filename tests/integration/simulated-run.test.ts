import { QueryTypes } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sequelize } from '@/lib/platform/db';
import { saveSimulatedRun } from '@/lib/data/runs/simulated-run';
import { classroomLibrary } from '@/lib/data/classroom';
import { sideForRealRun, simulateSide } from '@/lib/classroom/scenes';
import type { SessionUser } from '@/lib/auth/session';
import { DEMO_ACCOUNTS } from '../support/http-session';
import { count, sessionUserFor } from './support';
import { createTestMethod, dropTestMethods } from '../support/record-fixtures';

// "Simulate" on /record: one simulated run of the chosen joint/method/lubricant, stored like any
// other run. Expected values come from the simulator's own contract (lib/sim/MODEL.md): same seed,
// same run; one step per stud per pass plus the check passes.
let trainee: SessionUser;
let other: SessionUser;
let instructor: SessionUser;
let ids: { joint: number; method: number; lubricant: number; studs: number; passes: number; checks: number };
const created: number[] = [];
const methods: number[] = [];

beforeAll(async () => {
  trainee = await sessionUserFor(DEMO_ACCOUNTS.trainee);
  other = await sessionUserFor(DEMO_ACCOUNTS.researcher);
  instructor = await sessionUserFor(DEMO_ACCOUNTS.instructor);
  const [row] = await sequelize.query<{ joint: number; studs: number; method: number; passes: string; checks: number; lubricant: number }>(
    `SELECT j.id AS joint, j.stud_count AS studs, m.id AS method, m.passes, m.check_passes AS checks, (SELECT id FROM lubricants ORDER BY id LIMIT 1) AS lubricant
     FROM joints j JOIN methods m ON m.name LIKE 'Three cross passes%' WHERE j.stud_count = 8 ORDER BY j.id, m.id LIMIT 1`,
    { type: QueryTypes.SELECT },
  );
  const passes = (typeof row!.passes === 'string' ? JSON.parse(row!.passes) : row!.passes) as unknown[];
  ids = { joint: row!.joint, method: row!.method, lubricant: row!.lubricant, studs: row!.studs, passes: passes.length, checks: row!.checks };
});

afterAll(async () => {
  if (created.length) await sequelize.query('DELETE FROM runs WHERE id IN (?)', { replacements: [created] });
  await dropTestMethods(methods);
  await sequelize.close();
});

const input = (operatorId: number, seed: unknown, lubricantId = ids.lubricant) => ({
  header: { jointId: ids.joint, methodId: ids.method, lubricantId, operatorId, cohortId: null, recordedAt: '2026-12-01T10:00', notes: null },
  gasket: 'medium',
  seed,
});

describe('saveSimulatedRun', () => {
  it('stores a simulated run with one step per stud per pass; another seed gives another run', async () => {
    const first = await saveSimulatedRun(trainee, input(trainee.id, 4242));
    const other = await saveSimulatedRun(trainee, input(trainee.id, 4243));
    created.push(first.runId, other.runId);
    expect(first.alreadyStored).toBe(false);
    expect(other.alreadyStored).toBe(false);
    expect(first.stepCount).toBe(ids.studs * (ids.passes + ids.checks));
    const rows = await sequelize.query<{ source: string; final_loads_json: string; operator_id: number; status: string }>('SELECT source, final_loads_json, operator_id, status FROM runs WHERE id IN (?) ORDER BY id', {
      type: QueryTypes.SELECT,
      replacements: [[first.runId, other.runId]],
    });
    expect(rows.map((r) => r.source)).toEqual(['simulated', 'simulated']);
    // The simulator follows the method with loads near the target (lib/sim/MODEL.md): the run check passes it.
    expect(rows.map((r) => r.status)).toEqual(['complete', 'complete']);
    expect(rows[0]!.operator_id).toBe(trainee.id);
    expect(rows[0]!.final_loads_json).not.toBe(rows[1]!.final_loads_json);
    expect(await count('SELECT COUNT(*) AS n FROM readings WHERE run_id = ?', [first.runId])).toBe(first.stepCount * ids.studs);
  });

  // Issue 15 item 6: Simulate with the same header and seed twice stored two identical runs.
  it('stores the same header and seed once: the second request answers with the first run and stores nothing', async () => {
    const first = await saveSimulatedRun(trainee, input(trainee.id, 5151));
    created.push(first.runId);
    const runsBefore = await count('SELECT COUNT(*) AS n FROM runs');
    const readingsBefore = await count('SELECT COUNT(*) AS n FROM readings');
    const again = await saveSimulatedRun(trainee, input(trainee.id, 5151));
    // Only the recorded-at time and the notes differ: the simulator gives the same run, so it is the same request.
    const later = await saveSimulatedRun(trainee, { ...input(trainee.id, 5151), header: { ...input(trainee.id, 5151).header, recordedAt: '2026-12-02T11:00', notes: 'again' } });
    expect(again).toMatchObject({ runId: first.runId, alreadyStored: true, stepCount: first.stepCount });
    expect(later).toMatchObject({ runId: first.runId, alreadyStored: true });
    expect(await count('SELECT COUNT(*) AS n FROM runs')).toBe(runsBefore);
    expect(await count('SELECT COUNT(*) AS n FROM readings')).toBe(readingsBefore);
    // Two at once: the unique key lets one store, the other answers with that run.
    const [a, b] = await Promise.all([saveSimulatedRun(trainee, input(trainee.id, 6161)), saveSimulatedRun(trainee, input(trainee.id, 6161))]);
    created.push(a.runId);
    expect(b.runId).toBe(a.runId);
    expect(await count('SELECT COUNT(*) AS n FROM runs WHERE id = ? OR simulation_key = (SELECT simulation_key FROM runs WHERE id = ?)', [a.runId, a.runId])).toBe(1);
  });

  it('refuses a trainee recording as someone else, and a bad seed, writing nothing', async () => {
    const before = await count('SELECT COUNT(*) AS n FROM runs');
    await expect(saveSimulatedRun(trainee, input(other.id, 7))).rejects.toMatchObject({ code: 'forbidden' });
    await expect(saveSimulatedRun(trainee, input(trainee.id, 'abc'))).rejects.toMatchObject({ code: 'invalid_input' });
    await expect(saveSimulatedRun(trainee, { ...input(trainee.id, 7), gasket: 'rubber' })).rejects.toMatchObject({ code: 'invalid_input' });
    expect(await count('SELECT COUNT(*) AS n FROM runs')).toBe(before);
  });
});

// Issue 14: the same joint, method, lubricant and seed scattered differently on the Record page and
// in the Classroom (two adapters with different nut-factor scatter). Expected: the run Record
// stores equals, step by step, the run the Classroom simulates (and saves) for the same library
// rows, medium gasket and seed — for each of the demo library's lubricants (dry, copper, MoS₂).
describe('Record and Classroom simulate the same run', () => {
  it('gives the same loads after every step through both paths for every lubricant', async () => {
    const library = await classroomLibrary(instructor);
    const joint = library.joints.find((j) => j.id === ids.joint)!;
    const method = library.methods.find((m) => m.id === ids.method)!;
    expect(library.lubricants.length).toBeGreaterThanOrEqual(3);
    for (const lubricant of library.lubricants) {
      const saved = await saveSimulatedRun(trainee, input(trainee.id, 90210, lubricant.id));
      created.push(saved.runId);
      const classroom = simulateSide(sideForRealRun(joint, method, lubricant), joint, 90210);
      const readings = await sequelize.query<{ step_order: number; position: number; load_n: number }>(
        'SELECT s.step_order, g.position, g.load_n FROM tightening_steps s JOIN readings g ON g.step_id = s.id WHERE s.run_id = ? ORDER BY s.step_order, g.position',
        { type: QueryTypes.SELECT, replacements: [saved.runId] },
      );
      expect(readings).toHaveLength(classroom.steps.length * joint.studCount);
      for (const r of readings) {
        const expected = classroom.steps[Number(r.step_order) - 1]!.loadsN[Number(r.position) - 1]!;
        // Relative to the target: loads of studs not yet tightened may be 0.
        expect(Math.abs(Number(r.load_n) - expected) / joint.targetLoadN, `${lubricant.name}, step ${r.step_order}, position ${r.position}`).toBeLessThan(1e-12);
      }
      const [row] = await sequelize.query<{ final_loads_json: string }>('SELECT final_loads_json FROM runs WHERE id = ?', { type: QueryTypes.SELECT, replacements: [saved.runId] });
      expect(row!.final_loads_json).toBe(JSON.stringify(classroom.steps.at(-1)!.loadsN));
    }
  });

  it('simulates a library tensioner method by its coverage: two steps per pass at 50 %, each stud with applied and residual load', async () => {
    // 50 % tensioner coverage on 8 studs: studs 1, 3, 5, 7 then 2, 4, 6, 8 (common practice); two passes at 100 %.
    const methodId = await createTestMethod('Tensioner 50 % (simulate)', [100, 100], { coverage: 'every_second_stud', orders: { '8': [1, 5, 3, 7, 2, 6, 4, 8] } });
    methods.push(methodId);
    const saved = await saveSimulatedRun(trainee, { ...input(trainee.id, 777), header: { ...input(trainee.id, 777).header, methodId } });
    created.push(saved.runId);
    expect(saved.stepCount).toBe(4);
    const covers = await sequelize.query<{ step_order: number; position: number; applied_n: number; residual_n: number }>(
      'SELECT s.step_order, p.position, p.applied_n, p.residual_n FROM step_positions p JOIN tightening_steps s ON s.id = p.step_id WHERE p.run_id = ? ORDER BY s.step_order, p.position',
      { type: QueryTypes.SELECT, replacements: [saved.runId] },
    );
    expect([1, 2, 3, 4].map((o) => covers.filter((c) => Number(c.step_order) === o).map((c) => Number(c.position)))).toEqual([[1, 3, 5, 7], [2, 4, 6, 8], [1, 3, 5, 7], [2, 4, 6, 8]]);
    // Applied = residual × LTF with LTF above 1 (docs/REFERENCE.md §4): every pull applies more than it leaves.
    for (const c of covers) expect(Number(c.applied_n)).toBeGreaterThan(Number(c.residual_n));
    // The run check holds the run to the method's groups: no pass or order reason.
    const [run] = await sequelize.query<{ review_reasons: string | null }>('SELECT review_reasons FROM runs WHERE id = ?', { type: QueryTypes.SELECT, replacements: [saved.runId] });
    const rules = (JSON.parse(run!.review_reasons ?? '[]') as Array<{ rule: string }>).map((r) => r.rule);
    expect(rules).not.toContain('passes');
    expect(rules).not.toContain('step_order');
  });
});
