/**
 * Good fixtures (tests/ingest/good/, all invented): each normalises to readings worked out by hand
 * from the fixture's construction, written out below next to each case.
 */
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { assertTextFile } from '@/lib/ingest/text-file';
import { parseLoggerText } from '@/lib/ingest/parse-text';
import type { JointForImport } from '@/lib/ingest/normalise';
import { NEWTONS_PER_LBF, NM_PER_FT_LB } from '@/lib/ingest/units';
import { FOUR_STUD_JOINT } from './joints';

const kN = (...v: number[]) => v.map((x) => x * 1000);

function load(file: string, joint: JointForImport = FOUR_STUD_JOINT) {
  const bytes = new Uint8Array(readFileSync(path.join(__dirname, 'good', file)));
  return parseLoggerText(assertTextFile(bytes, 1024 * 1024), undefined, joint);
}

function readings(r: ReturnType<typeof load>) {
  return r.run.steps.map((s) => ({ order: s.order, pass: s.pass, position: s.position, loadsN: s.loadsN }));
}

describe('good fixtures', () => {
  it('wide with step and pass columns: each step is read at its last row', () => {
    const r = load('wide-step-column.csv');
    expect(r.mapping.shape).toBe('wide');
    expect(r.derivedSteps).toBe(false);
    // Last row of each step (t = 1.0, 2.0, 2.5, 3.0, 3.5, 4.0, 4.5, 5.0); the tightened stud is the one that rose.
    expect(readings(r)).toEqual([
      { order: 1, pass: 1, position: 1, loadsN: kN(24, 0, 0, 0) },
      { order: 2, pass: 1, position: 3, loadsN: kN(22, 0, 25, 0) },
      { order: 3, pass: 1, position: 2, loadsN: kN(21, 20, 24, 0) },
      { order: 4, pass: 1, position: 4, loadsN: kN(20, 19, 23, 26) },
      { order: 5, pass: 2, position: 1, loadsN: kN(40, 18, 22, 25) },
      { order: 6, pass: 2, position: 3, loadsN: kN(39, 17, 45, 24) },
      { order: 7, pass: 2, position: 2, loadsN: kN(38, 44, 44, 23) },
      { order: 8, pass: 2, position: 4, loadsN: kN(37, 43, 43, 46) },
    ]);
    expect(r.run.steps.map((s) => s.timeS)).toEqual([1, 2, 2.5, 3, 3.5, 4, 4.5, 5]);
    // Step 1 is lines 4-5 (t 0.5 and 1.0); line 3 is the baseline row before the first marker.
    expect(r.stepLines[0]).toEqual({ order: 1, firstLine: 4, lastLine: 5 });
  });

  it('wide without a marker: steps derived, passes by the re-tightening rule', () => {
    const r = load('wide-no-marker.csv');
    expect(r.derivedSteps).toBe(true);
    // Construction: 3 zero rows, then per step one row at the midpoint, one at the final value (other
    // loaded studs drop 1 kN there), six flat rows. Pass 1 order 1,3,2,4 to 30 kN; pass 2 the same to 60 kN.
    expect(readings(r)).toEqual([
      { order: 1, pass: 1, position: 1, loadsN: kN(30, 0, 0, 0) },
      { order: 2, pass: 1, position: 3, loadsN: kN(29, 0, 30, 0) },
      { order: 3, pass: 1, position: 2, loadsN: kN(28, 30, 29, 0) },
      { order: 4, pass: 1, position: 4, loadsN: kN(27, 29, 28, 30) },
      { order: 5, pass: 2, position: 1, loadsN: kN(60, 28, 27, 29) },
      { order: 6, pass: 2, position: 3, loadsN: kN(59, 27, 60, 28) },
      { order: 7, pass: 2, position: 2, loadsN: kN(58, 60, 59, 27) },
      { order: 8, pass: 2, position: 4, loadsN: kN(57, 59, 58, 60) },
    ]);
    // Header on line 2, data from line 3; step j (0-based) peaks on data row 3 + 8j + 1, i.e. line 7 + 8j.
    expect(r.derived.map((d) => d.lastLine)).toEqual([7, 15, 23, 31, 39, 47, 55, 63]);
    expect(r.derived.every((d) => d.firstLine < d.lastLine)).toBe(true);
    expect(r.warnings.join(' ')).toContain('derived from the loads');
  });

  it('long with only changed studs listed: pivots by time and carries values forward', () => {
    const r = load('long-carry-forward.csv');
    expect(r.mapping.shape).toBe('long');
    // Pass 1 of the wide-no-marker construction.
    expect(readings(r)).toEqual([
      { order: 1, pass: 1, position: 1, loadsN: kN(30, 0, 0, 0) },
      { order: 2, pass: 1, position: 3, loadsN: kN(29, 0, 30, 0) },
      { order: 3, pass: 1, position: 2, loadsN: kN(28, 30, 29, 0) },
      { order: 4, pass: 1, position: 4, loadsN: kN(27, 29, 28, 30) },
    ]);
  });

  it('long with an event column: the reading is the last time stamp of each event', () => {
    const r = load('long-event.csv');
    expect(r.mapping).toMatchObject({ shape: 'long', positionColumn: 'stud', loadColumn: 'load (kN)', stepColumn: 'event', loadUnit: 'kN' });
    // Event 1 ends at t = 1.0 (stud 1 at 30, others 0); event 2 at t = 1.5 lists studs 3 and 1; 2 and 4 carry 0.
    expect(readings(r)).toEqual([
      { order: 1, pass: 1, position: 1, loadsN: kN(30, 0, 0, 0) },
      { order: 2, pass: 1, position: 3, loadsN: kN(29, 0, 30, 0) },
    ]);
  });

  it('step table with torque in ft-lb: torque converted to N·m, step numbers per pass', () => {
    const r = load('step-table-torque.csv');
    expect(r.mapping).toMatchObject({ shape: 'step_table', torqueColumn: 'Torque (ft-lb)', torqueUnit: 'ft-lb' });
    expect(readings(r)).toEqual([
      { order: 1, pass: 1, position: 1, loadsN: kN(30, 0, 0, 0) },
      { order: 2, pass: 1, position: 3, loadsN: kN(29, 0, 30, 0) },
      { order: 3, pass: 2, position: 1, loadsN: kN(60, 0, 29, 0) },
    ]);
    // 100 ft-lb and 200 ft-lb times 1.3558179483314004 N·m per ft-lb.
    expect(r.run.steps.map((s) => s.appliedTorqueNm)).toEqual([100 * NM_PER_FT_LB, 100 * NM_PER_FT_LB, 200 * NM_PER_FT_LB]);
  });

  it('semicolon with decimal comma', () => {
    const r = load('semicolon-decimal-comma.csv');
    expect(r.detection).toMatchObject({ delimiter: ';', decimalComma: true });
    // 25,5 -> 25.5 kN at the last row of step 1; step 2: 25,0 and 24,5.
    expect(readings(r)).toEqual([
      { order: 1, pass: 1, position: 1, loadsN: kN(25.5, 0, 0, 0) },
      { order: 2, pass: 1, position: 3, loadsN: kN(25, 0, 24.5, 0) },
    ]);
    expect(r.run.steps.map((s) => s.timeS)).toEqual([0.5, 1]);
  });

  it('tab-delimited with "t", "event" and "Bolt n [kN]" headers', () => {
    const r = load('tab.tsv');
    expect(r.detection.delimiter).toBe('\t');
    expect(r.mapping.studColumns.map((s) => s.position)).toEqual([1, 2, 3, 4]);
    // One row per event A, B, C; no pass column, positions 1, 4, 2 never repeat -> all pass 1.
    expect(readings(r)).toEqual([
      { order: 1, pass: 1, position: 1, loadsN: kN(20.25, 0, 0, 0) },
      { order: 2, pass: 1, position: 4, loadsN: kN(19.75, 0, 0, 21.5) },
      { order: 3, pass: 1, position: 2, loadsN: kN(19.5, 22, 0, 21) },
    ]);
  });

  it('byte-order mark and CRLF, "load_n_kN" headers', () => {
    const r = load('bom-crlf.csv');
    expect(r.detection).toMatchObject({ hadBom: true, lineEnding: 'CRLF', headerLine: 1 });
    expect(r.detection.sentences).toContain('UTF-8 byte-order mark removed.');
    expect(r.detection.headers[0]).toBe('time_s');
    expect(readings(r)).toEqual([
      { order: 1, pass: 1, position: 1, loadsN: kN(30, 0, 0, 0) },
      { order: 2, pass: 1, position: 2, loadsN: kN(30, 30, 0, 0) },
      { order: 3, pass: 1, position: 3, loadsN: kN(29, 29, 30, 0) },
      { order: 4, pass: 1, position: 4, loadsN: kN(28, 28, 29, 30) },
    ]);
  });

  it('metadata lines above the header, semicolon, decimal comma', () => {
    const r = load('metadata-semicolon.csv');
    expect(r.detection.sentences[0]).toBe('Semicolon-delimited, decimal comma, 3 metadata lines above the header (line 4).');
    expect(r.detection.metadata).toEqual([
      { line: 2, key: 'Operator', value: 'Trainee A' },
      { line: 3, key: 'Joint', value: 'Training flange, 4 studs' },
    ]);
    expect(readings(r)).toEqual([
      { order: 1, pass: 1, position: 1, loadsN: kN(20.5, 0, 0, 0) },
      { order: 2, pass: 1, position: 3, loadsN: kN(20, 0, 21.25, 0) },
    ]);
    expect(r.stepLines.map((s) => s.firstLine)).toEqual([5, 7]);
  });

  it('microstrain with calibration: F = E·ε·A·factor', () => {
    const joint = { ...FOUR_STUD_JOINT, youngsModulusPa: 200e9, stressAreaM2: 245e-6, calibration: [1, 1.02, 0.98, 1] };
    const r = load('microstrain.csv', joint);
    expect(r.mapping.loadUnit).toBe('microstrain');
    // 1000 µε × 200 GPa × 245 mm² = 49 kN; stud 3 factor 0.98 -> 48.02 kN; 980 µε on stud 1 -> 48.02 kN.
    const [a, b] = r.run.steps;
    expect(a!.loadsN[0]).toBeCloseTo(49_000, 6);
    expect(b!.loadsN[0]).toBeCloseTo(48_020, 6);
    expect(b!.loadsN[2]).toBeCloseTo(48_020, 6);
    expect(b!.position).toBe(3);
  });

  it('a units row below the header is merged into the column names', () => {
    const r = load('units-row.csv');
    expect(r.detection.unitsRowLine).toBe(3);
    expect(r.detection.headers).toEqual(['Time [s]', 'Step', 'Stud 1 [kN]', 'Stud 2 [kN]', 'Stud 3 [kN]', 'Stud 4 [kN]']);
    expect(readings(r)).toEqual([
      { order: 1, pass: 1, position: 1, loadsN: kN(10, 0, 0, 0) },
      { order: 2, pass: 1, position: 2, loadsN: kN(9.5, 10, 0, 0) },
    ]);
  });

  it('step table in lbf with an empty torque column', () => {
    const r = load('lbf-step-table.csv');
    expect(r.mapping.loadUnit).toBe('lbf');
    // 1000 lbf × 4.4482216152605 N/lbf.
    expect(r.run.steps[0]!.loadsN).toEqual([1000 * NEWTONS_PER_LBF, 0, 0, 0]);
    expect(r.run.steps[0]!.appliedTorqueNm).toBeNull();
  });
});
