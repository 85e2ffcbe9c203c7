/**
 * Limits on the shape of an uploaded logger text, checked in one pass before any parsing, so a
 * pathological file (one 20 MB line, a quoted cell that never closes, millions of blank lines) is
 * refused at once with the line it goes wrong on. Pure and browser-safe: the upload page's web
 * worker and the server's parse worker apply the same rules.
 *
 * The limits are our own choice, far above what a logger writes (common practice: a logger row
 * holds a time stamp and a few dozen numbers, well under a thousand characters).
 */
import { AppError } from '@/lib/http/errors';
import { formatDecimals } from '@/lib/calc/units';

/** Longest physical line accepted, in characters. */
export const MAX_LINE_CHARS = 16_384;
/** Longest quoted cell accepted, in characters (a quoted cell may span lines). */
export const MAX_QUOTED_CELL_CHARS = 4_096;
/** Most blank lines accepted in a row. */
export const MAX_BLANK_LINES_IN_A_ROW = 1_000;
/** Characters of the input a message quotes at most. */
export const QUOTE_CHARS = 40;

const LF = 10;
const CR = 13;
const QUOTE = 34;

/**
 * A piece of the input for a message: at most {@link QUOTE_CHARS} characters, in double quotes,
 * with an ellipsis when it was cut (`"12,5x…"`).
 */
export function quoteInput(text: string, max = QUOTE_CHARS): string {
  return `"${clipInput(text, max)}"`;
}

/** A piece of the input for a message without quotes: trimmed, cut to `max` characters with an ellipsis. */
export function clipInput(text: string, max = QUOTE_CHARS): string {
  const trimmed = text.trim();
  return trimmed.length > max ? `${trimmed.slice(0, max)}…` : trimmed;
}

const formatCount = (n: number) => formatDecimals(n, 0);

function lineTooLong(text: string, line: number, start: number): AppError {
  return new AppError(
    'invalid_input',
    `Line ${line}: the line is longer than ${formatCount(MAX_LINE_CHARS)} characters (it starts ${quoteInput(text.slice(start, start + QUOTE_CHARS + 1))}). A logger row is far shorter; check that this is the logger's CSV or text export.`,
    { row: line },
  );
}

function tooManyBlankLines(line: number, blankFrom: number): AppError {
  return new AppError(
    'invalid_input',
    `Line ${line}: more than ${formatCount(MAX_BLANK_LINES_IN_A_ROW)} blank lines in a row (from line ${blankFrom}). Remove them, or export the run from the logger again.`,
    { row: line },
  );
}

/** {@link assertLinesWithinLimits} for text whose lines all end in LF (no CR): the line ends are found with the native `indexOf`. */
function assertLfLinesWithinLimits(text: string): void {
  const n = text.length;
  let line = 1;
  let start = 0;
  let blankRun = 0;
  let blankFrom = 0;
  while (start < n) {
    let end = text.indexOf('\n', start);
    if (end < 0) end = n;
    if (end - start > MAX_LINE_CHARS) throw lineTooLong(text, line, start);
    let blank = true;
    for (let i = start; i < end && blank; i++) {
      const c = text.charCodeAt(i);
      blank = c === 32 || c === 9;
    }
    if (blank) {
      if (blankRun++ === 0) blankFrom = line;
      if (blankRun > MAX_BLANK_LINES_IN_A_ROW) throw tooManyBlankLines(line, blankFrom);
    } else blankRun = 0;
    line++;
    start = end + 1;
  }
}

/**
 * Checks line lengths and runs of blank lines in one pass (no allocation).
 * @throws AppError('invalid_input') naming the line: a line over {@link MAX_LINE_CHARS}
 *   characters, or more than {@link MAX_BLANK_LINES_IN_A_ROW} blank lines in a row.
 */
export function assertLinesWithinLimits(text: string): void {
  if (text.indexOf('\r') < 0) return assertLfLinesWithinLimits(text);
  let line = 1;
  let start = 0;
  let blankRun = 0;
  let blankFrom = 0;
  let blank = true;
  const n = text.length;
  for (let i = 0; i <= n; i++) {
    const c = i < n ? text.charCodeAt(i) : LF;
    if (c !== LF && c !== CR) {
      if (blank && c !== 32 && c !== 9) blank = false;
      if (i - start >= MAX_LINE_CHARS) throw lineTooLong(text, line, start);
      continue;
    }
    if (i === n && i === start) break;
    if (blank) {
      if (blankRun++ === 0) blankFrom = line;
      if (blankRun > MAX_BLANK_LINES_IN_A_ROW) throw tooManyBlankLines(line, blankFrom);
    } else blankRun = 0;
    if (c === CR && text.charCodeAt(i + 1) === LF) i++;
    line++;
    start = i + 1;
    blank = true;
  }
}

const COMMA = 44;
const SEMICOLON = 59;
const TAB = 9;

/**
 * Checks that every quoted cell (a cell starting with `"`, papaparse's rule) closes within
 * {@link MAX_QUOTED_CELL_CHARS} characters. Runs before the delimiter is known, so a cell starts
 * at a line start or after any accepted delimiter (comma, semicolon, tab).
 * @throws AppError('invalid_input') naming the line where the cell opens.
 */
export function assertQuotedCellsWithinLimits(text: string): void {
  if (text.indexOf('"') < 0) return; // no quoted cell at all (most logger files)
  let line = 1;
  let cellStart = true;
  const n = text.length;
  for (let i = 0; i < n; i++) {
    const c = text.charCodeAt(i);
    if (c === QUOTE && cellStart) {
      const openedOn = line;
      let j = i + 1;
      for (; j < n; j++) {
        const q = text.charCodeAt(j);
        if (q === QUOTE) {
          if (text.charCodeAt(j + 1) === QUOTE) j++;
          else break;
        } else if (q === LF || (q === CR && text.charCodeAt(j + 1) !== LF)) line++;
        if (j - i > MAX_QUOTED_CELL_CHARS) {
          throw new AppError(
            'invalid_input',
            `Line ${openedOn}: a quoted cell starts here and runs on for more than ${formatCount(MAX_QUOTED_CELL_CHARS)} characters; its closing quote (") is probably missing.`,
            { row: openedOn },
          );
        }
      }
      i = j;
      cellStart = false;
      continue;
    }
    if (c === LF || (c === CR && text.charCodeAt(i + 1) !== LF)) {
      line++;
      cellStart = true;
    } else cellStart = c === COMMA || c === SEMICOLON || c === TAB || c === CR;
  }
}

/**
 * Every shape limit of a logger text, in two passes without allocation: line length, blank-line
 * runs, quoted cells.
 * @throws AppError('invalid_input') naming the line.
 */
export function assertTextWithinLimits(text: string): void {
  assertLinesWithinLimits(text);
  assertQuotedCellsWithinLimits(text);
}
