import { describe, expect, it } from 'vitest';
import Papa from 'papaparse';
import { runToCsv } from '@/lib/ingest/export-csv';
import { csvLoad } from '@/lib/export/load-resolution';
import { NEWTONS_PER_LBF } from '@/lib/ingest/units';
import { parseLoggerText } from '@/lib/ingest/parse-text';
import type { NormalisedRun } from '@/lib/record/run-types';
import { FOUR_STUD_JOINT } from './joints';

/** An invented 4-stud run: two passes, torque on pass 1 only, pressure on one step, odd decimals. */
const run: NormalisedRun = {
  studCount: 4,
  targetLoadN: 80_000,
  steps: [
    { order: 1, pass: 1, position: 1, appliedTorqueNm: 271.16, appliedPressureBar: null, timeS: 1.25, loadsN: [30_000.125, 0, 0, 0] },
    { order: 2, pass: 1, position: 3, appliedTorqueNm: 271.16, appliedPressureBar: null, timeS: 2.5, loadsN: [29_001.1, 0.3, 30_500, 0] },
    { order: 3, pass: 2, position: 1, appliedTorqueNm: null, appliedPressureBar: 812.5, timeS: null, loadsN: [61_234.5678, 0.3, 29_000, 1e-3] },
  ],
};

describe('runToCsv', () => {
  it('writes one row per reading with the unit in the header', () => {
    const csv = runToCsv(run, { runId: 42 }, 'si');
    const lines = csv.trimEnd().split('\r\n');
    expect(lines[0]).toBe('run_id,step,pass,tightened_position,position,load_N,applied_torque_Nm,applied_pressure_bar,time_s');
    expect(lines).toHaveLength(1 + 3 * 4);
    // 29 001.1 N to the 0.01 kN a load instrument resolves: 29 000 N (lib/export/load-resolution.ts).
    expect(lines[5]).toBe('42,2,1,3,1,29000,271.16,,2.5');
    expect(runToCsv(run, { runId: 42 }, 'us').split('\r\n')[0]).toContain('load_lbf,applied_torque_ft-lb');
  });

  it('writes loads to what the instrument resolves: 0.01 kN in SI, 1 lbf in US units, never 14 digits', () => {
    // 61 234.5678 N → 61 230 N; in lbf 61 234.5678 / 4.4482216152605 (exact by definition, 0.45359237 kg × 9.80665 m/s²) = 13 766.3… → 13 766.
    expect(csvLoad(61_234.5678, 'si')).toBe(61_230);
    expect(csvLoad(61_234.5678, 'us')).toBe(13_766);
    expect(csvLoad(1e-3, 'us')).toBe(0);
    for (const units of ['si', 'us'] as const) {
      const loads = Papa.parse<string[]>(runToCsv(run, { runId: 1 }, units).trim()).data.slice(1).map((cells) => cells[5]!);
      expect(loads.every((cell) => /^-?\d+$/.test(cell)), loads.join(' ')).toBe(true);
    }
  });

  it.each(['si', 'us'] as const)('re-imports as a step table to the readings within half the written resolution (%s)', (units) => {
    const back = parseLoggerText(runToCsv(run, { runId: 'R-7' }, units), undefined, FOUR_STUD_JOINT);
    expect(back.mapping.shape).toBe('step_table');
    expect(back.run.steps).toHaveLength(run.steps.length);
    back.run.steps.forEach((s, i) => {
      const o = run.steps[i]!;
      expect([s.order, s.pass, s.position, s.timeS, s.appliedPressureBar]).toEqual([o.order, o.pass, o.position, o.timeS, o.appliedPressureBar]);
      const halfStepN = units === 'si' ? 5 : NEWTONS_PER_LBF / 2;
      s.loadsN.forEach((v, k) => expect(Math.abs(v - o.loadsN[k]!)).toBeLessThanOrEqual(halfStepN + 1e-9));
      if (o.appliedTorqueNm == null) expect(s.appliedTorqueNm).toBeNull();
      else expect(Math.abs(s.appliedTorqueNm! - o.appliedTorqueNm)).toBeLessThanOrEqual(1e-12 * o.appliedTorqueNm);
    });
  });

  it('a hostile run id is neutralised on every row and survives CSV parsing as text', () => {
    const csv = runToCsv(run, { runId: '=cmd|"/c calc"!A1' }, 'si');
    const rows = Papa.parse<string[]>(csv.trimEnd(), { delimiter: ',' }).data;
    expect(rows.slice(1).every((r) => r[0] === '\'=cmd|"/c calc"!A1')).toBe(true);
  });
});
