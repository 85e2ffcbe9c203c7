/** The sentences the upload preview shows about what detection found, most important first. */
import { clipInput } from '../text-limits';
import { DELIMITER_NAMES } from './delimiter';
import type { LineAboveHeader } from './header';
import type { Delimiter } from './lines';

/** Line ending found in the file (`none` for a single line without an ending). */
export type LineEnding = 'CRLF' | 'LF' | 'CR' | 'none';

/** What the sentences are built from. */
export interface DetectionFacts {
  delimiter: Delimiter;
  decimalComma: boolean;
  mixedDecimalSeparators: boolean;
  headerLine: number;
  unitsRowLine: number | null;
  hadBom: boolean;
  lineEnding: LineEnding;
  linesAboveHeader: readonly LineAboveHeader[];
  metadata: ReadonlyArray<{ key: string; value: string }>;
}

function plural(n: number, word: string): string {
  return `${n} ${word}${n === 1 ? '' : 's'}`;
}

const LINE_ENDING_SENTENCES: Record<LineEnding, string> = {
  CRLF: 'Windows line endings (CRLF).',
  CR: 'Old Mac line endings (CR).',
  LF: 'Unix line endings (LF).',
  none: 'A single line without a line ending.',
};

/** Human sentences describing the detected layout. */
export function describeDetection(f: DetectionFacts): string[] {
  const above = f.linesAboveHeader.filter((l) => l.kind !== 'blank').length;
  const first = [
    `${DELIMITER_NAMES[f.delimiter]}-delimited`,
    f.decimalComma ? 'decimal comma' : 'decimal point',
    above === 0 ? `header on line ${f.headerLine}` : `${plural(above, 'metadata line')} above the header (line ${f.headerLine})`,
  ].join(', ');
  const sentences = [`${first}.`];
  if (f.mixedDecimalSeparators) sentences.push('Both decimal commas and decimal points appear in the data; check the cells the import reports.');
  if (f.unitsRowLine !== null) sentences.push(`Units row below the header (line ${f.unitsRowLine}) merged into the column names.`);
  if (f.hadBom) sentences.push('UTF-8 byte-order mark removed.');
  sentences.push(LINE_ENDING_SENTENCES[f.lineEnding]);
  if (f.metadata.length > 0) sentences.push(`Metadata: ${f.metadata.map((m) => `${clipInput(m.key)} = ${clipInput(m.value)}`).join('; ')}.`);
  return sentences;
}
