/** Choosing the column separator of a logger text file. */
import { splitLine, type Delimiter, type SampleLine } from './lines';

/** Tab first, then semicolon, then comma: the order ties are broken in. */
const DELIMITERS: readonly Delimiter[] = ['\t', ';', ','];

/** Names for the upload preview. */
export const DELIMITER_NAMES: Record<Delimiter, string> = { '\t': 'Tab', ';': 'Semicolon', ',': 'Comma' };

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

/**
 * Among tab, semicolon and comma, the one whose most common cell count (≥ 2) is shared by the most
 * content lines; ties go to tab, then semicolon, then comma (a decimal comma must not pass for a
 * delimiter). Returns null when no candidate splits any line, with the table's cell count otherwise.
 */
export function chooseDelimiter(content: readonly SampleLine[]): { delimiter: Delimiter; cellCount: number } | null {
  let chosen: { delimiter: Delimiter; cellCount: number } | null = null;
  let best = 0;
  for (const d of DELIMITERS) {
    const { mode, score } = modeAtLeastTwo(content.map((l) => splitLine(l.text, d).length));
    if (score > best) {
      best = score;
      chosen = { delimiter: d, cellCount: mode };
    }
  }
  return chosen;
}
