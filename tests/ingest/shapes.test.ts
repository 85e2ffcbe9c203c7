import { describe, expect, it } from 'vitest';
import { columnMappingSchema, loadUnitOfHeader, proposeMapping, proposeMappingWithNotes, studPositionOfHeader, torqueUnitOfHeader } from '@/lib/ingest/shapes';

describe('header heuristics', () => {
  it.each([
    ['Stud 1', 1],
    ['S1', 1],
    ['Bolt 3 [kN]', 3],
    ['stud_03_kN', 3],
    ['B12', 12],
    ['Load 2', 2],
    ['F2 (lbf)', 2],
    ['Force 4', 4],
    ['position', null],
    ['load_kN', null],
    ['step', null],
    ['Time (s)', null],
  ])('%s -> position %s', (h, p) => expect(studPositionOfHeader(h)).toBe(p));

  it.each([
    ['Bolt 3 [kN]', 'kN'],
    ['F2 (lbf)', 'lbf'],
    ['load_kip', 'kip'],
    ['S1 (ue)', 'microstrain'],
    ['S1 µε', 'microstrain'],
    ['load_N', 'N'],
    ['Stud 1', null],
  ])('%s -> load unit %s', (h, u) => expect(loadUnitOfHeader(h)).toBe(u));

  it.each([
    ['Torque (ft-lb)', 'ft-lb'],
    ['applied torque [ft·lbf]', 'ft-lb'],
    ['applied_torque_Nm', 'N·m'],
    ['Torque (N·m)', 'N·m'],
    ['Torque', null],
  ])('%s -> torque unit %s', (h, u) => expect(torqueUnitOfHeader(h)).toBe(u));
});

describe('proposeMapping', () => {
  it('wide: time, stud columns in any order, step and pass', () => {
    const m = proposeMapping(['Time (s)', 'Pass', 'Step', 'Bolt 2 [kN]', 'Bolt 1 [kN]'], [['0', '1', '1', '0', '0']]);
    expect(m).toMatchObject({ shape: 'wide', timeColumn: 'Time (s)', passColumn: 'Pass', stepColumn: 'Step', loadUnit: 'kN' });
    expect(m.studColumns).toEqual([{ column: 'Bolt 2 [kN]', position: 2 }, { column: 'Bolt 1 [kN]', position: 1 }]);
    expect(columnMappingSchema.safeParse(m).success).toBe(true);
  });

  it('long: time, position, load_kN', () => {
    expect(proposeMapping(['t', 'position', 'load_kN'], [['0', '1', '3']])).toMatchObject({ shape: 'long', timeColumn: 't', positionColumn: 'position', loadColumn: 'load_kN', loadUnit: 'kN' });
  });

  it('a position repeating within one step in the sample makes it long, not a step table', () => {
    const rows = [['0', '1', '1', '5'], ['0.1', '1', '1', '6']];
    expect(proposeMapping(['time', 'step', 'stud', 'load'], rows).shape).toBe('long');
    expect(proposeMapping(['time', 'step', 'stud', 'load'], [['0', '1', '1', '5'], ['0', '1', '2', '6']]).shape).toBe('step_table');
  });

  it('guesses N or kN from the size of the values when no header names a unit, and says so', () => {
    const big = proposeMappingWithNotes(['time', 'S1', 'S2'], [['0', '25000', '0']]);
    expect(big.mapping.loadUnit).toBe('N');
    expect(big.notes.join(' ')).toContain('No load unit in the headers; assumed N');
    expect(proposeMapping(['time', 'S1', 'S2'], [['0', '25', '0']]).loadUnit).toBe('kN');
  });

  it('the schema refuses a long mapping without a time column', () => {
    const r = columnMappingSchema.safeParse({ shape: 'long', timeColumn: null, studColumns: [], positionColumn: 'p', loadColumn: 'l', stepColumn: null, passColumn: null, torqueColumn: null, pressureColumn: null, loadUnit: 'N', torqueUnit: 'N·m' });
    expect(r.success).toBe(false);
    expect(r.error?.issues[0]?.path).toEqual(['timeColumn']);
  });
});
