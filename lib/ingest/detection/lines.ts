/** Lines and cells of a logger text file as detection sees them (before any parser runs). */

/** Column separators we accept. */
export type Delimiter = ',' | ';' | '\t';

/** One line of the sampled text. */
export interface SampleLine {
  /** 1-based line number in the file. */
  line: number;
  /** Character offset in the text where the line starts. */
  start: number;
  text: string;
}

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

/** The first `max` lines of `text` (CRLF, LF or CR endings), with their offsets. */
export function sampleLines(text: string, max: number): SampleLine[] {
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

/** A comment line starts with `#` or `//`. */
export function isComment(t: string): boolean {
  const s = t.trimStart();
  return s.startsWith('#') || s.startsWith('//');
}

export function isBlank(t: string): boolean {
  return t.trim() === '';
}
