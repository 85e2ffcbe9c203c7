import { describe, expect, it } from 'vitest';
import { toolsPastDue } from '@/lib/equipment/tools-past-due';
import { equipmentSchema } from '@/lib/equipment/equipment-input';

const tools = [
  { id: 1, name: 'Wrench A', dueOn: '2026-03-01' },
  { id: 2, name: 'Pump gauge', dueOn: '2026-03-02' },
  { id: 3, name: 'Logger', dueOn: null },
  { id: 4, name: 'Wrench B', dueOn: '2027-01-01' },
];

describe('toolsPastDue', () => {
  it('flags a tool due before the day and one without a calibration; due on the day is in date', () => {
    expect(toolsPastDue(tools, '2026-03-02').map((t) => t.id)).toEqual([1, 3]);
    expect(toolsPastDue(tools, '2026-03-03').map((t) => t.id)).toEqual([1, 2, 3]);
    expect(toolsPastDue([], '2026-03-03')).toEqual([]);
  });
});

describe('equipmentSchema', () => {
  it('refuses a due date before the calibration and reads empty dates as none', () => {
    const base = { kind: 'torque_wrench', name: 'Wrench A', serialNumber: 'TW-1', certificate: '', calibratedOn: '2026-03-01', dueOn: '2026-02-01', inService: 'on' };
    expect(equipmentSchema.safeParse(base).success).toBe(false);
    const ok = equipmentSchema.parse({ ...base, dueOn: '', calibratedOn: '' });
    expect([ok.dueOn, ok.calibratedOn, ok.certificate, ok.inService]).toEqual([null, null, null, true]);
  });
});
