import 'server-only';
import { existsSync } from 'node:fs';
import path from 'node:path';
import { AppError } from '@/lib/http/errors';
import type { JointForImport } from '@/lib/ingest/normalise';
import type { ColumnMapping } from '@/lib/ingest/shapes';
import type { ParsedUpload, ParseJob, ParseReply } from './parse-upload-protocol';

/**
 * node:worker_threads, loaded past the bundler: Turbopack rewrites a statically imported
 * `new Worker(path)` into a lookup among its own chunks, which cannot find a prebuilt file.
 */
const { Worker } = (process as unknown as { getBuiltinModule(id: string): typeof import('node:worker_threads') }).getBuiltinModule('node:worker_threads');

/** Heap of one parse worker: room for a 20 MB file's text and its run, not more. */
export const PARSE_WORKER_HEAP_MB = 256;
/** Longest a parse may take before it is stopped. */
export const PARSE_TIME_LIMIT_MS = 20_000;
/** Parses at once per app instance; more wait their turn (each worker may use its heap). */
export const PARSE_CONCURRENCY = 2;

/** The prebuilt worker (scripts/build-workers.mjs), resolved from the app's directory at run time. */
export function parseWorkerPath(): string {
  return path.join(process.env.EVENLOAD_ROOT ?? process.cwd(), 'dist', 'workers', 'parse-upload.cjs');
}

let running = 0;
const waiting: Array<() => void> = [];

async function withSlot<T>(work: () => Promise<T>): Promise<T> {
  if (running >= PARSE_CONCURRENCY) await new Promise<void>((resolve) => waiting.push(resolve));
  running++;
  try {
    return await work();
  } finally {
    running--;
    waiting.shift()?.();
  }
}

function runWorker(job: ParseJob): Promise<ParsedUpload> {
  const file = parseWorkerPath();
  if (!existsSync(file)) throw new Error(`the upload parse worker ${file} is missing; run "node scripts/build-workers.mjs" (part of every build)`);
  return new Promise<ParsedUpload>((resolve, reject) => {
    const worker = new Worker(file, { resourceLimits: { maxOldGenerationSizeMb: PARSE_WORKER_HEAP_MB, maxYoungGenerationSizeMb: 32, stackSizeMb: 4 } });
    let settled = false;
    const finish = (outcome: () => void) => {
      if (settled) return;
      settled = true;
      clearTimeout(timer);
      void worker.terminate();
      outcome();
    };
    const timer = setTimeout(
      () => finish(() => reject(new AppError('invalid_input', `Reading the file took longer than ${PARSE_TIME_LIMIT_MS / 1000} s, so it was stopped. Split the log, or export only this run.`, { field: 'file' }))),
      PARSE_TIME_LIMIT_MS,
    );
    worker.once('message', (reply: ParseReply) =>
      finish(() => {
        if (reply.ok) resolve(reply.parsed);
        else if (reply.code === 'internal') reject(new Error(`upload parse worker: ${reply.message}`));
        else reject(new AppError(reply.code, reply.message, reply.details));
      }),
    );
    worker.once('error', (error: Error & { code?: string }) =>
      finish(() =>
        reject(
          error.code === 'ERR_WORKER_OUT_OF_MEMORY'
            ? new AppError('invalid_input', 'Reading the file needs more memory than an upload may use. Split the log, or export only this run.', { field: 'file' })
            : error,
        ),
      ),
    );
    worker.once('exit', (code) => finish(() => reject(new Error(`upload parse worker exited with code ${code}`))));
    worker.postMessage(job, [job.bytes]);
  });
}

/**
 * Checks and parses an uploaded file in a worker thread with a bounded heap
 * ({@link PARSE_WORKER_HEAP_MB}) and time ({@link PARSE_TIME_LIMIT_MS}), so a pathological file
 * never blocks other requests. The bytes are copied once into the worker.
 *
 * @throws AppError as lib/ingest throws it (422 naming the line, 413 over the limit); 422 when
 *   the parse runs out of time or memory.
 */
export function parseUploadInWorker(bytes: Uint8Array, limitBytes: number, mapping: ColumnMapping | undefined, joint: JointForImport): Promise<ParsedUpload> {
  const copy = bytes.slice().buffer as ArrayBuffer;
  return withSlot(() => runWorker({ bytes: copy, limitBytes, mapping, joint }));
}
