/**
 * Shared set-up of the record tests: invented test joints in the test database, the run header
 * of a demo account, uploads through the real server, and the stored readings read back with SQL.
 * All joints made here are named "Test joint … (invented)" and removed afterwards with their runs.
 */
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { QueryTypes } from 'sequelize';
import { sequelize } from '@/lib/platform/db';
import { assertTextFile } from '@/lib/ingest/text-file';
import { parseLoggerText } from '@/lib/ingest/parse-text';
import type { JointForImport } from '@/lib/ingest/normalise';
import type { HttpSession } from './http-session';

export const GOOD_DIR = path.resolve(__dirname, '../ingest/good');
export const CORPUS_DIR = path.resolve(__dirname, '../ingest/corpus');

/**
 * M20 × 2.5 studs of ASTM A193M B7 (the ingest tests' joints, tests/ingest/joints.ts): 4 studs for
 * the good fixtures, 8 for the bad-file corpus; target 80 kN.
 */
export async function createTestJoint(studCount: number, tag: string): Promise<number> {
  const now = new Date();
  const [id] = await sequelize.query(
    `INSERT INTO joints (name, nominal_size, pressure_class, stud_count, thread_system, thread_diameter, thread_pitch, stud_grade, gasket_type, target_load_n, band_percent, notes, created_at, updated_at)
     VALUES (?, 'training', 'training', ?, 'metric', 20, 2.5, 'ASTM A193M B7', 'none (test rig)', 80000, 10, 'Invented test joint.', ?, ?)`,
    { type: QueryTypes.INSERT, replacements: [`Test joint ${tag} ${studCount} studs ${Date.now()} (invented)`, studCount, now, now] },
  );
  for (let p = 1; p <= studCount; p++) {
    await sequelize.query('INSERT INTO joint_positions (joint_id, position, calibration_factor) VALUES (?,?,1)', { replacements: [Number(id), p] });
  }
  return Number(id);
}

/** The 4-stud cross order: opposite studs in turn (common practice), as the 4-stud fixtures tighten. */
export const CROSS_4 = [1, 3, 2, 4];

/**
 * An invented test method of cross passes at `percents` of target with a 4-stud order (the demo
 * methods have none for 4 studs), so a 4-stud test run can follow its method; remove it with
 * {@link dropTestMethods} after the runs that use it. A tensioner method gives its coverage
 * (how many studs its tool set pulls at once) and may carry orders for other stud counts.
 */
export async function createTestMethod(
  name: string,
  percents: number[],
  tensioner?: { coverage: 'every_stud' | 'every_second_stud' | 'one_stud'; orders?: Record<string, number[]> },
): Promise<number> {
  const now = new Date();
  const passes = percents.map((percentOfTarget) => ({ percentOfTarget, pattern: 'cross', orderByStudCount: tensioner?.orders ?? { '4': CROSS_4 } }));
  const [id] = await sequelize.query('INSERT INTO methods (name, tool_kind, passes, check_passes, tensioner_coverage, notes, created_at, updated_at) VALUES (?,?,?,0,?,NULL,?,?)', {
    type: QueryTypes.INSERT,
    replacements: [`${name} ${Date.now()} (invented)`, tensioner ? 'hydraulic_tensioner' : 'manual_torque_wrench', JSON.stringify(passes), tensioner?.coverage ?? 'one_stud', now, now],
  });
  return Number(id);
}

export async function dropTestMethods(ids: number[]): Promise<void> {
  if (ids.length) await sequelize.query('DELETE FROM methods WHERE id IN (?)', { replacements: [ids] });
}

/** Removes test joints with their runs (steps, readings, uploads, samples cascade). */
export async function dropTestJoints(ids: number[]): Promise<void> {
  if (!ids.length) return;
  await sequelize.query('DELETE FROM runs WHERE joint_id IN (?)', { replacements: [ids] });
  await sequelize.query('DELETE FROM stream_tokens WHERE joint_id IN (?)', { replacements: [ids] });
  await sequelize.query('DELETE FROM joints WHERE id IN (?)', { replacements: [ids] });
}

export async function userId(email: string): Promise<number> {
  const [row] = await sequelize.query<{ id: number }>('SELECT id FROM users WHERE email = ?', { type: QueryTypes.SELECT, replacements: [email] });
  if (!row) throw new Error(`no user ${email}`);
  return Number(row.id);
}

export async function firstIds(): Promise<{ methodId: number; lubricantId: number }> {
  const [m] = await sequelize.query<{ id: number }>('SELECT id FROM methods ORDER BY id LIMIT 1', { type: QueryTypes.SELECT });
  const [l] = await sequelize.query<{ id: number }>('SELECT id FROM lubricants ORDER BY id LIMIT 1', { type: QueryTypes.SELECT });
  return { methodId: Number(m!.id), lubricantId: Number(l!.id) };
}

export function header(jointId: number, operatorId: number, ids: { methodId: number; lubricantId: number }, cohortId: number | null = null) {
  return { jointId, methodId: ids.methodId, lubricantId: ids.lubricantId, operatorId, cohortId, recordedAt: '2026-03-31T09:30', notes: 'Invented test run.' };
}

export function mappingFor(bytes: Uint8Array, joint: JointForImport) {
  return parseLoggerText(assertTextFile(bytes, 20 * 1024 * 1024), undefined, joint).mapping;
}

export function goodFile(name: string): Uint8Array {
  return new Uint8Array(readFileSync(path.join(GOOD_DIR, name)));
}

/** POST /api/uploads as the browser does (multipart form data). */
export async function postUpload(session: HttpSession, baseUrl: string, bytes: Uint8Array, fileName: string, mapping: unknown, runHeader: unknown): Promise<Response> {
  const form = new FormData();
  form.append('file', new Blob([new Uint8Array(bytes)], { type: 'text/csv' }), fileName);
  form.append('mapping', JSON.stringify(mapping));
  form.append('header', JSON.stringify(runHeader));
  return fetch(`${baseUrl}/api/uploads`, { method: 'POST', headers: { cookie: session.cookie }, body: form });
}

/** The stored steps of a run with every stud's load in N, read back with SQL. */
export async function storedSteps(runId: number) {
  const rows = await sequelize.query<{ step_order: number; pass_number: number; tightened: number; position: number; load_n: number; applied_torque_nm: number | null }>(
    `SELECT s.step_order, s.pass_number, s.position AS tightened, r.position, r.load_n, s.applied_torque_nm
     FROM tightening_steps s JOIN readings r ON r.step_id = s.id WHERE s.run_id = ? ORDER BY s.step_order, r.position`,
    { type: QueryTypes.SELECT, replacements: [runId] },
  );
  const steps: Array<{ order: number; pass: number; position: number; loadsN: number[]; appliedTorqueNm: number | null }> = [];
  for (const row of rows) {
    let step = steps[steps.length - 1];
    if (!step || step.order !== Number(row.step_order)) {
      step = { order: Number(row.step_order), pass: Number(row.pass_number), position: Number(row.tightened), loadsN: [], appliedTorqueNm: row.applied_torque_nm === null ? null : Number(row.applied_torque_nm) };
      steps.push(step);
    }
    step.loadsN.push(Number(row.load_n));
  }
  return steps;
}

export async function tableCounts(): Promise<Record<'runs' | 'tightening_steps' | 'readings' | 'uploads', number>> {
  const out = { runs: 0, tightening_steps: 0, readings: 0, uploads: 0 };
  for (const table of ['runs', 'tightening_steps', 'readings', 'uploads'] as const) {
    const [row] = await sequelize.query<{ n: number }>(`SELECT COUNT(*) AS n FROM ${table}`, { type: QueryTypes.SELECT });
    out[table] = Number(row!.n);
  }
  return out;
}

export const kN = (...v: number[]) => v.map((x) => x * 1000);

/**
 * The shared set-up of the upload tests: the app, an instructor and a trainee signed in, a 4-stud
 * test joint and, as `ids.methodId`, two cross passes 50/100 % with a 4-stud order: the method the
 * 4-stud fixtures that are whole runs follow (wide-no-marker.csv), so those are stored complete.
 */
export async function startUploadTestbed(tag: string) {
  const { sharedAppServer } = await import('./shared-app-server');
  const { DEMO_ACCOUNTS, signInAs } = await import('./http-session');
  const server = sharedAppServer();
  const { lubricantId } = await firstIds();
  const methodId = await createTestMethod('Two cross passes 50/100 % (4 studs)', [50, 100]);
  const testbed = {
    server,
    instructor: await signInAs(server.baseUrl, DEMO_ACCOUNTS.instructor),
    trainee: await signInAs(server.baseUrl, DEMO_ACCOUNTS.trainee),
    jointId: await createTestJoint(4, tag),
    instructorId: await userId(DEMO_ACCOUNTS.instructor),
    traineeId: await userId(DEMO_ACCOUNTS.trainee),
    ids: { methodId, lubricantId },
    async stop() {
      await dropTestJoints([testbed.jointId]);
      await dropTestMethods([methodId]);
      await sequelize.close();
    },
  };
  return testbed;
}
