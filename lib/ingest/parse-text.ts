/**
 * One call from logger text to a normalised run: detection, column mapping, preview and the
 * normalised steps. Browser-safe (papaparse, zod and our own modules only; no Node imports), so the
 * upload widget's web worker can run exactly what the server runs.
 *
 * Rows are streamed from papaparse's `step` callback straight into the row normaliser; the text is
 * held once, rows are never held as objects (only the first few, for the preview and the mapping guess).
 */
import Papa from 'papaparse';
import { z } from 'zod';
import { AppError } from '@/lib/http/errors';
import type { NormalisedRun } from '@/lib/record/run-types';
import { inspectText, type DetectionReport } from './detect';
import type { DerivedStep } from './derive-steps';
import { createRowNormaliser, type JointForImport, type NormaliseOptions, type RowNormaliser, type StepLines } from './normalise';
import { columnMappingSchema, proposeMappingWithNotes, type ColumnMapping } from './shapes';
import { assertTextWithinLimits } from './text-limits';

/** Rows shown in the upload preview. */
export const PREVIEW_ROWS = 10;
/** Rows the mapping guess looks at. */
export const SAMPLE_ROWS = 50;

/** Everything the upload screen and the server need from one file. */
export interface LoggerTextResult {
  detection: DetectionReport;
  /** The mapping used: the caller's (validated), or the proposed one. */
  mapping: ColumnMapping;
  /** Whether `mapping` was proposed here (true) or given by the caller (false). */
  mappingProposed: boolean;
  /** Reasons behind a proposed mapping (units guessed, shape). Empty when the caller gave one. */
  mappingNotes: string[];
  /** Whether the proposed mapping rests on nothing assumed; false means the user must confirm it. True when the caller gave one. */
  mappingCertain: boolean;
  /** Zero offsets removed and readings taken as 0, in words. */
  zeroNotes: string[];
  /** Header and the first {@link PREVIEW_ROWS} data rows with their line numbers, as text. */
  preview: { headers: string[]; rows: Array<{ line: number; cells: string[] }> };
  run: NormalisedRun;
  derivedSteps: boolean;
  derived: DerivedStep[];
  stepLines: StepLines[];
  warnings: string[];
  rowCount: number;
}

/** Options of {@link parseLoggerText}. */
export interface ParseLoggerTextOptions {
  /** Tuning of step derivation when the file has no step column. */
  derive?: NormaliseOptions['derive'];
}

/**
 * Whether the sampled rows of a long file list every stud at each time stamp (the file holds one
 * snapshot of every stud per step) rather than only the studs that changed. The last stamp of the
 * sample may be cut off and is not judged.
 */
function everyStampComplete(headers: readonly string[], mapping: ColumnMapping, sample: readonly TableRow[], studCount: number): boolean {
  const t = headers.findIndex((h) => h.trim() === mapping.timeColumn);
  const p = headers.findIndex((h) => h.trim() === mapping.positionColumn);
  if (t < 0 || p < 0) return false;
  const counts: number[] = [];
  let last: string | null = null;
  const seen = new Set<string>();
  for (const r of sample) {
    const time = (r.cells[t] ?? '').trim();
    if (time !== last) {
      if (last !== null) counts.push(seen.size);
      seen.clear();
      last = time;
    }
    seen.add((r.cells[p] ?? '').trim());
  }
  const closed = sample.length >= SAMPLE_ROWS ? counts : [...counts, seen.size];
  return closed.length > 0 && closed.every((c) => c === studCount);
}

function isCommentRow(row: readonly string[]): boolean {
  const first = (row[0] ?? '').trimStart();
  return first.startsWith('#') || first.startsWith('//');
}

/**
 * Validates a mapping from the client with {@link columnMappingSchema}.
 * @throws AppError('invalid_input') with zod's field errors.
 */
export function parseColumnMapping(input: unknown): ColumnMapping {
  const r = columnMappingSchema.safeParse(input);
  if (!r.success) {
    throw new AppError('invalid_input', 'The column mapping is not valid.', { field: 'mapping', fieldErrors: z.flattenError(r.error).fieldErrors });
  }
  return r.data;
}

interface TableRow {
  line: number;
  cells: string[];
}

/**
 * Streams the table part of `detection.text` row by row with papaparse (synchronous string
 * parse, the detected delimiter), skipping the units row, blank rows and comment rows, and calls
 * `onRow` with each data row and its file line number. Line numbers count physical lines, so they
 * assume no quoted cell spans lines (loggers do not write such cells).
 *
 * @param limit stop after this many data rows (for a preview).
 * @throws AppError('invalid_input') for a malformed quote, naming the line.
 */
export function streamTableRows(detection: DetectionReport, onRow: (cells: string[], line: number) => void, limit = Number.POSITIVE_INFINITY): void {
  const table = detection.text.slice(detection.headerOffset);
  if (table.indexOf('"') < 0 && table.indexOf('\r') < 0) return streamPlainRows(detection, table, onRow, limit);
  let index = -1;
  let taken = 0;
  let failure: unknown = null;
  Papa.parse<string[]>(table, {
    delimiter: detection.delimiter,
    skipEmptyLines: false,
    step(results, parser) {
      if (failure !== null) return;
      index++;
      const line = detection.headerLine + index;
      if (index === 0 || line === detection.unitsRowLine) return;
      try {
        const quoteError = results.errors.find((e) => e.type === 'Quotes');
        if (quoteError) {
          throw new AppError('invalid_input', `Line ${line}: ${quoteError.message.toLowerCase()}; a quoted cell is not closed.`, { row: line });
        }
        const cells = results.data;
        if (cells.every((c) => c.trim() === '') || isCommentRow(cells)) return;
        onRow(cells, line);
        if (++taken >= limit) parser.abort();
      } catch (e) {
        failure = e;
        parser.abort();
      }
    },
  });
  if (failure !== null) throw failure;
}

/**
 * {@link streamTableRows} for a table with no quote and no CR (what most loggers write): with no
 * quoting, papaparse's rows are exactly the LF-separated lines split at the delimiter, so they are
 * cut that way directly (the native `indexOf` and `split`), with the same line numbers and skips.
 */
function streamPlainRows(detection: DetectionReport, table: string, onRow: (cells: string[], line: number) => void, limit: number): void {
  const n = table.length;
  let start = 0;
  let index = -1;
  let taken = 0;
  while (start < n) {
    let end = table.indexOf('\n', start);
    if (end < 0) end = n;
    index++;
    const line = detection.headerLine + index;
    if (index !== 0 && line !== detection.unitsRowLine) {
      const cells = table.slice(start, end).split(detection.delimiter);
      if (!cells.every((c) => c.trim() === '') && !isCommentRow(cells)) {
        onRow(cells, line);
        if (++taken >= limit) return;
      }
    }
    start = end + 1;
  }
}

/**
 * Parses a logger text file into a normalised run in one call.
 *
 * 0. {@link assertTextWithinLimits}: line length, blank-line runs and quoted cells within limits.
 * 1. {@link inspectText}: byte-order mark, line endings, delimiter, decimal comma, header line.
 * 2. Mapping: the caller's (validated with the zod schema) or {@link proposeMappingWithNotes} from
 *    the header and the first {@link SAMPLE_ROWS} rows.
 * 3. Every data row streamed through {@link createRowNormaliser}.
 *
 * For a very large upload this is already the streaming path: rows go from papaparse's `step`
 * callback into the normaliser one at a time.
 *
 * @throws AppError('invalid_input') naming the line and column of the first problem.
 */
export function parseLoggerText(
  text: string,
  mapping: ColumnMapping | undefined,
  joint: JointForImport,
  options: ParseLoggerTextOptions = {},
): LoggerTextResult {
  assertTextWithinLimits(text);
  const detection = inspectText(text);
  const sample: TableRow[] = [];
  streamTableRows(detection, (cells, line) => sample.push({ line, cells }), SAMPLE_ROWS);
  const proposal = mapping
    ? null
    : proposeMappingWithNotes(detection.headers, sample.map((r) => r.cells), detection.headerLine, { channelMap: joint.channelMap, studCount: joint.studCount, metadata: detection.metadata });
  const used = mapping ? parseColumnMapping(mapping) : proposal!.mapping;
  const normaliser: RowNormaliser = createRowNormaliser(detection.headers, used, joint, {
    decimalComma: detection.decimalComma,
    firstDataLine: detection.firstDataLine,
    headerLine: detection.headerLine,
    derive: options.derive,
    longStepPerTimeStamp: used.shape === 'long' && used.stepColumn === null && everyStampComplete(detection.headers, used, sample, joint.studCount),
  });
  streamTableRows(detection, (cells, line) => normaliser.push(cells, line));
  const result = normaliser.finish();
  return {
    detection,
    mapping: used,
    mappingProposed: proposal !== null,
    mappingNotes: proposal?.notes ?? [],
    mappingCertain: proposal?.certain ?? true,
    zeroNotes: result.zeroNotes,
    preview: { headers: detection.headers, rows: sample.slice(0, PREVIEW_ROWS) },
    run: result.run,
    derivedSteps: result.derivedSteps,
    derived: result.derived,
    stepLines: result.stepLines,
    warnings: result.warnings,
    rowCount: result.rowCount,
  };
}
