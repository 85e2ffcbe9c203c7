import { describe, expect, it } from 'vitest';
import Papa from 'papaparse';
import { runToCsv } from '@/lib/ingest/export-csv';
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
    expect(lines[5]).toBe('42,2,1,3,1,29001.1,271.16,,2.5');
    expect(runToCsv(run, { runId: 42 }, 'us').split('\r\n')[0]).toContain('load_lbf,applied_torque_ft-lb');
  });

  it.each(['si', 'us'] as const)('re-imports as a step table to the same readings (%s)', (units) => {
    const back = parseLoggerText(runToCsv(run, { runId: 'R-7' }, units), undefined, FOUR_STUD_JOINT);
    expect(back.mapping.shape).toBe('step_table');
    expect(back.run.steps).toHaveLength(run.steps.length);
    back.run.steps.forEach((s, i) => {
      const o = run.steps[i]!;
      expect([s.order, s.pass, s.position, s.timeS, s.appliedPressureBar]).toEqual([o.order, o.pass, o.position, o.timeS, o.appliedPressureBar]);
      s.loadsN.forEach((v, k) => {
        if (units === 'si') expect(v).toBe(o.loadsN[k]);
        else expect(Math.abs(v - o.loadsN[k]!)).toBeLessThanOrEqual(1e-12 * Math.max(1, o.loadsN[k]!));
      });
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
