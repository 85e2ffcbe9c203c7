/**
 * POST /api/uploads against the real app and MariaDB: each good shape stores readings equal to the
 * fixture's expected values (worked out by hand in tests/ingest/good.test.ts from each file's
 * construction), the same file twice is refused with the existing run's id, and an export of a
 * stored run re-imports as a step table with the same readings.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sequelize } from '@/lib/platform/db';
import { NM_PER_FT_LB } from '@/lib/ingest/units';
import { readUploadBytes } from '@/lib/data/runs/upload-file';
import type { AppServer } from '../support/app-server';
import type { HttpSession } from '../support/http-session';
import { goodFile, header, kN, mappingFor, postUpload, startUploadTestbed, storedSteps } from '../support/record-fixtures';
import { FOUR_STUD_JOINT } from '../ingest/joints';

let server: AppServer;
let instructor: HttpSession;
let trainee: HttpSession;
let jointId: number;
let instructorId: number;
let traineeId: number;
let ids: { methodId: number; lubricantId: number };
let stop: () => Promise<void>;

beforeAll(async () => {
  ({ server, instructor, trainee, jointId, instructorId, traineeId, ids, stop } = await startUploadTestbed('uploads'));
});

afterAll(async () => {
  await stop?.();
});

async function uploadGood(file: string, session = instructor, operator = () => instructorId) {
  const bytes = goodFile(file);
  const response = await postUpload(session, server.baseUrl, bytes, file, mappingFor(bytes, FOUR_STUD_JOINT), header(jointId, operator(), ids));
  const body = (await response.json()) as { runId?: number; status?: string; reviewReasons?: Array<{ rule: string }>; error?: { message: string; runId?: number } };
  return { response, body };
}

describe('POST /api/uploads', () => {
  it('stores a wide file with step and pass markers: each step read at its last row', async () => {
    const { response, body } = await uploadGood('wide-step-column.csv');
    expect(response.status, body.error?.message).toBe(201);
    const steps = await storedSteps(body.runId!);
    expect(steps.map(({ order, pass, position, loadsN }) => ({ order, pass, position, loadsN }))).toEqual([
      { order: 1, pass: 1, position: 1, loadsN: kN(24, 0, 0, 0) },
      { order: 2, pass: 1, position: 3, loadsN: kN(22, 0, 25, 0) },
      { order: 3, pass: 1, position: 2, loadsN: kN(21, 20, 24, 0) },
      { order: 4, pass: 1, position: 4, loadsN: kN(20, 19, 23, 26) },
      { order: 5, pass: 2, position: 1, loadsN: kN(40, 18, 22, 25) },
      { order: 6, pass: 2, position: 3, loadsN: kN(39, 17, 45, 24) },
      { order: 7, pass: 2, position: 2, loadsN: kN(38, 44, 44, 23) },
      { order: 8, pass: 2, position: 4, loadsN: kN(37, 43, 43, 46) },
    ]);
    const [upload] = await sequelize.query<{ id: number; size_bytes: number; sha256: string }>('SELECT id, size_bytes, sha256 FROM uploads WHERE run_id = ?', { type: 'SELECT' as never, replacements: [body.runId] });
    expect(Number(upload!.size_bytes)).toBe(goodFile('wide-step-column.csv').length);
    expect(Buffer.compare(await readUploadBytes(upload!.id), Buffer.from(goodFile('wide-step-column.csv')))).toBe(0);
  });

  it('stores a wide file without a marker with the steps derived from the loads', async () => {
    const { response, body } = await uploadGood('wide-no-marker.csv');
    expect(response.status, body.error?.message).toBe(201);
    expect((body as { derivedSteps?: boolean }).derivedSteps).toBe(true);
    const steps = await storedSteps(body.runId!);
    expect(steps.map((s) => s.loadsN)).toEqual([
      kN(30, 0, 0, 0), kN(29, 0, 30, 0), kN(28, 30, 29, 0), kN(27, 29, 28, 30),
      kN(60, 28, 27, 29), kN(59, 27, 60, 28), kN(58, 60, 59, 27), kN(57, 59, 58, 60),
    ]);
    expect(steps.map((s) => s.pass)).toEqual([1, 1, 1, 1, 2, 2, 2, 2]);
    // The normal path: two cross passes 1-3-2-4 as the test method prescribes, the studs at 71–75 % of
    // the 80 kN target (within 30 % of it, lib/run-check/check-band.ts): the run is complete.
    expect({ status: body.status, reasons: body.reviewReasons }).toEqual({ status: 'complete', reasons: [] });
  });


  it('stores a long file (time, stud, load), carrying unlisted studs forward', async () => {
    const { response, body } = await uploadGood('long-carry-forward.csv');
    expect(response.status, body.error?.message).toBe(201);
    expect((await storedSteps(body.runId!)).map((s) => [s.position, s.loadsN])).toEqual([
      [1, kN(30, 0, 0, 0)], [3, kN(29, 0, 30, 0)], [2, kN(28, 30, 29, 0)], [4, kN(27, 29, 28, 30)],
    ]);
    // One pass of the two the method prescribes: stored, and held for review with that reason.
    expect(body.status).toBe('needs_review');
    expect(body.reviewReasons?.map((r) => r.rule)).toContain('passes');
  });

  it('stores a step table with torque in ft-lb, converted to N·m', async () => {
    const { response, body } = await uploadGood('step-table-torque.csv');
    expect(response.status, body.error?.message).toBe(201);
    const steps = await storedSteps(body.runId!);
    expect(steps.map((s) => [s.pass, s.position, s.loadsN])).toEqual([[1, 1, kN(30, 0, 0, 0)], [1, 3, kN(29, 0, 30, 0)], [2, 1, kN(60, 0, 29, 0)]]);
    // 1 ft-lb = 1.3558179483314004 N·m (NIST SP 811 conversion factor).
    for (const [i, ftLb] of [100, 100, 200].entries()) expect(steps[i]!.appliedTorqueNm).toBeCloseTo(ftLb * NM_PER_FT_LB, 9);
  });

  it('refuses the same file twice with 409 and the existing run id', async () => {
    const first = await uploadGood('tab.tsv');
    expect(first.response.status, first.body.error?.message).toBe(201);
    const again = await uploadGood('tab.tsv');
    expect(again.response.status).toBe(409);
    expect(again.body.error?.runId).toBe(first.body.runId);
    expect(again.body.error?.message).toMatch(/already been uploaded \(run \d+\)/);
  });

  it('lets a trainee upload only as the operator', async () => {
    const asOther = await uploadGood('units-row.csv', trainee, () => instructorId);
    expect(asOther.response.status).toBe(403);
    expect(asOther.body.error?.message).toMatch(/only their own runs/);
    const own = await uploadGood('units-row.csv', trainee, () => traineeId);
    expect(own.response.status, own.body.error?.message).toBe(201);
  });

  it('round-trips: the selection export of a run uploads back as a step table with the same readings', async () => {
    const { body } = await uploadGood('bom-crlf.csv');
    const original = await storedSteps(body.runId!);
    const exported = await instructor.get(`/api/runs/export?format=csv&units=si&jointId=${jointId}&operatorId=${instructorId}&source=upload`);
    expect(exported.status).toBe(200);
    const csv = await exported.text();
    // Keep only this run's rows: the selection holds every run on the test joint.
    const lines = csv.split('\r\n');
    const one = [lines[0], ...lines.filter((l) => l.startsWith(`${body.runId},`))].join('\r\n') + '\r\n';
    const bytes = new TextEncoder().encode(one);
    const mapping = mappingFor(bytes, FOUR_STUD_JOINT);
    expect(mapping.shape).toBe('step_table');
    const again = await postUpload(instructor, server.baseUrl, bytes, 'export.csv', mapping, header(jointId, instructorId, ids));
    const againBody = (await again.json()) as { runId?: number; error?: { message: string } };
    expect(again.status, againBody.error?.message).toBe(201);
    expect(await storedSteps(againBody.runId!)).toEqual(original);
  });

  it('states the upload limit when a file is too large', async () => {
    const big = new Uint8Array(21 * 1024 * 1024).fill(0x31);
    const response = await postUpload(instructor, server.baseUrl, big, 'big.csv', {}, header(jointId, instructorId, ids));
    expect(response.status).toBe(413);
    expect(((await response.json()) as { error: { message: string } }).error.message).toContain('20 MB');
  });
});
