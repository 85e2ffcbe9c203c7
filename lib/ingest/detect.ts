/**
 * First look at an uploaded logger file: is it text, what separates the columns, which decimal
 * separator it uses, and where the header row is. Pure and browser-safe (no Node imports), so the
 * upload widget's web worker and the server route run the same checks.
 *
 * The rules are our own heuristics (common practice for CSV sniffing), documented on each export.
 */
import { AppError } from '@/lib/http/errors';
import { decimalSeparatorOf, isNumericText } from './numbers';
import { clipInput } from './text-limits';

/** Column separators we accept. */
export type Delimiter = ',' | ';' | '\t';
/** Line ending found in the file (`none` for a single line without an ending). */
export type LineEnding = 'CRLF' | 'LF' | 'CR' | 'none';

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

const DELIMITERS: readonly Delimiter[] = ['\t', ';', ','];
const DELIMITER_NAMES: Record<Delimiter, string> = { '\t': 'Tab', ';': 'Semicolon', ',': 'Comma' };
const UNIT_CELL = /^[[(]?\s*(s|ms|min|h|n|kn|lbf|lb|kip|kips|µε|με|ue|microstrain|n·m|nm|n-m|ft-lb|ft·lb|ftlb|lbf·ft|bar|psi|mpa|-|—)\s*[\])]?$/i;

/** Splits one line into cells, honouring double quotes (`""` is a quote inside a quoted cell). */
export function splitLine(line: string, delimiter: Delimiter): string[] {
  const cells: string[] = [];
  let cell = '';
  let quoted = false;
  for (let i = 0; i < line.length; i++) {
    const ch = line[i];
    if (quoted) {
      if (ch === '"') {
        if (line[i + 1] === '"') {
          cell += '"';
          i++;
        } else quoted = false;
      } else cell += ch;
    } else if (ch === '"' && cell.trim() === '') {
      quoted = true;
      cell = '';
    } else if (ch === delimiter) {
      cells.push(cell);
      cell = '';
    } else cell += ch;
  }
  cells.push(cell);
  return cells;
}

interface SampleLine {
  line: number;
  start: number;
  text: string;
}

function sampleLines(text: string, max: number): SampleLine[] {
  const out: SampleLine[] = [];
  let start = 0;
  let line = 1;
  while (start <= text.length && out.length < max) {
    let end = start;
    while (end < text.length && text[end] !== '\n' && text[end] !== '\r') end++;
    out.push({ line, start, text: text.slice(start, end) });
    if (end >= text.length) break;
    start = end + (text[end] === '\r' && text[end + 1] === '\n' ? 2 : 1);
    line++;
  }
  return out;
}

function isComment(t: string): boolean {
  const s = t.trimStart();
  return s.startsWith('#') || s.startsWith('//');
}

function isBlank(t: string): boolean {
  return t.trim() === '';
}

function modeAtLeastTwo(counts: number[]): { mode: number; score: number } {
  const tally = new Map<number, number>();
  for (const c of counts) if (c >= 2) tally.set(c, (tally.get(c) ?? 0) + 1);
  let mode = 0;
  let score = 0;
  for (const [c, n] of tally) {
    if (n > score || (n === score && c > mode)) {
      mode = c;
      score = n;
    }
  }
  return { mode, score };
}

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

function plural(n: number, word: string): string {
  return `${n} ${word}${n === 1 ? '' : 's'}`;
}

/**
 * Detects the layout of a logger text file.
 *
 * Rules (our heuristics):
 * - A leading U+FEFF (UTF-8 byte-order mark) is removed and reported.
 * - Line endings: CRLF if any `\r\n` occurs, else LF, else CR.
 * - Delimiter: among tab, semicolon and comma, the one whose most common cell count (≥ 2) is shared
 *   by the most sampled lines; ties go to tab, then semicolon, then comma (a decimal comma must not
 *   pass for a delimiter). None → "unknown delimiter".
 * - Above the header: blank lines, comments (`#`, `//`) and metadata lines (`key: value`,
 *   `key = value`, `key,value`, or any line that is not the header).
 * - Header: the first line with the table's cell count, no empty cell and at least one non-numeric
 *   cell, followed by a line with a number in it (or by nothing: a header-only file). If the first
 *   such line is all numbers, the file has no header. A line of units (`s`, `kN`, `µε`, ...) right
 *   below the header is merged into the column names.
 * - Decimal comma: only with `;` or tab, when data cells like `12,5` are at least as common as `12.5`.
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

  let delimiter: Delimiter | null = null;
  let cellCount = 0;
  let best = 0;
  for (const d of DELIMITERS) {
    const { mode, score } = modeAtLeastTwo(content.map((l) => splitLine(l.text, d).length));
    if (score > best) {
      best = score;
      delimiter = d;
      cellCount = mode;
    }
  }
  const firstContent = content[0]!;
  if (delimiter === null) {
    throw new AppError(
      'invalid_input',
      `Line ${firstContent.line}: unknown delimiter. No comma, semicolon or tab separates the columns; save the file as CSV (comma or semicolon) or tab-separated text.`,
      { row: firstContent.line },
    );
  }
  const d = delimiter;

  const linesAboveHeader: LineAboveHeader[] = [];
  const metadata: DetectionReport['metadata'] = [];
  let headerIdx = -1;
  let headers: string[] = [];
  let unitsRowLine: number | null = null;
  const nextContent = (from: number): number => {
    for (let j = from; j < lines.length; j++) {
      const t = lines[j]!.text;
      if (!isBlank(t) && !isComment(t)) return j;
    }
    return -1;
  };
  for (let i = 0; i < lines.length; i++) {
    const l = lines[i]!;
    if (isBlank(l.text)) {
      linesAboveHeader.push({ line: l.line, kind: 'blank', text: l.text });
      continue;
    }
    if (isComment(l.text)) {
      linesAboveHeader.push({ line: l.line, kind: 'comment', text: l.text });
      continue;
    }
    const cells = splitLine(l.text, d).map((c) => c.trim());
    if (cells.length === cellCount && cells.every((c) => c !== '')) {
      if (cells.every(isNumericText)) {
        throw new AppError(
          'invalid_input',
          `Line ${l.line}: no header row. The first row of the table is all numbers; add a header row that names the columns (e.g. "Time (s)", "Stud 1", ...).`,
          { row: l.line },
        );
      }
      const n1 = nextContent(i + 1);
      const next = n1 >= 0 ? splitLine(lines[n1]!.text, d).map((c) => c.trim()) : null;
      if (next === null || next.some(isNumericText)) {
        headerIdx = i;
        headers = cells;
        break;
      }
      const n2 = nextContent(n1 + 1);
      const after = n2 >= 0 ? splitLine(lines[n2]!.text, d) : null;
      if (next.length === cellCount && next.every((c) => UNIT_CELL.test(c) || c === '') && (after === null || after.some(isNumericText))) {
        headerIdx = i;
        unitsRowLine = lines[n1]!.line;
        headers = cells.map((h, k) => {
          const u = (next[k] ?? '').replace(/^[[(]\s*|\s*[\])]$/g, '');
          return u === '' || u === '-' || u === '—' ? h : `${h} [${u}]`;
        });
        break;
      }
    }
    const meta = parseMetadata(l.text, d);
    linesAboveHeader.push({ line: l.line, kind: 'metadata', text: l.text, ...(meta ?? {}) });
    if (meta) metadata.push({ line: l.line, ...meta });
  }
  if (headerIdx < 0) {
    throw new AppError(
      'invalid_input',
      `Line ${firstContent.line}: no header row found. No line names ${cellCount} columns above the data.`,
      { row: firstContent.line },
    );
  }
  const headerLine = lines[headerIdx]!;
  const firstDataLine = (unitsRowLine ?? headerLine.line) + 1;

  let commas = 0;
  let points = 0;
  if (d !== ',') {
    let seen = 0;
    for (const l of lines) {
      if (l.line < firstDataLine || isBlank(l.text) || isComment(l.text)) continue;
      if (++seen > 50) break;
      for (const c of splitLine(l.text, d)) {
        const separator = decimalSeparatorOf(c);
        if (separator === 'comma') commas++;
        else if (separator === 'point') points++;
      }
    }
  }
  const decimalComma = commas > 0 && commas >= points;
  const mixedDecimalSeparators = commas > 0 && points > 0;

  const above = linesAboveHeader.filter((l) => l.kind !== 'blank').length;
  const first = [
    `${DELIMITER_NAMES[d]}-delimited`,
    decimalComma ? 'decimal comma' : 'decimal point',
    above === 0 ? `header on line ${headerLine.line}` : `${plural(above, 'metadata line')} above the header (line ${headerLine.line})`,
  ].join(', ');
  const sentences = [`${first}.`];
  if (mixedDecimalSeparators) sentences.push('Both decimal commas and decimal points appear in the data; check the cells the import reports.');
  if (unitsRowLine !== null) sentences.push(`Units row below the header (line ${unitsRowLine}) merged into the column names.`);
  if (hadBom) sentences.push('UTF-8 byte-order mark removed.');
  sentences.push(
    lineEnding === 'CRLF' ? 'Windows line endings (CRLF).' : lineEnding === 'CR' ? 'Old Mac line endings (CR).' : lineEnding === 'LF' ? 'Unix line endings (LF).' : 'A single line without a line ending.',
  );
  if (metadata.length > 0) sentences.push(`Metadata: ${metadata.map((m) => `${clipInput(m.key)} = ${clipInput(m.value)}`).join('; ')}.`);

  return {
    text,
    hadBom,
    lineEnding,
    delimiter: d,
    decimalComma,
    mixedDecimalSeparators,
    headerLine: headerLine.line,
    headerOffset: headerLine.start,
    headers,
    unitsRowLine,
    firstDataLine,
    linesAboveHeader,
    metadata,
    sentences,
  };
}

/** Bytes in one MB as used in size messages (1 MB = 1,048,576 bytes, as most upload limits are set). */
export const BYTES_PER_MB = 1024 * 1024;

function formatMb(bytes: number): string {
  const mb = bytes / BYTES_PER_MB;
  return `${Number.isInteger(mb) ? mb : mb.toFixed(1)} MB`;
}

/** Offset of the first byte that breaks UTF-8 (RFC 3629: no overlongs, no surrogates, ≤ U+10FFFF), or -1. */
function firstInvalidUtf8(bytes: Uint8Array): number {
  let i = 0;
  const n = bytes.length;
  while (i < n) {
    const b = bytes[i]!;
    if (b < 0x80) {
      i++;
      continue;
    }
    let need: number;
    let min: number;
    let cp: number;
    if (b >= 0xc2 && b <= 0xdf) [need, min, cp] = [1, 0x80, b & 0x1f];
    else if (b >= 0xe0 && b <= 0xef) [need, min, cp] = [2, 0x800, b & 0x0f];
    else if (b >= 0xf0 && b <= 0xf4) [need, min, cp] = [3, 0x10000, b & 0x07];
    else return i;
    for (let k = 1; k <= need; k++) {
      const c = bytes[i + k];
      if (c === undefined || (c & 0xc0) !== 0x80) return i;
      cp = (cp << 6) | (c & 0x3f);
    }
    if (cp < min || cp > 0x10ffff || (cp >= 0xd800 && cp <= 0xdfff)) return i;
    i += need + 1;
  }
  return -1;
}

function lineOfByte(bytes: Uint8Array, offset: number): number {
  let line = 1;
  for (let i = 0; i < offset; i++) if (bytes[i] === 0x0a) line++;
  return line;
}

/**
 * Checks an uploaded file's bytes before parsing and returns its text (a leading byte-order mark is
 * kept so {@link inspectText} can report it). Uses `TextDecoder` with `fatal: true`; no `Buffer`.
 *
 * @param limitBytes the upload limit; the message states it in MB (1 MB = 1,048,576 bytes).
 * @throws AppError('too_large') over the limit; AppError('invalid_input') for an empty file, a file
 *   with NUL bytes (binary, or UTF-16 text) or invalid UTF-8 (the message names the line).
 */
export function assertTextFile(bytes: Uint8Array, limitBytes: number): string {
  if (bytes.length > limitBytes) {
    throw new AppError('too_large', `The file is ${formatMb(bytes.length)}; the limit is ${formatMb(limitBytes)}.`, {
      limitBytes,
      sizeBytes: bytes.length,
    });
  }
  if (bytes.length === 0) throw new AppError('invalid_input', 'The file is empty (0 bytes).', {});
  const utf16Bom = (bytes[0] === 0xff && bytes[1] === 0xfe) || (bytes[0] === 0xfe && bytes[1] === 0xff);
  const nul = bytes.indexOf(0);
  if (utf16Bom || nul >= 0) {
    const line = lineOfByte(bytes, Math.max(nul, 0));
    const message = utf16Bom
      ? 'The file is UTF-16 text, not UTF-8; save it as "CSV UTF-8" or plain UTF-8 text.'
      : `Line ${line}: the file is not a text file (it contains NUL bytes, byte ${nul + 1}). Upload the logger's CSV or text export.`;
    throw new AppError('invalid_input', message, utf16Bom ? {} : { row: line });
  }
  try {
    return new TextDecoder('utf-8', { fatal: true, ignoreBOM: true }).decode(bytes);
  } catch {
    const at = firstInvalidUtf8(bytes);
    const line = lineOfByte(bytes, Math.max(at, 0));
    throw new AppError(
      'invalid_input',
      `Line ${line}: the file is not valid UTF-8 text (byte ${at + 1}). Save it as "CSV UTF-8" or plain UTF-8 text.`,
      { row: line },
    );
  }
}
