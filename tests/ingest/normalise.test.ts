import { describe, expect, it } from 'vitest';
import Papa from 'papaparse';
import { AppError } from '@/lib/http/errors';
import { inspectText } from '@/lib/ingest/detect';
import { createRowNormaliser, normaliseRows } from '@/lib/ingest/normalise';
import { parseLoggerText } from '@/lib/ingest/parse-text';
import { proposeMapping, type ColumnMapping } from '@/lib/ingest/shapes';
import { CORPUS_JOINT, FOUR_STUD_JOINT } from './joints';

const wide: ColumnMapping = {
  shape: 'wide',
  timeColumn: 't',
  studColumns: [1, 2, 3, 4].map((p) => ({ column: `S${p}`, position: p })),
  positionColumn: null,
  loadColumn: null,
  stepColumn: 'step',
  passColumn: null,
  torqueColumn: null,
  pressureColumn: null,
  tightenedColumn: null,
  loadUnit: 'kN',
  torqueUnit: 'N·m',
  tare: 'auto',
};
const headers = ['t', 'step', 'S1', 'S2', 'S3', 'S4'];

describe('normaliseRows', () => {
  it('uses the line numbers from firstDataLine and a tightened column when mapped', () => {
    const rows = [
      ['0', '1', '10', '0', '0', '0', '2'],
      ['1', '2', '10', '0', '10', '0', '3'],
    ];
    const r = normaliseRows(rows, [...headers, 'tightened'], { ...wide, tightenedColumn: 'tightened' }, FOUR_STUD_JOINT, { decimalComma: false, firstDataLine: 7 });
    // the tightened column says 2 for step 1 even though stud 1 rose: the column wins
    expect(r.run.steps.map((s) => s.position)).toEqual([2, 3]);
    expect(r.stepLines).toEqual([
      { order: 1, firstLine: 7, lastLine: 7 },
      { order: 2, firstLine: 8, lastLine: 8 },
    ]);
  });

  it('names the line from firstDataLine in errors', () => {
    const err = (() => {
      try {
        normaliseRows([['0', '1', 'x', '0', '0', '0']], headers, wide, FOUR_STUD_JOINT, { decimalComma: false, firstDataLine: 12 });
      } catch (e) {
        return e as AppError;
      }
      return null;
    })();
    expect(err?.message).toBe('Line 12, column "S1": "x" is not a number.');
    expect(err?.details).toEqual({ row: 12, column: 'S1' });
  });

  it('tolerates a trailing delimiter (extra empty cells) but not extra values', () => {
    const ok = normaliseRows([['0', '1', '5', '0', '0', '0', '']], headers, wide, FOUR_STUD_JOINT, { decimalComma: false, firstDataLine: 2 });
    expect(ok.run.steps).toHaveLength(1);
  });

  it('warns when no stud rose in a marker step and the position is a guess', () => {
    const r = normaliseRows([['0', '1', '5', '5', '5', '5'], ['1', '2', '5', '5', '5', '5']], headers, wide, FOUR_STUD_JOINT, { decimalComma: false, firstDataLine: 2 });
    expect(r.warnings.some((w) => w.includes('no stud load rose in step 2'))).toBe(true);
  });

  it('rejects microstrain without E and area before reading any row', () => {
    expect(() => createRowNormaliser(headers, { ...wide, loadUnit: 'microstrain' }, FOUR_STUD_JOINT, { decimalComma: false, firstDataLine: 2 })).toThrow(/Young's modulus/);
  });
});

describe('streaming 1,000,000 readings', () => {
  it('normalises 125,000 rows × 8 studs without a step column, fed row by row from papaparse', () => {
    // Invented series: 16 steps (cross pattern 1,5,3,7,2,6,4,8 twice), each a linear pull of 50 rows
    // to 40 kN (pass 1) or 80 kN (pass 2) followed by flat rows; 125,000 rows in total.
    const order = [1, 5, 3, 7, 2, 6, 4, 8];
    const loads = new Array(8).fill(0);
    const out: string[] = ['Time (s),S1 [kN],S2 [kN],S3 [kN],S4 [kN],S5 [kN],S6 [kN],S7 [kN],S8 [kN]'];
    let t = 0;
    const push = () => out.push(`${(t++ / 100).toFixed(2)},${loads.join(',')}`);
    const rowsPerStep = 7812; // 16 × 7812 = 124,992; a row at rest opens the file (its readings are the zero offsets, all 0 here), 7 flat rows close it
    push();
    for (let pass = 1; pass <= 2; pass++)
      for (const p of order) {
        const from = loads[p - 1];
        const to = pass * 40;
        for (let i = 1; i <= 50; i++) {
          loads[p - 1] = from + ((to - from) * i) / 50;
          push();
        }
        for (let i = 50; i < rowsPerStep; i++) push();
      }
    while (out.length - 1 < 125_000) push();
    expect(out.length - 1).toBe(125_000);
    const text = out.join('\n');

    const started = performance.now();
    const r = parseLoggerText(text, undefined, CORPUS_JOINT);
    const ms = performance.now() - started;
    expect(r.rowCount).toBe(125_000);
    expect(r.run.steps.map((s) => s.position)).toEqual([...order, ...order]);
    expect(r.run.steps.map((s) => s.pass)).toEqual([...Array(8).fill(1), ...Array(8).fill(2)]);
    expect(r.run.steps.at(-1)!.loadsN).toEqual(Array(8).fill(80_000));
    expect(ms).toBeLessThan(30_000); // generous: a regression to quadratic work would blow far past it

    // Same file through the public streaming API directly (what a server with a byte stream does).
    const det = inspectText(text.slice(0, 64 * 1024));
    const n = createRowNormaliser(det.headers, proposeMapping(det.headers, []), CORPUS_JOINT, { decimalComma: det.decimalComma, firstDataLine: det.firstDataLine });
    let line = det.headerLine - 1;
    Papa.parse<string[]>(text, {
      delimiter: det.delimiter,
      step: (res) => {
        line++;
        if (line > det.headerLine) n.push(res.data, line);
      },
    });
    expect(n.finish().run.steps).toEqual(r.run.steps);
  }, 60_000);
});
