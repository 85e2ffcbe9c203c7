/** Messages between the request thread and the upload parse worker (types only). */
import type { AppErrorCode, AppErrorDetails } from '@/lib/http/errors';
import type { DetectionReport } from '@/lib/ingest/detect';
import type { JointForImport } from '@/lib/ingest/normalise';
import type { ColumnMapping } from '@/lib/ingest/shapes';
import type { NormalisedRun } from '@/lib/record/run-types';

export interface ParseJob {
  /** The file's bytes (transferred, not copied). */
  bytes: ArrayBuffer;
  limitBytes: number;
  /** The validated mapping, or undefined for the server's guess. */
  mapping: ColumnMapping | undefined;
  joint: JointForImport;
}

/** What the server keeps of a parse: everything but the text. */
export interface ParsedUpload {
  detection: Omit<DetectionReport, 'text'>;
  mapping: ColumnMapping;
  /** False when the mapping was the parser's guess and assumed something (see parseLoggerText). */
  mappingCertain: boolean;
  /** What the guess assumed, in sentences. */
  mappingNotes: string[];
  run: NormalisedRun;
  derivedSteps: boolean;
  warnings: string[];
  rowCount: number;
}

export type ParseReply = { ok: true; parsed: ParsedUpload } | { ok: false; code: AppErrorCode; message: string; details: AppErrorDetails };
