/**
 * scale-check's shared set-up: the demo instructor signed in through the balancer, an invented
 * 4-stud test joint, unique logger files to upload (the record tests' wide fixture with its own
 * first line) and the result type of a check.
 */
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { FOUR_STUD_JOINT } from '../../tests/ingest/joints';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from '../../tests/support/http-session';
import { createTestJoint, firstIds, GOOD_DIR, header, mappingFor, userId } from '../../tests/support/record-fixtures';
import { Browser } from './client';
import { cluster, replicaCaughtUp } from './cluster';

export interface CheckResult {
  check: string;
  ok: boolean;
  figures: string;
}

export interface Testbed {
  instructor: Browser;
  jointId: number;
  instructorId: number;
  ids: { methodId: number; lubricantId: number };
}

export async function createTestbed(): Promise<Testbed> {
  const jointId = await createTestJoint(4, 'scale-check');
  const testbed = { instructor: new Browser(cluster.balancer), jointId, instructorId: await userId(DEMO_ACCOUNTS.instructor), ids: await firstIds() };
  await replicaCaughtUp();
  if (!(await testbed.instructor.signIn(DEMO_ACCOUNTS.instructor, DEMO_PASSWORD))) throw new Error('the demo instructor could not sign in through the balancer');
  return testbed;
}

const wide = readFileSync(path.join(GOOD_DIR, 'wide-no-marker.csv'), 'utf8').split('\n');
let uploads = 0;

/** A logger file no earlier upload has (the same bytes twice are refused as a duplicate). */
export function uniqueLoggerFile(): { bytes: Uint8Array; name: string } {
  uploads += 1;
  const name = `scale-check-${process.pid}-${uploads}.csv`;
  const text = [`# Invented test data for Evenload (scale-check upload ${process.pid}-${uploads}): 4-stud training joint.`, ...wide.slice(1)].join('\n');
  return { bytes: new TextEncoder().encode(text), name };
}

/** POST /api/uploads as the Record page does (multipart form data). */
export function uploadForm(testbed: Testbed, file: { bytes: Uint8Array; name: string }): FormData {
  const form = new FormData();
  form.append('file', new Blob([new Uint8Array(file.bytes)], { type: 'text/csv' }), file.name);
  form.append('mapping', JSON.stringify(mappingFor(file.bytes, FOUR_STUD_JOINT)));
  form.append('header', JSON.stringify(header(testbed.jointId, testbed.instructorId, testbed.ids)));
  return form;
}

export async function upload(browser: Browser, testbed: Testbed, file = uniqueLoggerFile()): Promise<{ status: number; runId: number | null }> {
  const response = await browser.send('POST', '/api/uploads', uploadForm(testbed, file));
  const body = (await response.json().catch(() => ({}))) as { runId?: number; error?: { runId?: number } };
  return { status: response.status, runId: body.runId ?? body.error?.runId ?? null };
}

/** "a, b" → how many answers came from each instance, e.g. "app1 3, app2 3". */
export function byInstance(instances: string[]): string {
  const counts = new Map<string, number>();
  for (const name of instances) counts.set(name, (counts.get(name) ?? 0) + 1);
  return [...counts].sort().map(([name, n]) => `${name} ${n}`).join(', ');
}
