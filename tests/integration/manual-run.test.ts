/**
 * The hand-entry grid's save (saveManualRun, what the server action calls) against the test
 * database: one run in one transaction, step order from the method, loads converted to N; a trainee
 * cannot save as another operator; a bad cell is named by row and stud.
 */
import { QueryTypes } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sequelize } from '@/lib/platform/db';
import { AppError } from '@/lib/http/errors';
import { planSteps } from '@/lib/record/step-plan';
import { saveManualRun } from '@/lib/data/runs/manual-run';
import type { SessionUser } from '@/lib/auth/session';
import { Method } from '@/models';
import { DEMO_ACCOUNTS } from '../support/http-session';
import { createTestMethod, dropTestMethods, firstIds, header, storedSteps, tableCounts } from '../support/record-fixtures';
import { loadRun } from '@/lib/data/run-report';
import { sessionUserOf } from '../support/session-users';

let instructor: SessionUser;
let trainee: SessionUser;
let jointId: number;
let ids: { methodId: number; lubricantId: number };
let method: Method;
const created: number[] = [];

beforeAll(async () => {
  instructor = await sessionUserOf(DEMO_ACCOUNTS.instructor);
  trainee = await sessionUserOf(DEMO_ACCOUNTS.trainee);
  const [joint] = await sequelize.query<{ id: number }>('SELECT id FROM joints WHERE stud_count = 8 ORDER BY id LIMIT 1', { type: QueryTypes.SELECT });
  jointId = Number(joint!.id);
  ids = await firstIds();
  method = (await Method.findByPk(ids.methodId))!;
});

const methods: number[] = [];

afterAll(async () => {
  if (created.length) await sequelize.query('DELETE FROM runs WHERE id IN (?)', { replacements: [created] });
  await dropTestMethods(methods);
  await sequelize.close();
});

async function caught(fn: () => Promise<unknown>): Promise<AppError> {
  try {
    await fn();
  } catch (e) {
    if (e instanceof AppError) return e;
    throw e;
  }
  throw new Error('expected an AppError');
}

async function saveManualRunRows(unit: 'kN' | 'N', rows: string[][]): Promise<number> {
  const { runId } = await saveManualRun(instructor, { header: header(jointId, instructor.id, ids), unit, rows });
  created.push(runId);
  return runId;
}

describe('saveManualRun', () => {
  it('saves one run with the method order and loads converted from kN to N', async () => {
    const plan = planSteps(method, 8);
    expect(plan.problem).toBeNull();
    // Two steps typed: the first stud tightened to 20 kN, then the second to 21 kN while the first relaxes to 19.5.
    const first = plan.steps[0]!.position;
    const second = plan.steps[1]!.position;
    const row1 = Array.from({ length: 8 }, (_, i) => (i + 1 === first ? 20 : 0));
    const row2 = row1.map((v, i) => (i + 1 === first ? 19.5 : i + 1 === second ? 21 : v));
    const before = await tableCounts();
    const { runId, stepCount } = await saveManualRun(instructor, { header: header(jointId, instructor.id, ids), unit: 'kN', rows: [row1, row2, Array(8).fill(null)] });
    created.push(runId);
    expect(stepCount).toBe(2);
    const after = await tableCounts();
    expect(after.runs - before.runs).toBe(1);
    expect(after.readings - before.readings).toBe(16);
    const steps = await storedSteps(runId);
    expect(steps.map((s) => [s.position, s.pass])).toEqual([[first, 1], [second, 1]]);
    expect(steps[1]!.loadsN).toEqual(row2.map((v) => v * 1000));
    const [run] = await sequelize.query<{ source: string; status: string; review_reasons: string }>('SELECT source, status, review_reasons FROM runs WHERE id = ?', { type: QueryTypes.SELECT, replacements: [runId] });
    // Two steps of a method with more: the run check (issue 15) holds it for review, stored whole.
    expect(run).toMatchObject({ source: 'manual', status: 'needs_review' });
    expect((JSON.parse(run!.review_reasons) as Array<{ rule: string; message: string }>)[0]!.message).toMatch(/^The run has 1 pass and 2 steps; the method ".*" prescribes \d+ pass(es)? and \d+ steps for 8 studs\.$/);
  });

  it('refuses a trainee saving a run as another operator, and stores nothing', async () => {
    const before = await tableCounts();
    const err = await caught(() => saveManualRun(trainee, { header: header(jointId, instructor.id, ids), unit: 'kN', rows: [Array(8).fill(1)] }));
    expect(err.code).toBe('forbidden');
    expect(err.message).toMatch(/only their own runs/);
    expect(await tableCounts()).toEqual(before);
  });

  it('names the row and stud of a missing load', async () => {
    const row = Array(8).fill(10);
    row[4] = null;
    const err = await caught(() => saveManualRun(instructor, { header: header(jointId, instructor.id, ids), unit: 'kN', rows: [Array(8).fill(10), row] }));
    expect(err.code).toBe('invalid_input');
    expect(err.message).toMatch(/^Row 2 .*stud 5: the load is missing/);
    expect(err.details).toMatchObject({ row: 2, column: 'Stud 5' });
  });

  it('names the limit for an absurd load (a kN value typed while N was chosen the other way round)', async () => {
    const err = await caught(() => saveManualRun(instructor, { header: header(jointId, instructor.id, ids), unit: 'kN', rows: [Array(8).fill(90000)] }));
    expect(err.message).toMatch(/^Row 1 .*stud 1: the load 90000 kN is above the limit of/);
  });

  it('reads typed text by the decimal-comma rule of lib/format/parse-number.ts and names an unclear cell', async () => {
    // "1,500" N is fifteen hundred newtons and "1,5" kN one and a half kilonewtons (issue 14's rule).
    const typed = await saveManualRunRows('N', [Array(8).fill('1,500')]);
    expect((await storedSteps(typed))[0]!.loadsN).toEqual(Array(8).fill(1500));
    const err = await caught(() => saveManualRunRows('kN', [['0,500', ...Array(7).fill('1,5')]]));
    expect(err.message).toMatch(/^Row 1, stud 1: "0,500" is unclear/);
    expect(err.details).toMatchObject({ row: 1, column: 'Stud 1' });
  });

  describe('tensioner rows that name several studs', () => {
    // A 50 % coverage tensioner method of one pass on the 8-stud joint: the odd studs, then the even ones (common
    // practice). Invented loads in kN, T = the joint's target: each pull leaves T and applies 1.15 T (applied =
    // residual × LTF, LTF 1.15 the floor of the tens1 rule, docs/REFERENCE.md §4); the odd studs ease to 0.98 T,
    // inside the joint's band, when the even ones are pulled.
    const ODD = [1, 3, 5, 7];
    const EVEN = [2, 4, 6, 8];
    let T = 0;
    let row1: number[] = [];
    let row2: number[] = [];
    const pull = (studs: number[], kn: number) => ({ studs: studs.join(' '), applied: Array.from({ length: 8 }, (_, i) => (studs.includes(i + 1) ? kn : null)) });
    let tensionerIds: { methodId: number; lubricantId: number };

    beforeAll(async () => {
      const [joint] = await sequelize.query<{ target_load_n: number }>('SELECT target_load_n FROM joints WHERE id = ?', { type: QueryTypes.SELECT, replacements: [jointId] });
      T = Math.round(Number(joint!.target_load_n) / 100) / 10; // kN to one decimal
      row1 = [T, 0, T, 0, T, 0, T, 0];
      row2 = row1.map((v, i) => (i % 2 === 0 ? Math.round(T * 98) / 100 : T));
      const methodId = await createTestMethod('Tensioner 50 % (hand entry)', [100], { coverage: 'every_second_stud', orders: { '8': [1, 5, 3, 7, 2, 6, 4, 8] } });
      methods.push(methodId);
      tensionerIds = { methodId, lubricantId: ids.lubricantId };
    });

    it('stores each row as one step with the applied and residual load of every stud it names, as ingest does', async () => {
      const applied = Math.round(T * 115) / 100;
      const { runId, stepCount, status } = await saveManualRun(instructor, { header: header(jointId, instructor.id, tensionerIds), unit: 'kN', rows: [row1, row2], pulls: [pull(ODD, applied), pull(EVEN, applied)] });
      created.push(runId);
      expect(stepCount).toBe(2);
      const [count] = await sequelize.query<{ n: number }>('SELECT COUNT(*) AS n FROM step_positions WHERE run_id = ?', { type: QueryTypes.SELECT, replacements: [runId] });
      expect(Number(count!.n)).toBe(8);
      const { run } = await loadRun(instructor, runId);
      expect(run.steps.map((s) => s.covers?.map((c) => c.position))).toEqual([ODD, EVEN]);
      // Stud 1 was pulled in step 1: applied 1.15 T, residual its row-1 load, T (kN → N: × 1000, the SI prefix).
      expect(run.steps[0]!.covers![0]!.position).toBe(1);
      expect(run.steps[0]!.covers![0]!.appliedN).toBeCloseTo(applied * 1000, 6);
      expect(run.steps[0]!.covers![0]!.residualN).toBeCloseTo(T * 1000, 6);
      // One pass of odd then even steps is what the run check asks of a 50 % coverage method with one pass.
      expect(status).toBe('complete');
    });

    it('refuses a stud named twice or out of range, naming the row, and stores nothing', async () => {
      const before = await tableCounts();
      const twice = await caught(() => saveManualRun(instructor, { header: header(jointId, instructor.id, tensionerIds), unit: 'kN', rows: [row1, row2], pulls: [pull(ODD, 60), { ...pull(EVEN, 60), studs: '2 4 6 6' }] }));
      expect(twice.message).toBe('Row 2 (pass 1): stud 6 is named twice.');
      expect(twice.details).toMatchObject({ row: 2, column: 'Studs' });
      const outside = await caught(() => saveManualRun(instructor, { header: header(jointId, instructor.id, tensionerIds), unit: 'kN', rows: [row1], pulls: [{ ...pull(ODD, 60), studs: '1 3 5 9' }] }));
      expect(outside.message).toBe('Row 1 (pass 1): stud 9 is not on this joint (studs 1 to 8).');
      expect(await tableCounts()).toEqual(before);
    });

    it('refuses rows of several studs for a torque method', async () => {
      const err = await caught(() => saveManualRun(instructor, { header: header(jointId, instructor.id, ids), unit: 'kN', rows: [row1], pulls: [pull(ODD, 60)] }));
      expect(err.message).toMatch(/^Only a tensioner step pulls several studs at once; the method ".*" tightens one stud per step\.$/);
    });
  });
});
