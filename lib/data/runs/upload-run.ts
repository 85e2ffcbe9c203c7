import 'server-only';
import { createHash } from 'node:crypto';
import { Op, QueryTypes, UniqueConstraintError } from 'sequelize';
import { AppError } from '@/lib/http/errors';
import { BYTES_PER_MB } from '@/lib/ingest/text-file';
import { parseColumnMapping } from '@/lib/ingest/parse-text';
import { rememberMapping, resolveRunHeader } from '@/lib/data/record';
import { runScope } from '@/lib/data/scope';
import { UPLOAD_LIMIT_BYTES } from '@/lib/record/limits';
import { importPlanSteps } from '@/lib/record/step-plan';
import type { SessionUser } from '@/lib/auth/session';
import { Run, Upload, sequelize } from '@/models';
import { parseUploadInWorker } from './parse-in-worker';
import type { ParsedUpload } from './parse-upload-protocol';
import { storeRunWithStatus } from './store-run';
import type { RunCheckReason } from '@/lib/run-check/types';
import type { RunStatus } from '@/models/run';
import { storeUploadBytes } from './upload-file';

export interface UploadInput {
  bytes: Uint8Array;
  fileName: string;
  contentType: string;
  /** The confirmed column mapping (JSON from the form), validated here; null = use the server's guess. */
  mapping: unknown;
  /** The run header fields (JSON from the form), validated here. */
  header: unknown;
  /** Without a mapping: store with the server's guess even when the guess is uncertain. */
  acceptGuess: boolean;
}

export interface UploadResult {
  runId: number;
  uploadId: number;
  stepCount: number;
  readingCount: number;
  derivedSteps: boolean;
  warnings: string[];
  /** complete, or needs_review with the run check's reasons. */
  status: RunStatus;
  reviewReasons: RunCheckReason[];
}

/** The 413 for a body or file over the upload limit. */
export function uploadTooLarge(): AppError {
  return new AppError('too_large', `The file is larger than the upload limit of ${UPLOAD_LIMIT_BYTES / BYTES_PER_MB} MB. Split the log or export only this run.`, { field: 'file', limitBytes: UPLOAD_LIMIT_BYTES });
}

/**
 * The 422 for a file sent without a mapping whose columns the server could only guess: the guess
 * and what it assumed are in the body, so an API client confirms it (sends it back as `mapping`,
 * corrected or not) or sends `acceptGuess=1`. The page always sends the mapping the person confirmed.
 */
function uncertainGuess(parsed: ParsedUpload): AppError {
  return new AppError(
    'invalid_input',
    `The columns were guessed, not recognised for certain (${parsed.mappingNotes.join(' ') || 'the file does not say everything'}). Check the guessed mapping and send it as "mapping", or send acceptGuess=1 to store the run with it.`,
    { field: 'mapping', guess: parsed.mapping, mappingNotes: parsed.mappingNotes },
  );
}

/** The upload with this sha256, if any, and its run. */
async function existingUpload(sha256: string): Promise<{ runId: number | null } | null> {
  const rows = await sequelize.query<{ run_id: number | null }>('SELECT run_id FROM uploads WHERE sha256 = ?', { type: QueryTypes.SELECT, replacements: [sha256] });
  const row = rows[0];
  return row ? { runId: row.run_id === null ? null : Number(row.run_id) } : null;
}

/**
 * The 409 for a file already uploaded: the run is named only when this person may see it;
 * otherwise the answer says only that the file was uploaded before.
 */
async function duplicate(user: SessionUser, runId: number | null): Promise<AppError> {
  const visible = runId !== null && (await Run.count({ where: { [Op.and]: [await runScope(user), { id: runId }] } })) > 0;
  return visible
    ? new AppError('conflict', `This file has already been uploaded (run ${runId}); it is not stored twice. Open the existing run instead.`, { runId, field: 'file' })
    : new AppError('conflict', 'This file has already been uploaded; it is not stored twice.', { field: 'file' });
}

/**
 * Stores an uploaded logger file as a complete run (or one that needs review, when the run check fails). The server re-parses the raw bytes with
 * lib/ingest in a worker thread with bounded memory and time (the browser's parse is only a
 * preview), then writes the run, its steps and readings, the Upload row (sha256, size, content
 * type, parse report), the bytes in 1 MB chunks and the remembered mapping in one transaction: a
 * failure anywhere stores nothing.
 *
 * @throws AppError: 'too_large' over {@link UPLOAD_LIMIT_BYTES}; 'invalid_input' naming line and
 *   column; 'conflict' for a file already uploaded (same sha256), with `runId` when this person may
 *   see that run; 'forbidden' for an operator this person may not record as; 'invalid_input' with
 *   the guess for a file without a mapping whose guess is uncertain, unless `acceptGuess`.
 */
export async function storeUploadedRun(user: SessionUser, input: UploadInput): Promise<UploadResult> {
  const resolved = await resolveRunHeader(user, input.header, 'upload', 'complete');
  if (input.bytes.length > UPLOAD_LIMIT_BYTES) throw uploadTooLarge();
  const sha256 = createHash('sha256').update(input.bytes).digest('hex');
  const existing = await existingUpload(sha256);
  if (existing) throw await duplicate(user, existing.runId);
  const mapping = input.mapping === null || input.mapping === undefined ? undefined : parseColumnMapping(input.mapping);
  const plannedSteps = importPlanSteps(resolved.method, resolved.joint.studCount);
  const parsed = await parseUploadInWorker(input.bytes, UPLOAD_LIMIT_BYTES, mapping, { ...resolved.jointImport, plannedSteps });
  if (!mapping && !parsed.mappingCertain && !input.acceptGuess) throw uncertainGuess(parsed);
  const report = {
    detection: parsed.detection.sentences,
    delimiter: parsed.detection.delimiter,
    decimalComma: parsed.detection.decimalComma,
    headerLine: parsed.detection.headerLine,
    headers: parsed.detection.headers,
    metadata: parsed.detection.metadata,
    mapping: parsed.mapping,
    derivedSteps: parsed.derivedSteps,
    warnings: parsed.warnings,
    rowCount: parsed.rowCount,
    stepCount: parsed.run.steps.length,
  };
  try {
    return await sequelize.transaction(async (transaction) => {
      const { runId, status, reasons } = await storeRunWithStatus(resolved.header, parsed.run, transaction);
      const { id: uploadId } = await Upload.create(
        { runId, uploadedById: user.id, fileName: input.fileName.slice(0, 255) || 'upload.csv', sha256, sizeBytes: input.bytes.length, contentType: (input.contentType || 'text/csv').slice(0, 120), parseReport: report },
        { transaction },
      );
      await storeUploadBytes(uploadId, input.bytes, transaction);
      await rememberMapping(user, resolved.joint.id, parsed.detection.headers, parsed.mapping, transaction);
      return {
        runId,
        uploadId,
        stepCount: parsed.run.steps.length,
        readingCount: parsed.run.steps.length * parsed.run.studCount,
        derivedSteps: parsed.derivedSteps,
        warnings: parsed.warnings,
        status,
        reviewReasons: reasons,
      };
    });
  } catch (error) {
    // Two uploads of the same file at once: the unique sha256 index decides, the loser gets 409.
    if (error instanceof UniqueConstraintError || (error as { parent?: { errno?: number } })?.parent?.errno === 1062) throw await duplicate(user, (await existingUpload(sha256))?.runId ?? null);
    throw error;
  }
}
