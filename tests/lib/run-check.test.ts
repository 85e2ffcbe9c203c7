import { describe, expect, it } from 'vitest';
import { lbfToN } from '@/lib/calc/units';
import { studYieldLoad } from '@/lib/joints/joint-properties';
import { checkBand, OFF_BAND_MIN_PERCENT, OFF_BAND_WIDTHS } from '@/lib/run-check/check-band';
import { checkFlatChannel } from '@/lib/run-check/check-flat-channel';
import { checkPasses } from '@/lib/run-check/check-passes';
import { checkRun, isOverYield } from '@/lib/run-check/check-run';
import { checkStepOrder } from '@/lib/run-check/check-step-order';
import { checkStudCount } from '@/lib/run-check/check-stud-count';
import { checkTimeGaps, GAP_MIN_SECONDS } from '@/lib/run-check/check-time-gaps';
import { checkYield } from '@/lib/run-check/check-yield';
import type { RunCheckInput } from '@/lib/run-check/types';
import type { NormalisedRun } from '@/lib/record/run-types';
import type { MethodPass } from '@/models/method';

// The 8-stud cross order 1-5-3-7-2-6-4-8 (common practice: the usual star sequence for 8 studs).
const CROSS_8 = [1, 5, 3, 7, 2, 6, 4, 8];
const TARGET_N = 50_000;
const pass = (percentOfTarget: number, order = CROSS_8): MethodPass => ({ percentOfTarget, pattern: 'cross', orderByStudCount: { '8': order } });
const ONE_PASS = { name: 'One pass, cross order, 100 %', passes: [pass(100)], checkPasses: 0 };
const THREE_PASS_CHECK = { name: 'Three cross passes and a check pass', passes: [pass(30), pass(60), pass(100)], checkPasses: 1 };
// 5/8-11 ASTM A193 B7: minimum yield 105 ksi (ASTM A193, Table 2) × As 0.226 in² (ASME B1.1) = 23,730 lbf (docs/REFERENCE.md §1, §2; computed).
const YIELD_5_8_B7_N = lbfToN(105_000 * 0.226);

/**
 * A run tightened as the given passes prescribe: in each pass every stud in `orders[p]` reaches
 * `fractions[p]` × its final load, one step per stud; `timeStepS` seconds between steps.
 */
function runOf(opts: { orders: number[][]; fractions: number[]; finalLoadsN: number[]; timeStepS?: number }): NormalisedRun {
  const loads = new Array<number>(8).fill(0);
  const steps: NormalisedRun['steps'] = [];
  opts.orders.forEach((order, p) => {
    for (const position of order) {
      loads[position - 1] = opts.finalLoadsN[position - 1]! * opts.fractions[p]!;
      steps.push({ order: steps.length + 1, pass: p + 1, position, timeS: opts.timeStepS === undefined ? null : steps.length * opts.timeStepS, loadsN: [...loads] });
    }
  });
  return { studCount: 8, targetLoadN: TARGET_N, steps };
}

const EVEN = new Array<number>(8).fill(TARGET_N);
const FOUR_PASS_RUN = runOf({ orders: [CROSS_8, CROSS_8, CROSS_8, [1, 2, 3, 4, 5, 6, 7, 8]], fractions: [0.3, 0.6, 1, 1], finalLoadsN: EVEN, timeStepS: 20 });

const input = (run: NormalisedRun, overrides: Partial<RunCheckInput> = {}): RunCheckInput => ({
  run,
  jointStudCount: 8,
  method: THREE_PASS_CHECK,
  bandPercent: 10,
  yieldLoad: { yieldLoadN: 2 * TARGET_N, source: 'ASTM A193, Table 2' },
  ...overrides,
});

describe('studYieldLoad', () => {
  it('gives 23,730 lbf for a 5/8-11 B7 stud, from ASTM A193, Table 2 (105 ksi × 0.226 in², docs/REFERENCE.md §1, §2)', () => {
    const y = studYieldLoad({ studGrade: 'ASTM A193 B7', threadSystem: 'inch', threadDiameter: 0.625, threadPitch: 11, targetLoadN: TARGET_N })!;
    expect(Math.abs(y.yieldLoadN - YIELD_5_8_B7_N) / YIELD_5_8_B7_N).toBeLessThan(1e-3);
    expect(y.source).toBe('ASTM A193, Table 2');
  });
  it('gives nothing for a grade outside the table (no yield rule then)', () => {
    expect(studYieldLoad({ studGrade: 'SAE J429 Grade 8', threadSystem: 'inch', threadDiameter: 0.625, threadPitch: 11, targetLoadN: TARGET_N })).toBeNull();
  });
});

describe('checkStudCount', () => {
  it('passes a run with one load per stud of its joint and a method with an 8-stud order', () => {
    expect(checkStudCount(input(FOUR_PASS_RUN))).toBeNull();
  });
  it('holds a run whose joint has another stud count', () => {
    expect(checkStudCount(input(FOUR_PASS_RUN, { jointStudCount: 12 }))?.message).toBe('The run has loads for 8 studs, but its joint has 12.');
  });
  it('does not hold a run because its method has no order for the stud count (the library lacks it, the run does not)', () => {
    const method = { name: 'Twelve only', passes: [{ percentOfTarget: 100, pattern: 'cross' as const, orderByStudCount: { '12': [1] } }], checkPasses: 0 };
    expect(checkStudCount(input(FOUR_PASS_RUN, { method }))).toBeNull();
  });
});

describe('checkPasses', () => {
  it('passes 4 passes and 32 steps against three cross passes and a check pass (3 + 1 passes × 8 studs, computed)', () => {
    expect(checkPasses(input(FOUR_PASS_RUN))).toBeNull();
  });
  it('holds 4 passes and 32 steps stored as "one pass, cross order" (1 pass, 8 steps)', () => {
    expect(checkPasses(input(FOUR_PASS_RUN, { method: ONE_PASS }))?.message).toBe(
      'The run has 4 passes and 32 steps; the method "One pass, cross order, 100 %" prescribes 1 pass and 8 steps for 8 studs.',
    );
  });
  it('counts the passes of a method without an order for the stud count: 4 passes against 1 × 8 studs is held, 4 against 3 + 1 passes is not', () => {
    const noOrder = (m: typeof ONE_PASS) => ({ ...m, passes: m.passes.map((p) => ({ ...p, orderByStudCount: { '12': [1] } })) });
    expect(checkPasses(input(FOUR_PASS_RUN, { method: noOrder(ONE_PASS) }))?.message).toBe(
      'The run has 4 passes and 32 steps; the method "One pass, cross order, 100 %" prescribes 1 pass and 8 steps for 8 studs.',
    );
    expect(checkPasses(input(FOUR_PASS_RUN, { method: noOrder(THREE_PASS_CHECK) }))).toBeNull();
  });
  it('holds a run that stops short of the method (2 of 4 passes)', () => {
    const short = { ...FOUR_PASS_RUN, steps: FOUR_PASS_RUN.steps.slice(0, 16) };
    expect(checkPasses(input(short))?.rule).toBe('passes');
  });
});

describe('checkStepOrder', () => {
  it('passes the cross order followed step by step, check pass circular', () => {
    expect(checkStepOrder(input(FOUR_PASS_RUN))).toBeNull();
  });
  it('says nothing when the method has no order for the stud count (no order to hold the steps to)', () => {
    const circular = runOf({ orders: [[1, 2, 3, 4, 5, 6, 7, 8]], fractions: [1], finalLoadsN: EVEN });
    const method = { ...ONE_PASS, passes: [{ ...pass(100), orderByStudCount: { '12': [1] } }] };
    expect(checkStepOrder(input(circular, { method }))).toBeNull();
    expect(checkStepOrder(input(circular, { method: ONE_PASS }))?.rule).toBe('step_order');
  });
  it('names the first step tightened out of the cross order (a circular first pass: step 2 is stud 2, not 5)', () => {
    const circular = runOf({ orders: [[1, 2, 3, 4, 5, 6, 7, 8], CROSS_8, CROSS_8, [1, 2, 3, 4, 5, 6, 7, 8]], fractions: [0.3, 0.6, 1, 1], finalLoadsN: EVEN });
    expect(checkStepOrder(input(circular))?.message).toBe('Step 2 tightened stud 2; the method "Three cross passes and a check pass" prescribes stud 5 there (pass 1).');
  });
});

describe('checkYield', () => {
  it('passes loads at the target, 50 % of the yield load', () => {
    expect(checkYield(input(FOUR_PASS_RUN))).toBeNull();
  });
  it('holds every stud at 200–230 % of target, above the yield load of 2 × target (demo joints: target 50 % of yield)', () => {
    const high = runOf({ orders: [CROSS_8, CROSS_8, CROSS_8, [1, 2, 3, 4, 5, 6, 7, 8]], fractions: [0.3, 0.6, 1, 1], finalLoadsN: [2, 2.05, 2.1, 2.15, 2.2, 2.25, 2.3, 2.2].map((f) => f * TARGET_N) });
    const reason = checkYield(input(high))!;
    expect(reason.rule).toBe('over_yield');
    expect(reason.message).toContain('Stud 7 reached 115 kN');
    expect(reason.message).toMatch(/230\s% of the target/u);
    expect(reason.message).toContain('(ASTM A193, Table 2)');
    expect(reason.message).toContain('8 of 8 studs end at or above it');
  });
  it('finds a peak that is gone by the end (one stud over yield at one step, relaxed later)', () => {
    const run = structuredClone(FOUR_PASS_RUN);
    run.steps[20]!.loadsN[2] = 2.1 * TARGET_N;
    expect(checkYield(input(run))?.message).toContain('at step 21');
  });
  it('skips the rule when the grade is not in the table', () => {
    const high = runOf({ orders: [CROSS_8], fractions: [1], finalLoadsN: EVEN.map((l) => 3 * l) });
    expect(checkYield(input(high, { yieldLoad: null }))).toBeNull();
  });
});

describe('checkBand', () => {
  it(`holds a run whose every stud ends above the band with the mean more than ${OFF_BAND_WIDTHS} band widths (min ${OFF_BAND_MIN_PERCENT} %) off target`, () => {
    const high = runOf({ orders: [CROSS_8], fractions: [1], finalLoadsN: EVEN.map((l) => 1.45 * l) });
    expect(checkBand(input(high))?.message).toBe('Every stud ended above the ±10 % band: final loads 145\u00a0% of the target. Check the unit, the target and the joint chosen.');
  });
  it('gives the range of the final loads when they differ (every stud at 60–70 %, below the band)', () => {
    const low = runOf({ orders: [CROSS_8], fractions: [1], finalLoadsN: [0.6, 0.65, 0.7, 0.6, 0.62, 0.68, 0.64, 0.66].map((f) => f * TARGET_N) });
    expect(checkBand(input(low))?.message).toContain('below the ±10 % band: final loads 60.0\u00a0% to 70.0\u00a0% of the target');
  });
  it('passes an uneven trainee run that misses the band on both sides', () => {
    const uneven = runOf({ orders: [CROSS_8], fractions: [1], finalLoadsN: [0.7, 1.3, 0.8, 1.2, 0.75, 1.25, 0.9, 1.1].map((f) => f * TARGET_N) });
    expect(checkBand(input(uneven))).toBeNull();
  });
  it('passes a run just outside the band on one side (every stud at 120 %, 20 % off, within 30 %)', () => {
    const high = runOf({ orders: [CROSS_8], fractions: [1], finalLoadsN: EVEN.map((l) => 1.2 * l) });
    expect(checkBand(input(high))).toBeNull();
  });
});

describe('checkFlatChannel', () => {
  it('holds a stud that reads zero throughout while its neighbours load (a dead channel)', () => {
    const dead = structuredClone(FOUR_PASS_RUN);
    for (const step of dead.steps) step.loadsN[4] = 0;
    expect(checkFlatChannel(input(dead))?.message).toBe('One stud reads flat through the run while the others load: stud 5 (0 kN). Check the gauge, its lead and the channel map.');
  });
  it('holds a stud stuck at one value', () => {
    const stuck = structuredClone(FOUR_PASS_RUN);
    for (const step of stuck.steps) step.loadsN[1] = 12_300;
    expect(checkFlatChannel(input(stuck))?.message).toContain('stud 2 (12.3 kN)');
  });
  it('passes a run in which every stud loads', () => {
    expect(checkFlatChannel(input(FOUR_PASS_RUN))).toBeNull();
  });
  it('passes a run that stopped early: the studs not yet tightened are rightly flat', () => {
    const early = { ...FOUR_PASS_RUN, steps: FOUR_PASS_RUN.steps.slice(0, 3) };
    expect(checkFlatChannel(input(early))).toBeNull();
  });
});

describe('checkTimeGaps', () => {
  it(`holds a hole of more than 10 × the median step interval and ${GAP_MIN_SECONDS} s`, () => {
    const gap = structuredClone(FOUR_PASS_RUN);
    for (const step of gap.steps.slice(16)) step.timeS = step.timeS! + 1800;
    expect(checkTimeGaps(input(gap))?.message).toBe('No reading for 30.3 min between step 16 and step 17 (the steps are usually 20 s apart). Check the log is whole.');
  });
  it('passes evenly spaced steps, and a run without times', () => {
    expect(checkTimeGaps(input(FOUR_PASS_RUN))).toBeNull();
    const untimed = runOf({ orders: [CROSS_8], fractions: [1], finalLoadsN: EVEN });
    expect(checkTimeGaps(input(untimed))).toBeNull();
  });
});

describe('checkRun', () => {
  it('passes a run that follows its method with even loads', () => {
    expect(checkRun(input(FOUR_PASS_RUN))).toEqual([]);
  });
  it('gives every failed rule, in order, and flags over-yield for the caution', () => {
    const high = runOf({ orders: [CROSS_8, CROSS_8, CROSS_8, [1, 2, 3, 4, 5, 6, 7, 8]], fractions: [0.3, 0.6, 1, 1], finalLoadsN: EVEN.map((l) => 2.1 * l) });
    const reasons = checkRun(input(high, { method: ONE_PASS }));
    expect(reasons.map((r) => r.rule)).toEqual(['passes', 'over_yield', 'off_band']);
    expect(isOverYield(reasons)).toBe(true);
    expect(isOverYield(checkRun(input(FOUR_PASS_RUN, { method: ONE_PASS })))).toBe(false);
  });
});
