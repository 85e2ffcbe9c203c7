/**
 * POST /api/uploads without a mapping: the server's own column guess is used only when it is
 * certain. An uncertain guess (here: no load unit in the headers, kN assumed from the size of the
 * values, tests/ingest/good/wide-no-marker.csv, invented) is answered with 422 and the guess in the
 * body, so an API client confirms it, unless `acceptGuess=1` is sent. Nothing is stored on a 422.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { AppServer } from '../support/app-server';
import type { HttpSession } from '../support/http-session';
import { goodFile, header, startUploadTestbed, storedSteps, tableCounts } from '../support/record-fixtures';

let server: AppServer;
let instructor: HttpSession;
let jointId: number;
let instructorId: number;
let ids: { methodId: number; lubricantId: number };
let stop: () => Promise<void>;

beforeAll(async () => {
  ({ server, instructor, jointId, instructorId, ids, stop } = await startUploadTestbed('uploads-guess'));
});

afterAll(async () => {
  await stop?.();
});

/** The fixture with a comment line of its own on top, so no other test's upload of it is a duplicate. */
function unique(file: string): Uint8Array {
  const tag = new TextEncoder().encode(`# uploads-guess ${Date.now()} ${Math.random()}\n`);
  const bytes = goodFile(file);
  const out = new Uint8Array(tag.length + bytes.length);
  out.set(tag);
  out.set(bytes, tag.length);
  return out;
}

/** POSTs the file with `mapping` (JSON text; "null" = the server's guess) and any further fields. */
async function post(bytes: Uint8Array, fields: Record<string, string> = {}, mapping = 'null') {
  const form = new FormData();
  form.append('file', new Blob([new Uint8Array(bytes)], { type: 'text/csv' }), 'guess.csv');
  form.append('mapping', mapping);
  form.append('header', JSON.stringify(header(jointId, instructorId, ids)));
  for (const [name, value] of Object.entries(fields)) form.append(name, value);
  const response = await fetch(`${server.baseUrl}/api/uploads`, { method: 'POST', headers: { cookie: instructor.cookie }, body: form });
  const body = (await response.json()) as {
    runId?: number;
    stepCount?: number;
    error?: { message: string; field?: string; guess?: { shape: string; loadUnit: string; studColumns: Array<{ column: string; position: number }> }; mappingNotes?: string[] };
  };
  return { response, body };
}

describe('POST /api/uploads with no mapping', () => {
  it('answers 422 with the uncertain guess in the body and stores nothing', async () => {
    const before = await tableCounts();
    const { response, body } = await post(unique('wide-no-marker.csv'));
    expect(response.status).toBe(422);
    expect(body.error?.field).toBe('mapping');
    expect(body.error?.message).toMatch(/guessed.*acceptGuess=1/);
    // The file's header line is "Time (s),S1,S2,S3,S4" with loads up to 60 and no unit (the fixture's construction).
    expect(body.error?.guess).toMatchObject({ shape: 'wide', loadUnit: 'kN', studColumns: [{ column: 'S1', position: 1 }, { column: 'S2', position: 2 }, { column: 'S3', position: 3 }, { column: 'S4', position: 4 }] });
    expect(body.error?.mappingNotes?.join(' ')).toMatch(/assumed kN/);
    expect(await tableCounts()).toEqual(before);
  });

  it('stores the run with the guess when acceptGuess=1 is sent', async () => {
    const { response, body } = await post(unique('wide-no-marker.csv'), { acceptGuess: '1' });
    expect(response.status, body.error?.message).toBe(201);
    // 2 cross passes of 4 studs, one row per rise (the fixture's construction, tests/ingest/good.test.ts).
    expect(body.stepCount).toBe(8);
    expect((await storedSteps(body.runId!)).at(-1)!.loadsN).toEqual([57_000, 59_000, 58_000, 60_000]);
  });

  it('sends back the guess as the mapping: stored like acceptGuess', async () => {
    const bytes = unique('wide-no-marker.csv');
    const { body: refused } = await post(bytes);
    const { response, body } = await post(bytes, {}, JSON.stringify(refused.error!.guess));
    expect(response.status, body.error?.message).toBe(201);
  });

  it('uses a certain guess without asking (units in the headers: "Stud 1 [kN]")', async () => {
    const { response, body } = await post(unique('wide-step-column.csv'));
    expect(response.status, body.error?.message).toBe(201);
    expect(body.stepCount).toBe(8);
  });

  it('refuses an acceptGuess that is not 0 or 1, naming the field', async () => {
    const { response, body } = await post(unique('wide-no-marker.csv'), { acceptGuess: 'yes' });
    expect(response.status).toBe(422);
    expect(body.error?.field).toBe('acceptGuess');
  });

  it('still asks with acceptGuess=0', async () => {
    const { response } = await post(unique('wide-no-marker.csv'), { acceptGuess: '0' });
    expect(response.status).toBe(422);
  });
});
