import { describe, expect, it } from 'vitest';
import { calibrationLevels, readCalibrationTable } from '@/lib/calibration/calibration-table';
import { assessPosition } from '@/lib/calibration/assess-position';
import { TRAINING_DEFAULT_LIMITS } from '@/lib/calibration/calibration-limits';

// Hand-made table, worked by hand: position 1 reads the load cell exactly (factor 1, every error 0);
// position 2 reads twice the load (factor 0.5 exactly, all points on the line) and is left at 1.2 kN
// when unloaded: zero return = |0.5 × 1.2 − 0| / 80 × 100 = 0.75 % of full scale (80 kN).
const TABLE = [
  'direction;load_cell_kN;p1;p2',
  'up;0;0;0',
  'up;20;20;40',
  'up;40;40;80',
  'up;60;60;120',
  'up;80;80;160',
  'down;80;80;160',
  'down;60;60;120',
  'down;40;40;80',
  'down;20;20;40',
  'down;0;0;1,2',
].join('\n');

describe('calibration table', () => {
  it('reads the documented layout (semicolon, decimal comma) and pairs the levels', () => {
    const rows = readCalibrationTable(TABLE, 2);
    expect(rows).toHaveLength(10);
    const levels = calibrationLevels(rows);
    expect(levels.fullScaleKn).toBe(80);
    expect(levels.loaded).toHaveLength(8);
    expect(levels.pairs.map((p) => [p.up.loadCellKn, p.down.loadCellKn])).toEqual([[20, 20], [40, 40], [60, 60], [80, 80]]);
    expect(levels.zero.gaugeKn).toEqual([0, 1.2]);
  });

  it('accepts the exact gauge and refuses the one whose zero return is over the training default (0.5 %)', () => {
    const levels = calibrationLevels(readCalibrationTable(TABLE, 2));
    const exact = assessPosition(levels, 0, TRAINING_DEFAULT_LIMITS, null);
    expect(exact.factor).toBeCloseTo(1, 12);
    expect(exact.linearityPercent).toBeCloseTo(0, 12);
    expect(exact.hysteresisPercent).toBeCloseTo(0, 12);
    expect(exact.accepted).toBe(true);
    const doubled = assessPosition(levels, 1, TRAINING_DEFAULT_LIMITS, { lower: 0.9, upper: 0.95 });
    expect(doubled.factor).toBeCloseTo(0.5, 12);
    expect(doubled.zeroReturnPercent).toBeCloseTo(0.75, 12);
    expect(doubled.accepted).toBe(false);
    expect(doubled.refusals).toEqual(['zero return 0.75 % over 0.5 %']);
    expect(doubled.drift).toBe(true); // 0.5 lies outside the previous interval 0.90–0.95
  });

  it('refuses a table without unloading at every level', () => {
    const rows = readCalibrationTable(TABLE.replace('down;80;80;160\n', ''), 2);
    expect(() => calibrationLevels(rows)).toThrow('Read every level again while unloading: 4 loading levels but 3 unloading rows above zero.');
  });

  it('refuses a wrong header and names the line of a bad cell', () => {
    expect(() => readCalibrationTable('direction,load,p1', 1)).toThrow('The first line must be: direction,load_cell_kN,p1');
    expect(() => readCalibrationTable('direction,load_cell_kN,p1\nup,20,abc', 1)).toThrow(/^Line 2, column p1 is not a number/);
  });
});
