/**
 * The logger-file corpus (tests/ingest/logger-corpus, written by scripts/generate-logger-corpus.ts)
 * POSTed to the real server. Good files are sent with the mapping the browser would send (the
 * parser's own guess, with the workbook's sheet) and must store the generator's step count and
 * final loads: the expected values are the generator's known inputs, not an earlier parse. Bad
 * files must be refused with 422 naming the line and column, with nothing stored.
 *
 * check-pass-wide.csv is not posted here: its check pass is kept only with a method that has one,
 * and the test method's plan is the demo's (tests/ingest/logger-corpus.test.ts covers it).
 */
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sequelize } from '@/lib/platform/db';
import { parseLoggerText } from '@/lib/ingest/parse-text';
import { uploadedFileText } from '@/lib/ingest/workbook';
import { startAppServer, type AppServer } from '../support/app-server';
import { DEMO_ACCOUNTS, signInAs, type HttpSession } from '../support/http-session';
import { createTestJoint, dropTestJoints, firstIds, header, postUpload, storedSteps, tableCounts, userId } from '../support/record-fixtures';
import { CORPUS_JOINT } from '../ingest/joints';

const DIR = path.resolve(__dirname, '../ingest/logger-corpus');
interface Good { file: string; steps: number; finalLoadsN: number[]; toleranceN: number; plannedSteps?: unknown; channelMap?: Array<{ channel: string; position: number }>; sheet?: string }
interface Bad { file: string; row: number; column: string | null; fragment: string }
const manifest = JSON.parse(readFileSync(path.join(DIR, 'manifest.json'), 'utf8')) as { good: Good[]; bad: Bad[] };

let server: AppServer;
let instructor: HttpSession;
let jointId: number;
let runHeader: ReturnType<typeof header>;

beforeAll(async () => {
  server = await startAppServer();
  instructor = await signInAs(server.baseUrl, DEMO_ACCOUNTS.instructor);
  jointId = await createTestJoint(CORPUS_JOINT.studCount, 'logger-corpus');
  runHeader = header(jointId, await userId(DEMO_ACCOUNTS.instructor), await firstIds());
});

afterAll(async () => {
  await dropTestJoints([jointId]);
  await server?.stop();
  await sequelize.close();
});

const bytesOf = (dir: string, file: string) => new Uint8Array(readFileSync(path.join(DIR, dir, file)));

describe('POST /api/uploads with the good logger corpus', () => {
  it.each(manifest.good.filter((g) => !g.plannedSteps || g.file.startsWith('long-')))('stores $file with the generator\'s steps and final loads', async (g) => {
    const bytes = bytesOf('good', g.file);
    const { text } = await uploadedFileText(bytes, 20 * 1024 * 1024, g.sheet);
    const guess = parseLoggerText(text, undefined, { ...CORPUS_JOINT, channelMap: g.channelMap }).mapping;
    const response = await postUpload(instructor, server.baseUrl, bytes, g.file, g.sheet ? { ...guess, sheet: g.sheet } : guess, runHeader);
    const body = (await response.json()) as { runId: number; stepCount: number; error?: { message: string } };
    expect(response.status, body.error?.message).toBe(201);
    expect(body.stepCount).toBe(g.steps);
    const steps = await storedSteps(body.runId);
    expect(steps).toHaveLength(g.steps);
    steps.at(-1)!.loadsN.forEach((n, k) => expect(Math.abs(n - g.finalLoadsN[k]!), `stud ${k + 1}`).toBeLessThanOrEqual(g.toleranceN));
  });
});

describe('POST /api/uploads with the bad logger corpus', () => {
  it.each(manifest.bad)('refuses $file naming line $row and column $column, storing nothing', async (b) => {
    const before = await tableCounts();
    const response = await postUpload(instructor, server.baseUrl, bytesOf('bad', b.file), b.file, null, runHeader);
    const body = (await response.json()) as { error: { code: string; message: string; row?: number; column?: string } };
    expect(response.status, body.error.message).toBe(422);
    expect(body.error.message).toMatch(new RegExp(`^Line ${b.row}\\b`));
    expect(body.error.message).toContain(b.fragment);
    expect(body.error.row).toBe(b.row);
    if (b.column !== null) expect(body.error.column).toBe(b.column);
    expect(await tableCounts()).toEqual(before);
  });
});
