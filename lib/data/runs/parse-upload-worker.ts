/**
 * The upload parse worker (node:worker_threads). Runs the same pure lib/ingest parser as the
 * browser's preview, off the request thread, under the memory limits the parent sets. Built to a
 * plain JS file (`dist/workers/parse-upload.cjs`, by `scripts/build-workers.mjs`) because Next
 * bundles route handlers and a worker needs a file that exists at run time.
 *
 * Message in: {@link ParseJob}. Message out: {@link ParseReply} (the run and report, never the text).
 */
import { parentPort } from 'node:worker_threads';
import { AppError } from '@/lib/http/errors';
import { uploadedFileText } from '@/lib/ingest/workbook';
import { parseLoggerText } from '@/lib/ingest/parse-text';
import type { ParseJob, ParseReply } from './parse-upload-protocol';

parentPort?.on('message', async (job: ParseJob) => {
  let reply: ParseReply;
  try {
    const { text } = await uploadedFileText(new Uint8Array(job.bytes), job.limitBytes, job.mapping?.sheet);
    const parsed = parseLoggerText(text, job.mapping, job.joint);
    const { text: _text, ...detection } = parsed.detection;
    reply = {
      ok: true,
      parsed: { detection, mapping: parsed.mapping, mappingCertain: parsed.mappingCertain, mappingNotes: parsed.mappingNotes, run: parsed.run, derivedSteps: parsed.derivedSteps, warnings: parsed.warnings, rowCount: parsed.rowCount },
    };
  } catch (error) {
    reply = error instanceof AppError ? { ok: false, code: error.code, message: error.message, details: error.details } : { ok: false, code: 'internal', message: String((error as Error)?.stack ?? error), details: {} };
  }
  parentPort?.postMessage(reply);
});
