/**
 * The fast paths of the import must read exactly what the general paths read:
 * - rows of a table with no quote and no CR are cut with `indexOf`/`split` instead of papaparse:
 *   checked against papaparse itself (the outside reference) on the logger corpus's quote-free files;
 * - a plain decimal load cell is read with `Number` instead of the full parser: checked against the
 *   full parser (`readNumberCell`) cell by cell, and against `Number` (ECMAScript's StringToNumber).
 */
import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import Papa from 'papaparse';
import { describe, expect, it } from 'vitest';
import { inspectText } from '@/lib/ingest/detect';
import { streamTableRows } from '@/lib/ingest/parse-text';
import { readNumberCell } from '@/lib/ingest/numbers';
import { isPlainDecimal } from '@/lib/ingest/readers/cells';

const GOOD = path.join(__dirname, 'logger-corpus', 'good');
const plainFiles = readdirSync(GOOD)
  .filter((f) => /\.(csv|tsv|txt)$/.test(f))
  .map((file) => ({ file, text: readFileSync(path.join(GOOD, file), 'utf8') }))
  .filter(({ text }) => !text.includes('"') && !text.includes('\r'));

describe('rows of a quote-free table', () => {
  it('the corpus has quote-free files to check', () => {
    expect(plainFiles.length).toBeGreaterThanOrEqual(10);
  });

  it.each(plainFiles)('$file: the same rows and line numbers as papaparse gives', ({ text }) => {
    const detection = inspectText(text);
    const fast: Array<[number, string[]]> = [];
    streamTableRows(detection, (cells, line) => fast.push([line, cells]));
    // papaparse over the same table, with the skips streamTableRows applies (header, units row, blank and comment rows).
    const table = detection.text.slice(detection.headerOffset);
    const reference: Array<[number, string[]]> = [];
    Papa.parse<string[]>(table, { delimiter: detection.delimiter, skipEmptyLines: false }).data.forEach((cells, index) => {
      const line = detection.headerLine + index;
      const first = (cells[0] ?? '').trimStart();
      if (index === 0 || line === detection.unitsRowLine || cells.every((c) => c.trim() === '') || first.startsWith('#') || first.startsWith('//')) return;
      reference.push([line, cells]);
    });
    expect(fast).toEqual(reference);
  });

  it('stops after the limit', () => {
    const detection = inspectText(plainFiles[0]!.text);
    let seen = 0;
    streamTableRows(detection, () => seen++, 3);
    expect(seen).toBe(3);
  });
});

describe('isPlainDecimal', () => {
  const plain = ['0', '12', '-0.077', '1500.25', '007', '-0', '80.000', '123456789.123456789'];
  const other = ['', ' 12', '12 ', '+12', '1e3', '1.5e3', '12.', '.5', '-', '-.5', '1,5', '1.2.3', 'NaN', 'Infinity', '0x10', '12kN', '\u221212', '1 500'];

  it('accepts plain decimals, and each reads as the full parser reads it', () => {
    for (const cell of plain) {
      expect(isPlainDecimal(cell), cell).toBe(true);
      expect(readNumberCell(cell, false), cell).toEqual({ kind: 'number', value: Number(cell) });
    }
  });

  it('leaves everything else to the full parser', () => {
    for (const cell of other) expect(isPlainDecimal(cell), cell).toBe(false);
  });
});
