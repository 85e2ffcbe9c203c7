/**
 * POST /api/uploads at and beyond its limits, against the real app and MariaDB: files of 8.5, 15.5
 * and 19.9 MB are stored intact (the sha256 of the stored bytes equals node:crypto's sha256 of the
 * file sent); a chunked body over the 20 MB limit without Content-Length is refused with 413; the
 * pathological files are refused with 422 naming the line; nothing is stored for a refusal; a
 * duplicate of another person's file names no run; a message never quotes more than a short piece
 * of the file.
 */
import { createHash, randomUUID } from 'node:crypto';
import { QueryTypes } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sequelize } from '@/lib/platform/db';
import { readUploadBytes } from '@/lib/data/runs/upload-file';
import type { AppServer } from '../support/app-server';
import type { HttpSession } from '../support/http-session';
import { pathologicalFiles } from '../support/pathological-files';
import { header, mappingFor, postUpload, startUploadTestbed, storedSteps, tableCounts } from '../support/record-fixtures';
import { FOUR_STUD_JOINT } from '../ingest/joints';

const MB = 1024 * 1024;
let server: AppServer;
let instructor: HttpSession;
let trainee: HttpSession;
let jointId: number;
let instructorId: number;
let traineeId: number;
let ids: { methodId: number; lubricantId: number };
let stop: () => Promise<void>;

beforeAll(async () => {
  ({ server, instructor, trainee, jointId, instructorId, traineeId, ids, stop } = await startUploadTestbed('upload limits'));
});

afterAll(async () => {
  await stop?.();
});

/** The final loads (kN) of each step of a cross pass on 4 studs, then a second pass (invented). */
const STEPS: Array<{ step: number; pass: number; loads: number[] }> = [
  { step: 1, pass: 1, loads: [24, 0, 0, 0] },
  { step: 2, pass: 1, loads: [22, 0, 25, 0] },
  { step: 3, pass: 1, loads: [21, 20, 24, 0] },
  { step: 4, pass: 1, loads: [20, 19, 23, 26] },
  { step: 5, pass: 2, loads: [40, 18, 22, 25] },
  { step: 6, pass: 2, loads: [39, 17, 45, 24] },
  { step: 7, pass: 2, loads: [38, 44, 44, 23] },
  { step: 8, pass: 2, loads: [37, 43, 43, 46] },
];

/**
 * A wide logger file of `megabytes` MB (within a line's length): the eight steps above, each
 * sampled for many rows at 1 kHz with the same loads, a unique comment first (so no run repeats
 * another's sha256) and a comment at the end padding it to the size.
 */
function validFile(megabytes: number): Uint8Array {
  const size = Math.round(megabytes * MB);
  const parts = [`# Invented test data ${randomUUID()}\n`, 'Time (s),Step,Pass,Stud 1 [kN],Stud 2 [kN],Stud 3 [kN],Stud 4 [kN]\n'];
  let length = parts[0]!.length + parts[1]!.length;
  const rowsPerStep = Math.ceil(size / 48 / STEPS.length);
  let t = 0;
  for (const s of STEPS) {
    const tail = `,${s.step},${s.pass},${s.loads.map((l) => l.toFixed(6)).join(',')}\n`;
    for (let r = 0; r < rowsPerStep && length < size - 200; r++, t++) {
      const line = `${(t / 1000).toFixed(3)}${tail}`;
      parts.push(line);
      length += line.length;
    }
  }
  parts.push(`#${'.'.repeat(Math.max(0, size - length - 2))}\n`.slice(0, Math.max(0, size - length)));
  const bytes = new TextEncoder().encode(parts.join(''));
  expect(bytes.length).toBe(size);
  return bytes;
}

/** The confirmed mapping, as the upload page sends it: the server's guess for this header. */
const mapping = mappingFor(new TextEncoder().encode('Time (s),Step,Pass,Stud 1 [kN],Stud 2 [kN],Stud 3 [kN],Stud 4 [kN]\n0.5,1,1,24,0,0,0\n'), FOUR_STUD_JOINT);

async function errorOf(response: Response) {
  return ((await response.json()) as { error: { message: string; runId?: number; row?: number } }).error;
}

describe('POST /api/uploads: large files', () => {
  it.each([8.5, 15.5, 19.9])('stores a %s MB file intact: the stored bytes have the file\'s sha256', async (megabytes) => {
    const bytes = validFile(megabytes);
    const response = await postUpload(instructor, server.baseUrl, bytes, `large-${megabytes}.csv`, mapping, header(jointId, instructorId, ids));
    const body = (await response.json()) as { runId?: number; uploadId?: number; error?: { message: string } };
    expect(response.status, body.error?.message).toBe(201);
    const sent = createHash('sha256').update(bytes).digest('hex');
    const stored = await readUploadBytes(body.uploadId!);
    expect(stored.length).toBe(bytes.length);
    expect(createHash('sha256').update(stored).digest('hex')).toBe(sent);
    const [row] = await sequelize.query<{ sha256: string; size_bytes: number }>('SELECT sha256, size_bytes FROM uploads WHERE id = ?', { type: QueryTypes.SELECT, replacements: [body.uploadId] });
    expect(row).toEqual({ sha256: sent, size_bytes: bytes.length });
    // The readings are the last row of each step (the fixture's construction above).
    expect((await storedSteps(body.runId!)).map((s) => s.loadsN)).toEqual(STEPS.map((s) => s.loads.map((l) => l * 1000)));
  });

  it.each(pathologicalFiles().map((f) => [f.name, f] as const))('refuses %s with 422 naming the line, storing nothing', async (_name, file) => {
    const before = await tableCounts();
    const response = await postUpload(instructor, server.baseUrl, file.bytes, 'pathological.csv', null, header(jointId, instructorId, ids));
    expect(response.status).toBe(422);
    const error = await errorOf(response);
    expect(error.message).toMatch(file.message);
    expect(error.row).toBe(file.line);
    expect(await tableCounts()).toEqual(before);
  });
});

describe('POST /api/uploads: what a refusal tells', () => {
  it('answers a duplicate of another person\'s file with 409 and no run id', async () => {
    const bytes = new TextEncoder().encode(`# Invented test data ${randomUUID()}\nTime (s),Step,Pass,Stud 1 [kN],Stud 2 [kN],Stud 3 [kN],Stud 4 [kN]\n0.5,1,1,24,0,0,0\n`);
    const first = await postUpload(instructor, server.baseUrl, bytes, 'mine.csv', mapping, header(jointId, instructorId, ids));
    const firstBody = (await first.json()) as { runId?: number; error?: { message: string } };
    expect(first.status, firstBody.error?.message).toBe(201);
    const again = await postUpload(trainee, server.baseUrl, bytes, 'copy.csv', mapping, header(jointId, traineeId, ids));
    expect(again.status).toBe(409);
    const error = await errorOf(again);
    expect(error.message).toMatch(/already been uploaded/);
    expect(error.message).not.toContain(String(firstBody.runId));
    expect(error.runId).toBeUndefined();
    // The owner is told which run it is.
    const own = await errorOf(await postUpload(instructor, server.baseUrl, bytes, 'mine.csv', mapping, header(jointId, instructorId, ids)));
    expect(own.runId).toBe(firstBody.runId);
  });

  it('quotes at most 40 characters of a huge cell in its 422', async () => {
    const cell = 'x'.repeat(15_000);
    const bytes = new TextEncoder().encode(`# Invented test data ${randomUUID()}\nTime (s),Step,Pass,Stud 1 [kN],Stud 2 [kN],Stud 3 [kN],Stud 4 [kN]\n0.5,1,1,${cell},0,0,0\n`);
    const response = await postUpload(instructor, server.baseUrl, bytes, 'huge-cell.csv', mapping, header(jointId, instructorId, ids));
    expect(response.status).toBe(422);
    const text = await response.text();
    const { message } = (JSON.parse(text) as { error: { message: string } }).error;
    expect(message).toMatch(/^Line 3, column "Stud 1 \[kN\]": "x{40}…"/);
    expect(text.length).toBeLessThan(600);
  });

  it('quotes at most 40 characters of a 20 MB line in its 422', async () => {
    const [commas] = pathologicalFiles();
    const response = await postUpload(instructor, server.baseUrl, commas!.bytes, 'long-line.csv', null, header(jointId, instructorId, ids));
    const text = await response.text();
    expect(response.status).toBe(422);
    // "Time (s),Stud 1" is 15 characters, so the 40 quoted end after 25 commas.
    expect((JSON.parse(text) as { error: { message: string } }).error.message).toContain(`(it starts "Time (s),Stud 1${','.repeat(25)}…")`);
    expect(text.length).toBeLessThan(600);
  });
});

// Last in the file: the server answers 413 before the body is read, and the client's socket is
// then dropped; a test after it could pick that socket from fetch's keep-alive pool.
describe('POST /api/uploads: a body over the limit', () => {
  it('refuses a chunked body over 20 MB without Content-Length with 413 and stores nothing', async () => {
    const before = await tableCounts();
    const boundary = '----evenload-test';
    const head = new TextEncoder().encode(`--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="big.csv"\r\nContent-Type: text/csv\r\n\r\n`);
    const chunk = new Uint8Array(MB).fill(0x31);
    let sent = 0;
    const body = new ReadableStream<Uint8Array>({
      pull(controller) {
        if (sent === 0) controller.enqueue(head);
        // 25 MB in all: over the limit, and finite whatever the server does with the rest.
        if (sent >= 25 * MB) return controller.close();
        controller.enqueue(chunk);
        sent += chunk.length;
      },
    });
    const response = await fetch(`${server.baseUrl}/api/uploads`, { method: 'POST', headers: { cookie: instructor.cookie, 'content-type': `multipart/form-data; boundary=${boundary}` }, body, duplex: 'half' } as RequestInit);
    expect(response.status).toBe(413);
    expect((await errorOf(response)).message).toContain('20 MB');
    expect(await tableCounts()).toEqual(before);
  });
});
