import 'server-only';
import { createHash } from 'node:crypto';
import { QueryTypes, UniqueConstraintError } from 'sequelize';
import { sequelize } from '@/lib/db';
import { AppError } from '@/lib/errors';
import { assertTextFile } from '@/lib/ingest/detect';
import { parseColumnMapping, parseLoggerText } from '@/lib/ingest/parse-text';
import { rememberMapping, resolveRunHeader } from '@/lib/data/record';
import { UPLOAD_LIMIT_BYTES } from '@/lib/record/limits';
import type { SessionUser } from '@/lib/session';
import { storeRun } from './store-run';

export interface UploadInput {
  bytes: Uint8Array;
  fileName: string;
  contentType: string;
  /** The confirmed column mapping (JSON from the form), validated here; null = use the server's guess. */
  mapping: unknown;
  /** The run header fields (JSON from the form), validated here. */
  header: unknown;
}

export interface UploadResult {
  runId: number;
  uploadId: number;
  stepCount: number;
  readingCount: number;
  derivedSteps: boolean;
  warnings: string[];
}

/** The upload with this sha256, if any, and its run. */
async function existingUpload(sha256: string): Promise<{ runId: number | null } | null> {
  const rows = await sequelize.query<{ run_id: number | null }>('SELECT run_id FROM uploads WHERE sha256 = ?', { type: QueryTypes.SELECT, replacements: [sha256] });
  const row = rows[0];
  return row ? { runId: row.run_id === null ? null : Number(row.run_id) } : null;
}

function duplicate(runId: number | null): AppError {
  return new AppError('conflict', `This file was uploaded before${runId ? ` (run ${runId})` : ''}; it is not stored twice. Open the existing run instead.`, { runId, field: 'file' });
}

/**
 * Stores an uploaded logger file as a complete run. The server re-parses the raw bytes with
 * lib/ingest (the browser's parse is only a preview), then writes the run, its steps and readings,
 * the Upload row (raw bytes, sha256, size, content type, parse report) and the remembered mapping in
 * one transaction: a failure anywhere stores nothing.
 *
 * @throws AppError: 'too_large' over {@link UPLOAD_LIMIT_BYTES}; 'invalid_input' naming line and
 *   column; 'conflict' with `runId` for a file already uploaded (same sha256); 'forbidden' for an
 *   operator this person may not record as.
 */
export async function storeUploadedRun(user: SessionUser, input: UploadInput): Promise<UploadResult> {
  const resolved = await resolveRunHeader(user, input.header, 'upload', 'complete');
  const text = assertTextFile(input.bytes, UPLOAD_LIMIT_BYTES);
  const sha256 = createHash('sha256').update(input.bytes).digest('hex');
  const existing = await existingUpload(sha256);
  if (existing) throw duplicate(existing.runId);
  const mapping = input.mapping === null || input.mapping === undefined ? undefined : parseColumnMapping(input.mapping);
  const parsed = parseLoggerText(text, mapping, resolved.jointImport);
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
      const runId = await storeRun(resolved.header, parsed.run, transaction);
      const [uploadId] = await sequelize.query(
        'INSERT INTO uploads (run_id, uploaded_by_id, file_name, sha256, size_bytes, content_type, content, parse_report, created_at) VALUES (?,?,?,?,?,?,?,?,?)',
        {
          type: QueryTypes.INSERT,
          transaction,
          replacements: [runId, user.id, input.fileName.slice(0, 255) || 'upload.csv', sha256, input.bytes.length, (input.contentType || 'text/csv').slice(0, 120), Buffer.from(input.bytes), JSON.stringify(report), new Date()],
        },
      );
      await rememberMapping(user, resolved.joint.id, parsed.detection.headers, parsed.mapping, transaction);
      return {
        runId,
        uploadId: Number(uploadId),
        stepCount: parsed.run.steps.length,
        readingCount: parsed.run.steps.length * parsed.run.studCount,
        derivedSteps: parsed.derivedSteps,
        warnings: parsed.warnings,
      };
    });
  } catch (error) {
    // Two uploads of the same file at once: the unique sha256 index decides, the loser gets 409.
    if (error instanceof UniqueConstraintError || (error as { parent?: { errno?: number } })?.parent?.errno === 1062) throw duplicate((await existingUpload(sha256))?.runId ?? null);
    throw error;
  }
}
