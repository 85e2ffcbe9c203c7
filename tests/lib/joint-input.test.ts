import { describe, expect, it } from 'vitest';
import { in2ToMm2, ksiToMpa, lbfToN } from '@/lib/calc/units';
import { jointTarget, parseJointForm, positionPoint, threadChoiceOf, threadSeriesNote } from '@/lib/joints/joint-input';

const rel = (actual: number, expected: number) => Math.abs(actual - expected) / Math.abs(expected);

/** A complete 8-stud joint form as the browser sends it. */
function jointForm(overrides: Record<string, string> = {}): Record<string, string> {
  const values: Record<string, string> = {
    name: 'Test joint', nominalSize: 'NPS 4', pressureClass: 'Class 150', studCount: '8', threadChoice: '5/8-11',
    studGrade: 'A193-B7', nutGrade: 'ASTM A194 2H', washer: '', gasketType: 'spiral-wound, graphite filled', bandPercent: '10',
    notes: '', targetMode: 'percentOfYield', targetPercent: '50', units: 'si',
  };
  for (let p = 1; p <= 8; p += 1) values[`position-${p}-factor`] = '1';
  return { ...values, ...overrides };
}

describe('jointTarget', () => {
  it('gives 11,865 lbf for a 5/8-11 B7 stud at 50 % of yield (docs/REFERENCE.md §1 As 0.226 in², §2 B7 yield 105 ksi)', () => {
    const r = jointTarget({ thread: { system: 'inch', diameterIn: 0.625, threadsPerInch: 11 }, grade: 'A193-B7', mode: 'percentOfYield', percent: 50, loadN: NaN, stressMpa: NaN });
    // 0.5 × 105,000 psi × 0.226 in² = 11,865 lbf (computed from the docs/REFERENCE.md §1 table values)
    expect(rel(r.target!.loadN, lbfToN(11_865))).toBeLessThan(1e-3);
    expect(rel(r.target!.loadN, 52_780)).toBeLessThan(1e-3);
    expect(rel(r.thread!.tensileStressAreaMm2, in2ToMm2(0.226))).toBeLessThan(1e-3);
    expect(r.target!.percentOfYield).toBeCloseTo(50, 9);
    expect(r.warnings).toEqual([]);
  });

  it('gives 17,535 lbf for a 3/4-10 stud at a target stress of 52.5 ksi (docs/REFERENCE.md §3 worked check)', () => {
    const r = jointTarget({ thread: { system: 'inch', diameterIn: 0.75, threadsPerInch: 10 }, grade: 'A193-B7', mode: 'stress', stressMpa: ksiToMpa(52.5), percent: NaN, loadN: NaN });
    // docs/REFERENCE.md §3 uses the table area 0.334 in²; the formula gives 0.3345 in², hence 2e-3.
    expect(rel(r.target!.loadN, lbfToN(17_535))).toBeLessThan(2e-3);
  });

  it('warns above the commonly quoted 40–70 % range and past yield (docs/REFERENCE.md §4, from memory, unverified; yield by definition)', () => {
    const base = { thread: { system: 'inch' as const, diameterIn: 0.75, threadsPerInch: 10 }, grade: 'A193-B7' as const, mode: 'percentOfYield' as const, loadN: NaN, stressMpa: NaN };
    expect(jointTarget({ ...base, percent: 80 }).warnings.map((w) => w.code)).toEqual(['above-usual-range']);
    expect(jointTarget({ ...base, percent: 105 }).warnings.map((w) => w.code)).toEqual(['over-stress']);
    expect(jointTarget({ ...base, percent: 30 }).warnings.map((w) => w.code)).toEqual(['below-usual-range']);
  });

  it('reports a direct load as % of yield: 17,535 lbf on 3/4-10 B7 is 50 % (docs/REFERENCE.md §3)', () => {
    const r = jointTarget({ thread: { system: 'inch', diameterIn: 0.75, threadsPerInch: 10 }, grade: 'A193-B7', mode: 'load', loadN: lbfToN(17_535), percent: NaN, stressMpa: NaN });
    // 17,535 / (0.3345 × 105,000) = 49.93 % with the formula area (computed)
    expect(r.target!.percentOfYield).toBeGreaterThan(49.8);
    expect(r.target!.percentOfYield).toBeLessThan(50.1);
  });

  it('names the field when the grade is not tabulated for the size (B8 Class 2 only to 3/4 in, docs/REFERENCE.md §2)', () => {
    const r = jointTarget({ thread: { system: 'inch', diameterIn: 1, threadsPerInch: 8 }, grade: 'A193-B8-CL2', mode: 'percentOfYield', percent: 50, loadN: NaN, stressMpa: NaN });
    expect(r.errors.studGrade?.[0]).toMatch(/3\/4|0\.75/);
    expect(r.target).toBeUndefined();
  });
});

describe('thread helpers', () => {
  it('notes a 1 in or larger inch stud that is not 8UN (docs/REFERENCE.md §1 ✓ [CFR46], [TME])', () => {
    expect(threadSeriesNote({ system: 'inch', diameterIn: 1.25, threadsPerInch: 7 })?.code).toBe('not-8un');
    expect(threadSeriesNote({ system: 'inch', diameterIn: 1.25, threadsPerInch: 8 })).toBeNull();
    expect(threadSeriesNote({ system: 'inch', diameterIn: 0.75, threadsPerInch: 10 })).toBeNull();
  });

  it('finds the standard thread of stored columns, else custom', () => {
    expect(threadChoiceOf({ system: 'inch', diameterIn: 0.625, threadsPerInch: 11 })).toBe('5/8-11');
    expect(threadChoiceOf({ system: 'metric', diameterMm: 20, pitchMm: 2.5 })).toBe('M20');
    expect(threadChoiceOf({ system: 'metric', diameterMm: 20, pitchMm: 1.5 })).toBe('custom');
  });
});

describe('positionPoint (numbered clockwise from 1 at the top, docs/REFERENCE.md §6 ✓ [KNM])', () => {
  it('puts 1 at 12 o’clock, 3 at 3 o’clock and 5 at 6 o’clock on an 8-stud flange (screen y down)', () => {
    const one = positionPoint(1, 8, 10);
    const three = positionPoint(3, 8, 10);
    const five = positionPoint(5, 8, 10);
    expect(one.x).toBeCloseTo(0, 12);
    expect(one.y).toBeCloseTo(-10, 12);
    expect(three.x).toBeCloseTo(10, 12);
    expect(three.y).toBeCloseTo(0, 12);
    expect(five.y).toBeCloseTo(10, 12);
  });
});

describe('parseJointForm', () => {
  it('turns a complete form into a joint with 8 positions and the target worked out on the server side', () => {
    const r = parseJointForm(jointForm({ 'position-3-factor': '1.02', 'position-3-note': 'gauge replaced' }));
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.value.positions).toHaveLength(8);
    expect(r.value.positions[2]).toEqual({ position: 3, calibrationFactor: 1.02, note: 'gauge replaced', channel: null });
    expect(rel(r.value.targetLoadN, lbfToN(11_865))).toBeLessThan(1e-3); // docs/REFERENCE.md §1/§2 as above
    expect(r.value.washer).toBeNull();
  });

  it('reads the logger line section, and leaves the stored format alone when the form has no such section', () => {
    const r = parseJointForm(jointForm({ serialBaudRate: '19200', lineDelimiter: 'tab', lineDecimal: 'comma', lineTimeField: '1', lineChannelFields: '3-6, 8', lineLoadUnit: 'lbf' }));
    expect(r.ok && r.value.loggerLine).toEqual({ baudRate: 19200, delimiter: 'tab', decimalComma: true, timeField: 1, channelFields: [3, 4, 5, 6, 8], loadUnit: 'lbf' });
    const without = parseJointForm(jointForm({}));
    expect(without.ok && 'loggerLine' in without.value).toBe(false);
    const wrong = parseJointForm(jointForm({ lineTimeField: '3', lineChannelFields: '2-4' }));
    expect(!wrong.ok && wrong.errors.lineChannelFields?.[0]).toMatch(/time field cannot also be a channel field/);
  });

  it('ignores a target load typed by the browser when the mode is % of yield', () => {
    const r = parseJointForm(jointForm({ targetLoad: '999' }));
    expect(r.ok && rel(r.value.targetLoadN, lbfToN(11_865))).toBeLessThan(1e-3);
  });

  it('reads a direct load in the user’s units (US: lbf)', () => {
    const r = parseJointForm(jointForm({ targetMode: 'load', targetLoad: '11,865', units: 'us' }));
    expect(r.ok && r.value.targetLoadN).toBeCloseTo(lbfToN(11_865), 6);
  });

  it('returns a sentence for each bad field and nothing to save', () => {
    const r = parseJointForm(jointForm({ name: ' ', studCount: '2', bandPercent: '80', targetPercent: '' }));
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.errors.name?.[0]).toBe('Enter the joint name.');
    expect(r.errors.studCount?.[0]).toMatch(/between 3 and 96 studs/);
    expect(r.errors.bandPercent?.[0]).toMatch(/between 0.5 % and 50 %/);
    expect(r.errors.targetPercent?.[0]).toMatch(/% of yield/);
    expect(r.message).toMatch(/not saved/);
  });

  it('rejects a calibration factor outside 0.5–1.5 against its position', () => {
    const r = parseJointForm(jointForm({ 'position-6-factor': '2' }));
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.errors['position-6-factor']?.[0]).toMatch(/^Position 6: .*between 0.5 and 1.5/);
  });

  it('rejects a custom metric thread outside the calculator’s range with the thread schema’s sentence', () => {
    const r = parseJointForm(jointForm({ threadChoice: 'custom', threadSystem: 'metric', threadDiameter: '200', threadPitch: '3' }));
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.errors.threadDiameter?.[0]).toMatch(/between 6 mm and 100 mm/);
  });
});

