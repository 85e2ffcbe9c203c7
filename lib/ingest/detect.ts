/**
 * First look at a logger text file: what separates the columns, which decimal separator it uses,
 * and where the header row is. Pure and browser-safe (no Node imports), so the upload widget's web
 * worker and the server route run the same checks. Each job has its own file in `detection/`
 * (lines and cells, delimiter, header, decimal separator, the preview's sentences); checking the
 * bytes before this is `text-file.ts`.
 *
 * The rules are our own heuristics (common practice for CSV sniffing), documented on each export.
 */
import { AppError } from '@/lib/http/errors';
import { detectDecimalSeparator } from './detection/decimal-separator';
import { chooseDelimiter } from './detection/delimiter';
import { findHeader, type LineAboveHeader } from './detection/header';
import { isBlank, isComment, sampleLines, type Delimiter } from './detection/lines';
import { describeDetection, type LineEnding } from './detection/sentences';

export type { Delimiter } from './detection/lines';
export type { LineAboveHeader } from './detection/header';
export type { LineEnding } from './detection/sentences';

/** What {@link inspectText} found. Line numbers are 1-based lines of the file as uploaded. */
export interface DetectionReport {
  /** The text with any byte-order mark removed; line numbers below refer to it. */
  text: string;
  /** A UTF-8 byte-order mark was present and has been removed from `text`. */
  hadBom: boolean;
  lineEnding: LineEnding;
  delimiter: Delimiter;
  /** Numbers use a decimal comma (`12,5`); only possible with `;` or tab delimiters. */
  decimalComma: boolean;
  /** Both `12,5` and `12.5` style numbers were seen in the sampled data rows. */
  mixedDecimalSeparators: boolean;
  /** Line number of the header row. */
  headerLine: number;
  /** Character offset in `text` where the header line starts (for parsing only the table). */
  headerOffset: number;
  /** Column names, trimmed. When a units row sits below the header, its units are appended (`Stud 1 [kN]`). */
  headers: string[];
  /** Line number of the units row below the header, or null. */
  unitsRowLine: number | null;
  /** Line number of the first data row. */
  firstDataLine: number;
  /** Every line above the header, blank ones included. */
  linesAboveHeader: LineAboveHeader[];
  /** Key/value pairs read from metadata lines above the header. */
  metadata: Array<{ line: number; key: string; value: string }>;
  /** Human sentences for the upload preview, most important first. */
  sentences: string[];
}

/** How many lines {@link inspectText} examines; pass at least this much of a large file. */
export const DETECTION_SAMPLE_LINES = 200;

/**
 * Detects the layout of a logger text file.
 *
 * Rules (our heuristics):
 * - A leading U+FEFF (UTF-8 byte-order mark) is removed and reported.
 * - Line endings: CRLF if any `\r\n` occurs, else LF, else CR.
 * - Delimiter: among tab, semicolon and comma, the one whose most common cell count (≥ 2) is shared
 *   by the most sampled lines; ties go to tab, then semicolon, then comma (a decimal comma must not
 *   pass for a delimiter). None → "unknown delimiter" (`detection/delimiter.ts`).
 * - Above the header: blank lines, comments (`#`, `//`) and metadata lines (`key: value`,
 *   `key = value`, `key,value`, or any line that is not the header).
 * - Header: the first line with the table's cell count, no empty cell and at least one non-numeric
 *   cell, followed by a line with a number in it (or by nothing: a header-only file). If the first
 *   such line is all numbers, the file has no header. A line of units (`s`, `kN`, `µε`, ...) right
 *   below the header is merged into the column names (`detection/header.ts`).
 * - Decimal comma: only with `;` or tab, when data cells like `12,5` are at least as common as `12.5`
 *   (`detection/decimal-separator.ts`).
 *
 * Only the first {@link DETECTION_SAMPLE_LINES} lines are examined, so a caller streaming a large
 * file may pass just its beginning (the returned `text` is then that beginning).
 *
 * @throws AppError('invalid_input') for an empty file, an unknown delimiter or a missing header row.
 */
export function inspectText(input: string): DetectionReport {
  const hadBom = input.charCodeAt(0) === 0xfeff;
  const text = hadBom ? input.slice(1) : input;
  if (text.trim() === '') {
    throw new AppError('invalid_input', 'The file is empty: it has no text, only blank lines.', {});
  }
  const lineEnding: LineEnding = text.includes('\r\n') ? 'CRLF' : text.includes('\n') ? 'LF' : text.includes('\r') ? 'CR' : 'none';
  const lines = sampleLines(text, DETECTION_SAMPLE_LINES);
  const content = lines.filter((l) => !isBlank(l.text) && !isComment(l.text));
  if (content.length === 0) {
    throw new AppError('invalid_input', 'The file has only comment lines and no table.', {});
  }
  const firstContent = content[0]!;
  const chosen = chooseDelimiter(content);
  if (chosen === null) {
    throw new AppError(
      'invalid_input',
      `Line ${firstContent.line}: unknown delimiter. No comma, semicolon or tab separates the columns; save the file as CSV (comma or semicolon) or tab-separated text.`,
      { row: firstContent.line },
    );
  }
  const { delimiter } = chosen;
  const { header, headers, unitsRowLine, linesAboveHeader, metadata } = findHeader(lines, delimiter, chosen.cellCount, firstContent.line);
  const firstDataLine = (unitsRowLine ?? header.line) + 1;
  const { decimalComma, mixed: mixedDecimalSeparators } = detectDecimalSeparator(lines, delimiter, firstDataLine);
  const report: Omit<DetectionReport, 'sentences'> = {
    text,
    hadBom,
    lineEnding,
    delimiter,
    decimalComma,
    mixedDecimalSeparators,
    headerLine: header.line,
    headerOffset: header.start,
    headers,
    unitsRowLine,
    firstDataLine,
    linesAboveHeader,
    metadata,
  };
  return { ...report, sentences: describeDetection(report) };
}
