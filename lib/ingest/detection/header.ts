/** Finding the header row of a logger table, a units row below it, and the lines above it. */
import { AppError } from '@/lib/http/errors';
import { isNumericText } from '../numbers';
import { isBlank, isComment, splitLine, type Delimiter, type SampleLine } from './lines';

/** A non-table line above the header. */
export interface LineAboveHeader {
  /** 1-based line number in the file. */
  line: number;
  /** `comment`: starts with `#` or `//`; `metadata`: any other non-blank line; `blank`. */
  kind: 'comment' | 'metadata' | 'blank';
  text: string;
  /** For `key: value`, `key = value` or `key<delimiter>value` metadata lines. */
  key?: string;
  value?: string;
}

/** What {@link findHeader} found. */
export interface HeaderFound {
  /** The header line. */
  header: SampleLine;
  /** Column names, trimmed, with the units of a units row appended (`Stud 1 [kN]`). */
  headers: string[];
  unitsRowLine: number | null;
  linesAboveHeader: LineAboveHeader[];
  metadata: Array<{ line: number; key: string; value: string }>;
}

const UNIT_CELL = /^[[(]?\s*(s|ms|min|h|n|kn|lbf|lb|kip|kips|µε|με|ue|microstrain|n·m|nm|n-m|ft-lb|ft·lb|ftlb|lbf·ft|bar|psi|mpa|-|—)\s*[\])]?$/i;

function parseMetadata(text: string, delimiter: Delimiter): { key: string; value: string } | null {
  const kv = /^\s*([^:=;,\t]{1,80}?)\s*[:=]\s*(.*?)\s*$/.exec(text.replace(/^\s*(#|\/\/)\s*/, ''));
  if (kv && kv[1] && !isNumericText(kv[1])) return { key: kv[1], value: kv[2] ?? '' };
  const cells = splitLine(text, delimiter)
    .map((c) => c.trim())
    .filter((c) => c !== '');
  if (cells.length >= 2 && cells[0] && !isNumericText(cells[0])) {
    return { key: cells[0], value: cells.slice(1).join(' ') };
  }
  return null;
}

/** `Stud 1` + `kN` → `Stud 1 [kN]`; a blank or dash unit leaves the name as it is. */
function withUnits(headers: readonly string[], units: readonly string[]): string[] {
  return headers.map((h, k) => {
    const u = (units[k] ?? '').replace(/^[[(]\s*|\s*[\])]$/g, '');
    return u === '' || u === '-' || u === '—' ? h : `${h} [${u}]`;
  });
}

/**
 * The header: the first line with the table's cell count, no empty cell and at least one
 * non-numeric cell, followed by a line with a number in it (or by nothing: a header-only file).
 * A line of units (`s`, `kN`, `µε`, ...) right below the header is merged into the column names.
 * Every line before it is kept as blank, comment or metadata (`key: value`, `key = value`,
 * `key,value`, or any line that is not the header).
 *
 * @throws AppError('invalid_input') when the first full row is all numbers, or no header is found.
 */
export function findHeader(lines: readonly SampleLine[], delimiter: Delimiter, cellCount: number, firstContentLine: number): HeaderFound {
  const linesAboveHeader: LineAboveHeader[] = [];
  const metadata: HeaderFound['metadata'] = [];
  const cellsOf = (at: number) => (at >= 0 ? splitLine(lines[at]!.text, delimiter).map((c) => c.trim()) : null);
  const nextContent = (from: number): number => {
    for (let j = from; j < lines.length; j++) {
      const t = lines[j]!.text;
      if (!isBlank(t) && !isComment(t)) return j;
    }
    return -1;
  };
  for (let i = 0; i < lines.length; i++) {
    const l = lines[i]!;
    if (isBlank(l.text) || isComment(l.text)) {
      linesAboveHeader.push({ line: l.line, kind: isBlank(l.text) ? 'blank' : 'comment', text: l.text });
      continue;
    }
    const cells = cellsOf(i)!;
    if (cells.length === cellCount && cells.every((c) => c !== '')) {
      if (cells.every(isNumericText)) {
        throw new AppError(
          'invalid_input',
          `Line ${l.line}: no header row. The first row of the table is all numbers; add a header row that names the columns (e.g. "Time (s)", "Stud 1", ...).`,
          { row: l.line },
        );
      }
      const n1 = nextContent(i + 1);
      const next = cellsOf(n1);
      if (next === null || next.some(isNumericText)) return { header: l, headers: cells, unitsRowLine: null, linesAboveHeader, metadata };
      const after = cellsOf(nextContent(n1 + 1));
      if (next.length === cellCount && next.every((c) => UNIT_CELL.test(c) || c === '') && (after === null || after.some(isNumericText))) {
        return { header: l, headers: withUnits(cells, next), unitsRowLine: lines[n1]!.line, linesAboveHeader, metadata };
      }
    }
    const meta = parseMetadata(l.text, delimiter);
    linesAboveHeader.push({ line: l.line, kind: 'metadata', text: l.text, ...(meta ?? {}) });
    if (meta) metadata.push({ line: l.line, ...meta });
  }
  throw new AppError(
    'invalid_input',
    `Line ${firstContentLine}: no header row found. No line names ${cellCount} columns above the data.`,
    { row: firstContentLine },
  );
}
