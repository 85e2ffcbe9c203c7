import { describe, expect, it } from 'vitest';
import { criteriaSchema, DEFAULT_CRITERIA, type AssessmentCriteria } from '@/lib/assessment/criteria';
import { judgeRun, type JudgeRunInput, type JudgeRunStep } from '@/lib/assessment/judge-run';
import type { MethodPass } from '@/models/method';

// Cross order for 8 studs 1-5-3-7-2-6-4-8 (docs/REFERENCE.md §6, from memory, unverified; the same as
// lib/sim crossPatternOrder(8)) — written out here, not taken from the code under test.
const CROSS_8 = [1, 5, 3, 7, 2, 6, 4, 8];
const CIRCLE_8 = [1, 2, 3, 4, 5, 6, 7, 8];
const threeCrossPlusCheck = {
  passes: [30, 60, 100].map((percentOfTarget): MethodPass => ({ percentOfTarget, pattern: 'cross', orderByStudCount: { '8': CROSS_8 } })),
  checkPasses: 1,
};
// 3/4-10 UNC, ASTM A193 B7 (docs/REFERENCE.md §1 and §2).
const joint = { studCount: 8, thread: { system: 'inch' as const, diameterIn: 0.75, threadsPerInch: 10 }, studGrade: 'ASTM A193 B7' };

function stepsFor(orders: number[][]): JudgeRunStep[] {
  let order = 0;
  return orders.flatMap((positions, p) => positions.map((position) => ({ order: ++order, pass: p + 1, position })));
}

function input(overrides: Omit<Partial<JudgeRunInput>, 'criteria'> & { criteria?: Partial<AssessmentCriteria> } = {}): JudgeRunInput {
  return {
    targetLoadN: 100_000,
    finalLoadsN: [95_000, 105_000, 100_000, 100_000, 98_000, 102_000, 99_000, 101_000],
    steps: stepsFor([CROSS_8, CROSS_8, CROSS_8, CIRCLE_8]),
    method: threeCrossPlusCheck,
    joint,
    ...overrides,
    criteria: { ...DEFAULT_CRITERIA, ...overrides.criteria },
  };
}

const result = (judgement: ReturnType<typeof judgeRun>, key: string) => {
  const found = judgement.results.find((r) => r.key === key);
  if (!found) throw new Error(`no ${key} result`);
  return found;
};

describe('judgeRun: band', () => {
  it('meets a ±10 % band when every final load is within it (hand-worked: farthest 95 kN, 5 % below)', () => {
    const band = result(judgeRun(input()), 'band');
    expect(band.met).toBe(true);
    expect(band.measured).toBeCloseTo(5, 12);
    expect(band.detail?.farthestPosition).toBe(1); // 95 kN and 105 kN tie at 5 %; the first counts
    expect(band.detail?.shareInBandPercent).toBe(100);
    expect(band.sentence).toContain('All 8 studs');
  });

  it('fails when one stud ends 12 % low and says 7 of 8 (hand-worked)', () => {
    const band = result(judgeRun(input({ finalLoadsN: [100e3, 100e3, 100e3, 100e3, 100e3, 100e3, 100e3, 88e3] })), 'band');
    expect(band.met).toBe(false);
    expect(band.measured).toBeCloseTo(12, 12);
    expect(band.detail?.shareInBandPercent).toBeCloseTo(87.5, 12);
    expect(band.sentence).toMatch(/^7 of 8 studs .* position 8, was 12\.0\s%\sbelow/);
  });

  it('counts a load exactly on the band edge (110 kN for ±10 %) as inside', () => {
    const band = result(judgeRun(input({ finalLoadsN: [110e3, 90e3, 100e3, 100e3, 100e3, 100e3, 100e3, 100e3] })), 'band');
    expect(band.met).toBe(true);
  });

  it('tightens with the criterion: a ±4 % band fails the same run', () => {
    expect(result(judgeRun(input({ criteria: { bandPercent: 4 } })), 'band').met).toBe(false);
  });
});

describe('judgeRun: CV', () => {
  // Hand-worked: mean 100 kN, squared deviations 25+25+0+0+4+4+1+1 = 60 kN², s² = 60/7,
  // s = 2.92770 kN, CV = 2.92770 % (sample CV s/x̄, docs/REFERENCE.md §9 ✓ [CV]).
  const expectedCv = Math.sqrt(60 / 7);

  it('measures the sample CV of the final loads and meets a 5 % limit', () => {
    const cv = result(judgeRun(input()), 'cv');
    expect(cv.measured).toBeCloseTo(expectedCv, 10);
    expect(cv.met).toBe(true);
    expect(cv.limit).toBe(5);
  });

  it('fails a 2.5 % limit with a sentence that gives the figure', () => {
    const cv = result(judgeRun(input({ criteria: { maxCvPercent: 2.5 } })), 'cv');
    expect(cv.met).toBe(false);
    expect(cv.sentence).toContain('2.93');
    expect(cv.sentence).toContain('more than the 2.5 % allowed');
  });
});

describe('judgeRun: pattern', () => {
  it('meets when three cross passes and one circular check pass follow the method', () => {
    const pattern = result(judgeRun(input()), 'pattern');
    expect(pattern.met).toBe(true);
    expect(pattern.measured).toBe(4);
    expect(pattern.limit).toBe(4);
  });

  it('says "the one pass" for a one-pass method and "all 4 passes" for four, never "all 1 passes"', () => {
    const onePass = { passes: [{ percentOfTarget: 100, pattern: 'cross' as const, orderByStudCount: { '8': CROSS_8 } }], checkPasses: 0 };
    expect(result(judgeRun(input({ method: onePass, steps: stepsFor([CROSS_8]) })), 'pattern').sentence).toBe("The one pass followed the method's order.");
    expect(result(judgeRun(input()), 'pattern').sentence).toBe("All 4 passes followed the method's order, check pass circular.");
    const swapped = [1, 3, 5, 7, 2, 6, 4, 8];
    expect(result(judgeRun(input({ method: onePass, steps: stepsFor([swapped]) })), 'pattern').sentence).toMatch(/ 0 of 1 pass followed the method's order\.$/);
  });

  it('names the pass, step and positions when two studs are swapped', () => {
    const swapped = [1, 3, 5, 7, 2, 6, 4, 8];
    const pattern = result(judgeRun(input({ steps: stepsFor([CROSS_8, swapped, CROSS_8, CIRCLE_8]) })), 'pattern');
    expect(pattern.met).toBe(false);
    expect(pattern.measured).toBe(3);
    expect(pattern.sentence).toContain('In pass 2, step 2 tightened position 3 where the method prescribes position 5.');
  });

  it('accepts a circular check pass that starts at another stud but goes clockwise', () => {
    const fromThree = [3, 4, 5, 6, 7, 8, 1, 2];
    expect(result(judgeRun(input({ steps: stepsFor([CROSS_8, CROSS_8, CROSS_8, fromThree]) })), 'pattern').met).toBe(true);
  });

  it('refuses an anticlockwise check pass', () => {
    const anticlockwise = [1, 8, 7, 6, 5, 4, 3, 2];
    const pattern = result(judgeRun(input({ steps: stepsFor([CROSS_8, CROSS_8, CROSS_8, anticlockwise]) })), 'pattern');
    expect(pattern.met).toBe(false);
    expect(pattern.sentence).toContain('Pass 4 should be a circular check pass');
  });

  it('fails when the check pass is missing', () => {
    const pattern = result(judgeRun(input({ steps: stepsFor([CROSS_8, CROSS_8, CROSS_8]) })), 'pattern');
    expect(pattern.met).toBe(false);
    expect(pattern.sentence).toContain('Pass 4 (a circular check pass) was not recorded.');
  });

  it('fails when a pass stops early', () => {
    const pattern = result(judgeRun(input({ steps: stepsFor([CROSS_8, CROSS_8.slice(0, 6), CROSS_8, CIRCLE_8]) })), 'pattern');
    expect(pattern.met).toBe(false);
    expect(pattern.sentence).toContain('Pass 2 stopped after 6 of 8 studs.');
  });

  it('cannot be met when the method has no order for the stud count', () => {
    const method = { passes: [{ percentOfTarget: 100, pattern: 'cross' as const, orderByStudCount: { '12': [] } }], checkPasses: 0 };
    const pattern = result(judgeRun(input({ method, steps: stepsFor([CROSS_8]) })), 'pattern');
    expect(pattern.met).toBe(false);
    expect(pattern.measured).toBeNull();
    expect(pattern.sentence).toContain('no stud order for 8 studs');
  });

  it('is left out when the cohort does not require it', () => {
    const judgement = judgeRun(input({ criteria: { requirePattern: false }, steps: stepsFor([CIRCLE_8]) }));
    expect(judgement.results.map((r) => r.key)).toEqual(['band', 'cv', 'yield']);
  });
});

describe('judgeRun: yield', () => {
  // Yield load of a 3/4-10 B7 stud, computed here from the reference sheet, not from lib/calc:
  // As = 0.7854 (0.75 − 0.9743/10)² in² (ASME B1.1, docs/REFERENCE.md §1 ✓ [EE-B1.1]) = 0.33446 in²;
  // minimum yield 105 ksi (docs/REFERENCE.md §2 ✓ [NANL], [BACO]); 1 lbf = 4.4482216152605 N (exact).
  const yieldLoadN = 105_000 * 0.7854 * (0.75 - 0.9743 / 10) ** 2 * 4.4482216152605;

  it('measures the highest final load as % of the minimum yield load (105 kN → 67.2 %)', () => {
    expect(yieldLoadN).toBeCloseTo(156_213, -1); // 35,118 lbf; cf. 17,535 lb at 50 % in docs/REFERENCE.md §3 (computed)
    const y = result(judgeRun(input()), 'yield');
    expect(y.measured).toBeCloseTo((105_000 / yieldLoadN) * 100, 6);
    expect(y.met).toBe(true);
    expect(y.detail?.peakPosition).toBe(2);
  });

  it('catches an overshoot during an earlier step even when the final loads are fine', () => {
    const steps = stepsFor([CROSS_8, CROSS_8, CROSS_8, CIRCLE_8]).map((step) =>
      step.order === 20 ? { ...step, loadsN: [100e3, 100e3, 115e3, 100e3, 100e3, 100e3, 100e3, 100e3] } : step,
    );
    const y = result(judgeRun(input({ steps })), 'yield');
    expect(y.measured).toBeCloseTo((115_000 / yieldLoadN) * 100, 6); // 73.6 %
    expect(y.met).toBe(false);
    expect(y.sentence).toContain('position 3');
    expect(y.sentence).toContain('above the 70 % limit');
  });

  it('says so when the stud grade is unknown', () => {
    const y = result(judgeRun(input({ joint: { ...joint, studGrade: 'Grade unobtainium' } })), 'yield');
    expect(y.met).toBe(false);
    expect(y.measured).toBeNull();
    expect(y.sentence).toContain('not in the grade table');
  });
});

describe('judgeRun: overall', () => {
  it('is all met only when every criterion is met', () => {
    expect(judgeRun(input()).allMet).toBe(true);
    expect(judgeRun(input({ criteria: { maxCvPercent: 1 } })).allMet).toBe(false);
  });

  it('refuses a run with the wrong number of final loads', () => {
    expect(() => judgeRun(input({ finalLoadsN: [100e3, 100e3] }))).toThrow(/one final load per stud \(8\), got 2/);
  });
});

describe('criteriaSchema', () => {
  it('accepts the defaults', () => {
    expect(criteriaSchema.safeParse(DEFAULT_CRITERIA).success).toBe(true);
  });

  it.each([
    [{ bandPercent: 0 }, 'bandPercent', 'between 1 and 30 %'],
    [{ bandPercent: 45 }, 'bandPercent', 'between 1 and 30 %'],
    [{ maxCvPercent: 0.1 }, 'maxCvPercent', 'between 0.5 and 20 %'],
    [{ maxYieldPercent: 96 }, 'maxYieldPercent', 'between 20 and 95 %'],
    [{ maxYieldPercent: 'lots' }, 'maxYieldPercent', 'as a number'],
  ])('refuses %o with a sentence naming the limit', (change, field, words) => {
    const parsed = criteriaSchema.safeParse({ ...DEFAULT_CRITERIA, ...change });
    expect(parsed.success).toBe(false);
    const messages = parsed.error?.flatten().fieldErrors as Record<string, string[] | undefined>;
    expect(messages[field]?.[0]).toContain(words);
  });
});
