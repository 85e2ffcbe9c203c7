/**
 * The live stream against the real app: bearer-token auth (missing or unknown 401, revoked 403,
 * another joint's run 404), the bridge CLI streaming a fixture into a recording run, the readings
 * arriving through GET /api/runs/:id/stream, and Finish deriving the steps. The fixture is
 * tests/ingest/good/wide-no-marker.csv (invented) turned into one reading per stud per scan, in N;
 * its steps, worked out by hand in tests/ingest/good.test.ts, are the expected ones here. Also: the
 * bridge reading the same file unchanged in the joint's own line layout (time, then one kN field per
 * channel: the joint's training-default line format), and the signed-in browser's batches (Connect
 * logger) taken with the session instead of a token.
 */
import { mkdtempSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sequelize } from '@/lib/platform/db';
import { createStreamToken, revokeStreamToken } from '@/lib/data/stream-tokens';
import { finishRecording, startRecording } from '@/lib/data/runs/live-stream';
import type { SessionUser } from '@/lib/auth/session';
import type { AppServer } from '../support/app-server';
import { sharedAppServer } from '../support/shared-app-server';
import { DEMO_ACCOUNTS, signInAs, type HttpSession } from '../support/http-session';
import { createTestJoint, createTestMethod, dropTestJoints, dropTestMethods, firstIds, GOOD_DIR, header, kN, storedSteps } from '../support/record-fixtures';
import { sessionUserOf } from '../support/session-users';
import { runBridge, wideFixtureAsStream } from '../support/stream-fixture';

let server: AppServer;
let instructorHttp: HttpSession;
let instructor: SessionUser;
let jointId: number;
let otherJointId: number;
let ids: { methodId: number; lubricantId: number };

beforeAll(async () => {
  server = sharedAppServer();
  instructorHttp = await signInAs(server.baseUrl, DEMO_ACCOUNTS.instructor);
  instructor = await sessionUserOf(DEMO_ACCOUNTS.instructor);
  jointId = await createTestJoint(4, 'stream');
  otherJointId = await createTestJoint(4, 'stream-other');
  // Two cross passes with a 4-stud order: the method the streamed fixture follows (wide-no-marker.csv).
  ids = { ...(await firstIds()), methodId: await createTestMethod('Two cross passes 50/100 % (4 studs, stream)', [50, 100]) };
});

afterAll(async () => {
  await dropTestJoints([jointId, otherJointId]);
  await dropTestMethods([ids.methodId]);
  await sequelize.close();
});

const postStream = (runId: number, body: string, token?: string) =>
  fetch(`${server.baseUrl}/api/runs/${runId}/stream`, { method: 'POST', headers: token ? { authorization: `Bearer ${token}` } : {}, body });

describe('POST /api/runs/:id/stream', () => {
  it('refuses a missing or unknown token (401), a revoked one (403) and another joint\'s run (404)', async () => {
    const { runId } = await startRecording(instructor, header(jointId, instructor.id, ids));
    const reading = '{"t":0,"stud":1,"load":0}';
    expect((await postStream(runId, reading)).status).toBe(401);
    expect((await postStream(runId, reading, 'evl_not-a-token')).status).toBe(401);
    const other = await createStreamToken(instructor, otherJointId, 'Other bay (test)');
    expect((await postStream(runId, reading, other.token)).status).toBe(404);
    const mine = await createStreamToken(instructor, jointId, 'Bay 1 (test)');
    expect((await postStream(runId, reading, mine.token)).status).toBe(200);
    await revokeStreamToken(instructor, mine.id);
    const revoked = await postStream(runId, reading, mine.token);
    expect(revoked.status).toBe(403);
    expect(((await revoked.json()) as { error: { message: string } }).error.message).toMatch(/revoked/);
  });

  it('names the line and field of a bad reading and stores none of the batch', async () => {
    const { runId } = await startRecording(instructor, header(jointId, instructor.id, ids));
    const { token } = await createStreamToken(instructor, jointId, 'Bay 2 (test)');
    const response = await postStream(runId, '{"t":0,"stud":1,"load":0}\n{"t":0.1,"stud":9,"load":5}\n', token);
    expect(response.status).toBe(422);
    expect(((await response.json()) as { error: { message: string } }).error.message).toMatch(/^Line 2, field "stud": position 9 is not on this joint/);
    const status = (await (await instructorHttp.get(`/api/runs/${runId}/stream`)).json()) as { sampleCount: number };
    expect(status.sampleCount).toBe(0);
  });

  it('streams a fixture through the bridge CLI; the readings arrive; Finish derives the steps and completes the run', async () => {
    const { runId } = await startRecording(instructor, header(jointId, instructor.id, ids));
    const { token } = await createStreamToken(instructor, jointId, 'Bay 3 (test)');
    const { csv, readings } = wideFixtureAsStream();
    const file = path.join(mkdtempSync(path.join(os.tmpdir(), 'evenload-bridge-')), 'stream.csv');
    writeFileSync(file, csv);
    const bridge = await runBridge(['--url', server.baseUrl, '--run', String(runId), '--token', token, '--file', file, '--batch', '37', '--rate', '0', '--long']);
    expect(bridge.code, bridge.output).toBe(0);
    expect(bridge.output).toContain(`sent ${readings} readings`);
    // A retried batch changes nothing: readings are keyed by (run, time, stud).
    await runBridge(['--url', server.baseUrl, '--run', String(runId), '--token', token, '--file', file, '--rate', '0', '--long']);
    const status = (await (await instructorHttp.get(`/api/runs/${runId}/stream`)).json()) as { sampleCount: number; status: string; latest: Array<{ position: number; loadN: number }> };
    expect(status).toMatchObject({ sampleCount: readings, status: 'recording' });
    expect(status.latest.map((l) => l.loadN)).toEqual(kN(57, 59, 58, 60));
    const { stepCount, status: finished } = await finishRecording(instructor, runId);
    expect(stepCount).toBe(8);
    // Two cross passes 1-3-2-4 as the method prescribes, every stud at 71–75 % of the 80 kN target
    // (within 30 % of it): the run check passes it (lib/run-check), so the run is complete.
    expect(finished).toBe('complete');
    const steps = await storedSteps(runId);
    expect(steps.map((s) => [s.pass, s.position, s.loadsN])).toEqual([
      [1, 1, kN(30, 0, 0, 0)], [1, 3, kN(29, 0, 30, 0)], [1, 2, kN(28, 30, 29, 0)], [1, 4, kN(27, 29, 28, 30)],
      [2, 1, kN(60, 28, 27, 29)], [2, 3, kN(59, 27, 60, 28)], [2, 2, kN(58, 60, 59, 27)], [2, 4, kN(57, 59, 58, 60)],
    ]);
    const after = (await (await instructorHttp.get(`/api/runs/${runId}/stream`)).json()) as { status: string; stepCount: number };
    expect(after).toMatchObject({ status: 'complete', stepCount: 8 });
    // A finished run takes no more readings.
    expect((await postStream(runId, '{"t":99,"stud":1,"load":1}', token)).status).toBe(409);
  });

  it('the bridge reads the logger file as it is, in the joint\'s own layout and units (kN per channel), through the browser\'s line parser', async () => {
    const { runId } = await startRecording(instructor, header(jointId, instructor.id, ids));
    const { token } = await createStreamToken(instructor, jointId, 'Bay 4 (test)');
    const { readings } = wideFixtureAsStream();
    const bridge = await runBridge(['--url', server.baseUrl, '--run', String(runId), '--token', token, '--file', path.join(GOOD_DIR, 'wide-no-marker.csv'), '--batch', '50', '--rate', '0']);
    expect(bridge.code, bridge.output).toBe(0);
    // The comment and the header line are skipped; every scan gives one reading per stud, kN → N.
    expect(bridge.output).toContain(`sent ${readings} readings to run ${runId}`);
    expect(bridge.output).toContain('0 malformed lines skipped');
    const status = (await (await instructorHttp.get(`/api/runs/${runId}/stream`)).json()) as { sampleCount: number; latest: Array<{ position: number; loadN: number }> };
    expect(status.sampleCount).toBe(readings);
    // The file's last row, worked out by hand in tests/ingest/good.test.ts: 57, 59, 58, 60 kN.
    expect(status.latest.map((l) => l.loadN)).toEqual(kN(57, 59, 58, 60));
  });

  it('takes a signed-in browser\'s batch without a token for a run the person sees, and 404 for one they do not', async () => {
    const { runId } = await startRecording(instructor, header(jointId, instructor.id, ids));
    const batch = '{"t":0,"stud":1,"load":0}\n{"t":0,"stud":2,"load":12.5}\n';
    const mine = await instructorHttp.send('POST', `/api/runs/${runId}/stream`, batch, { 'content-type': 'application/x-ndjson' });
    expect(mine.status).toBe(200);
    expect(await mine.json()).toEqual({ accepted: 2, total: 2 });
    const trainee = await signInAs(server.baseUrl, DEMO_ACCOUNTS.trainee);
    expect((await trainee.send('POST', `/api/runs/${runId}/stream`, batch, { 'content-type': 'application/x-ndjson' })).status).toBe(404);
  });
});
