import { describe, expect, it } from 'vitest';
import { generatedOrder, parseLubricantForm, parseMethodForm, parseOrderText, passOrderMessage, patternOf } from '@/lib/joints/method-input';

// Legacy cross orders, docs/REFERENCE.md §6 (8: from memory, unverified; 12: ✓ [ROVER]).
const CROSS_8 = [1, 5, 3, 7, 2, 6, 4, 8];
const CROSS_12 = [1, 7, 4, 10, 2, 8, 5, 11, 3, 9, 6, 12];

describe('stud orders', () => {
  it('reads orders written with hyphens, commas or spaces, as the trade writes them (docs/REFERENCE.md §6 "1-5-3-7-2-6-4-8")', () => {
    expect(parseOrderText('1-5-3-7-2-6-4-8')).toEqual(CROSS_8);
    expect(parseOrderText(' 1, 5 3;7 ')).toEqual([1, 5, 3, 7]);
    expect(parseOrderText('1 x 3')[1]).toBeNaN();
  });

  it('generates the docs/REFERENCE.md §6 cross orders and refuses a cross order for 6 studs', () => {
    expect(generatedOrder('cross', 8)).toEqual(CROSS_8);
    expect(generatedOrder('cross', 12)).toEqual(CROSS_12);
    expect(generatedOrder('cross', 6)).toBeNull();
    expect(generatedOrder('circular', 6)).toEqual([1, 2, 3, 4, 5, 6]);
  });

  it('names a repeated stud (every stud once per pass, common practice, docs/REFERENCE.md §4)', () => {
    expect(passOrderMessage([1, 5, 3, 7, 2, 6, 4, 4], 8)).toBe('Pass order misses position 8; repeats position 4.');
    expect(passOrderMessage(CROSS_8, 8)).toBeNull();
    expect(passOrderMessage([], 8)).toMatch(/Enter the order of the 8 studs/);
    expect(passOrderMessage([1, 2, Number.NaN], 3)).toMatch(/outside 1\.\.3/);
  });

  it('calls a pass cross or circular only when every order is that generated order', () => {
    expect(patternOf({ '8': CROSS_8, '12': CROSS_12 })).toBe('cross');
    expect(patternOf({ '8': [1, 2, 3, 4, 5, 6, 7, 8] })).toBe('circular');
    expect(patternOf({ '8': CROSS_8, '12': [1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12] })).toBe('custom');
  });
});

describe('parseMethodForm', () => {
  const form = (overrides: Record<string, string> = {}) => ({
    name: 'Three cross passes', toolKind: 'manual_torque_wrench', checkPasses: '1', notes: '', passCount: '2', studCounts: '8,12',
    'pass-0-percent': '30', 'pass-0-order-8': CROSS_8.join(' '), 'pass-0-order-12': CROSS_12.join('-'),
    'pass-1-percent': '100', 'pass-1-order-8': '1 2 3 4 5 6 7 8', 'pass-1-order-12': '1 2 3 4 5 6 7 8 9 10 11 12',
    ...overrides,
  });

  it('builds passes with their orders per stud count and the pattern they make', () => {
    const r = parseMethodForm(form());
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.value.passes).toEqual([
      { percentOfTarget: 30, pattern: 'cross', orderByStudCount: { '8': CROSS_8, '12': CROSS_12 } },
      { percentOfTarget: 100, pattern: 'circular', orderByStudCount: { '8': [1, 2, 3, 4, 5, 6, 7, 8], '12': [1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12] } },
    ]);
    expect(r.value.checkPasses).toBe(1);
  });

  it('puts the duplicate-stud sentence against the pass and stud count', () => {
    const r = parseMethodForm(form({ 'pass-1-order-8': '1 2 3 4 5 6 7 7' }));
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.errors['pass-1-order-8']).toEqual(['Pass 2, 8 studs: Pass order misses position 8; repeats position 7.']);
  });

  it('refuses an unknown tool, a pass above 120 % and too many check passes', () => {
    const r = parseMethodForm(form({ toolKind: 'impact gun', 'pass-0-percent': '150', checkPasses: '9' }));
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.errors.toolKind?.[0]).toMatch(/tool kind/);
    expect(r.errors['pass-0-percent']?.[0]).toMatch(/between 1 % and 120 %/);
    expect(r.errors.checkPasses?.[0]).toMatch(/between 0 and 5/);
  });
  it('stores a tensioner coverage: one tool by default, 100 % or 50 % for a tensioner only, 50 % only on even stud counts', () => {
    const torque = parseMethodForm(form());
    expect(torque.ok && torque.value.tensionerCoverage).toBe('one_stud');
    const tensioner = parseMethodForm(form({ toolKind: 'hydraulic_tensioner', tensionerCoverage: 'every_second_stud' }));
    expect(tensioner.ok && tensioner.value.tensionerCoverage).toBe('every_second_stud');
    const onTorque = parseMethodForm(form({ tensionerCoverage: 'every_stud' }));
    expect(!onTorque.ok && onTorque.errors.tensionerCoverage?.[0]).toMatch(/^Only a hydraulic tensioner set pulls several studs at once/);
    // 50 % coverage is the odd positions, then the even ones (common practice): 5 studs cannot be split so.
    const odd = parseMethodForm(form({ toolKind: 'hydraulic_tensioner', tensionerCoverage: 'every_second_stud', studCounts: '5,8', 'pass-0-order-5': '1 2 3 4 5', 'pass-1-order-5': '1 2 3 4 5' }));
    expect(!odd.ok && odd.errors.tensionerCoverage).toEqual(['A tensioner on every second stud needs an even number of studs; 5 is odd.']);
    const unknown = parseMethodForm(form({ toolKind: 'hydraulic_tensioner', tensionerCoverage: 'every_third_stud' }));
    expect(!unknown.ok && unknown.errors.tensionerCoverage?.[0]).toMatch(/Choose how many studs/);
  });
});

describe('parseLubricantForm', () => {
  it('accepts K inside 0.05–0.60 and refuses outside it (the calculator’s limits; measured K 0.086–0.52 ✓ [HBJ])', () => {
    const ok = parseLubricantForm({ name: 'Copper paste', nominalNutFactor: '0.16', notes: '' });
    expect(ok).toEqual({ ok: true, value: { name: 'Copper paste', nominalNutFactor: 0.16, notes: null } });
    const high = parseLubricantForm({ name: 'Dry', nominalNutFactor: '0.7', notes: '' });
    expect(high.ok === false && high.errors.nominalNutFactor?.[0]).toBe('The nut factor (K) must be between 0.05 and 0.60.');
    const missing = parseLubricantForm({ name: '', nominalNutFactor: 'abc' });
    expect(missing.ok === false && Object.keys(missing.errors).sort()).toEqual(['name', 'nominalNutFactor']);
  });

});
