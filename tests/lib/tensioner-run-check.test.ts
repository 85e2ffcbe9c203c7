import { describe, expect, it } from 'vitest';
import { checkFlatChannel } from '@/lib/run-check/check-flat-channel';
import { checkPasses } from '@/lib/run-check/check-passes';
import { checkStepOrder } from '@/lib/run-check/check-step-order';
import type { RunCheckInput } from '@/lib/run-check/types';
import type { NormalisedRun } from '@/lib/record/run-types';
import type { MethodPass, TensionerCoverage } from '@/models/method';

// 8 studs; a tensioner method of two passes, its stored order the 8-stud star 1-5-3-7-2-6-4-8 (common practice),
// which a tool set that pulls several studs at once does not follow stud by stud.
const TARGET_N = 50_000;
const pass: MethodPass = { percentOfTarget: 100, pattern: 'cross', orderByStudCount: { '8': [1, 5, 3, 7, 2, 6, 4, 8] } };
const METHOD = { name: 'Tensioner, two passes', passes: [pass, pass], checkPasses: 0 };
const ONE_TOOL: TensionerCoverage = 'one_stud';

/** A run whose steps pull the given groups (pass by pass), each stud to the target with LTF 1.15 applied. */
function runOf(passes: number[][][]): NormalisedRun {
  const loads = new Array<number>(8).fill(0);
  const steps: NormalisedRun['steps'] = [];
  passes.forEach((groups, p) => {
    for (const group of groups) {
      for (const position of group) loads[position - 1] = TARGET_N;
      steps.push({ order: steps.length + 1, pass: p + 1, position: group[0]!, loadsN: [...loads], covers: group.map((position) => ({ position, appliedN: TARGET_N * 1.15, residualN: TARGET_N })) });
    }
  });
  return { studCount: 8, targetLoadN: TARGET_N, steps };
}
/** The run checked against METHOD with the given tensioner coverage (the method's `tensionerCoverage`). */
const input = (run: NormalisedRun, tensionerCoverage: TensionerCoverage = 'every_stud'): RunCheckInput => ({ run, jointStudCount: 8, method: { ...METHOD, tensionerCoverage }, bandPercent: 10, yieldLoad: null });
const ALL = [1, 2, 3, 4, 5, 6, 7, 8];
const ODD = [1, 3, 5, 7];
const EVEN = [2, 4, 6, 8];

describe('run check: tensioner methods whose steps cover several studs', () => {
  it('takes one step per pass at 100 % coverage (2 passes → 2 steps, not 16)', () => {
    const run = runOf([[ALL], [ALL]]);
    expect(checkPasses(input(run))).toBeNull();
    expect(checkStepOrder(input(run))).toBeNull();
    expect(checkFlatChannel(input(run))).toBeNull();
  });

  it('takes two steps per pass at 50 % coverage, odd then even positions', () => {
    expect(checkPasses(input(runOf([[ODD, EVEN], [ODD, EVEN]]), 'every_second_stud'))).toBeNull();
  });

  it("holds a run to the method's coverage: 50 % steps under a 100 % method, groups under one tool, single studs under 100 %", () => {
    expect(checkPasses(input(runOf([[ODD, EVEN], [ODD, EVEN]]), 'every_stud'))?.message).toMatch(/pass 1 pulls studs 1, 3, 5, 7 then 2, 4, 6, 8; with 100 % tensioner coverage a pass is one step of every stud\.$/);
    expect(checkPasses(input(runOf([[ALL], [ALL]]), 'every_second_stud'))?.message).toMatch(/with 50 % tensioner coverage a pass is two steps, the odd then the even positions\.$/);
    expect(checkPasses(input(runOf([[ALL], [ALL]]), ONE_TOOL))?.message).toMatch(/pass 1 pulls studs 1, 2, 3, 4, 5, 6, 7, 8 in one step; the method's tool is moved stud by stud \(one stud per step\)\.$/);
    // A run typed stud by stud for a method whose set covers every stud: held by the passes rule, the order rule steps aside.
    const studByStud = runOf([ALL.map((p) => [p]), ALL.map((p) => [p])]);
    expect(checkPasses(input(studByStud, 'every_stud'))?.rule).toBe('passes');
    expect(checkStepOrder(input(studByStud, 'every_stud'))).toBeNull();
    // The same run under one tool moved stud by stud is a whole run of 16 steps (2 passes × 8 studs) but not in the stored star order.
    expect(checkPasses(input(studByStud, ONE_TOOL))).toBeNull();
    expect(checkStepOrder(input(studByStud, ONE_TOOL))?.message).toMatch(/^Step 2 tightened stud 2; the method "Tensioner, two passes" prescribes stud 5 there/);
  });

  it('holds a run with a pass short of the method', () => {
    expect(checkPasses(input(runOf([[ALL]])))?.message).toBe('The run has 1 pass of tensioner steps; the method "Tensioner, two passes" prescribes 2 passes.');
  });

  it('holds a pass that misses studs or pulls groups no coverage makes', () => {
    expect(checkPasses(input(runOf([[ALL], [ODD]])))?.message).toMatch(/pass 2 covers 4 stud positions, missing 2, 4, 6, 8\.$/);
    expect(checkPasses(input(runOf([[ALL], [[1, 2, 3, 4], [5, 6, 7, 8]]]), 'every_second_stud'))?.message).toMatch(/pass 1 pulls studs 1, 2, 3, 4, 5, 6, 7, 8; with 50 % tensioner coverage a pass is two steps, the odd then the even positions\.$/);
  });
});
