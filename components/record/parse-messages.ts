/** Messages between the upload panel and its parse worker. */
import type { JointForImport } from '@/lib/ingest/normalise';
import type { ColumnMapping } from '@/lib/ingest/shapes';

export interface ParseRequest {
  type: 'parse';
  file: File;
  mapping: ColumnMapping | null;
  /** The workbook sheet to read (null = the first). */
  sheet: string | null;
  joint: JointForImport;
  limitBytes: number;
}

export interface ParsedPreview {
  sentences: string[];
  headers: string[];
  preview: Array<{ line: number; cells: string[] }>;
  mapping: ColumnMapping | null;
  mappingNotes: string[];
  /** Sheets of a workbook (empty for a text file) and the one read. */
  sheets: string[];
  sheet: string | null;
  /** False when the guess rests on an assumption: the mapping must be confirmed. */
  mappingCertain: boolean;
}

export interface ParsedFile extends ParsedPreview {
  mapping: ColumnMapping;
  derivedSteps: boolean;
  derived: Array<{ order: number; pass: number; position: number; positions?: number[]; firstLine: number; lastLine: number; timeS: number | null; riseN: number }>;
  stepCount: number;
  studCount: number;
  rowCount: number;
  warnings: string[];
  zeroNotes: string[];
  finalLoadsN: number[];
}

export type ParseResponse =
  | { type: 'progress'; phase: 'reading' | 'parsing'; loaded: number; total: number }
  | { type: 'result'; result: ParsedFile }
  | { type: 'error'; message: string; row: number | null; column: string | null; partial: ParsedPreview | null };
