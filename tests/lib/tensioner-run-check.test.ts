import { describe, expect, it } from 'vitest';
import { checkFlatChannel } from '@/lib/run-check/check-flat-channel';
import { checkPasses } from '@/lib/run-check/check-passes';
import { checkStepOrder } from '@/lib/run-check/check-step-order';
import type { RunCheckInput } from '@/lib/run-check/types';
import type { NormalisedRun } from '@/lib/record/run-types';
import type { MethodPass } from '@/models/method';

// 8 studs; a tensioner method of two passes, its stored order the 8-stud star 1-5-3-7-2-6-4-8 (common practice),
// which a tool set that pulls several studs at once does not follow stud by stud.
const TARGET_N = 50_000;
const pass: MethodPass = { percentOfTarget: 100, pattern: 'cross', orderByStudCount: { '8': [1, 5, 3, 7, 2, 6, 4, 8] } };
const METHOD = { name: 'Tensioner, two passes', passes: [pass, pass], checkPasses: 0 };

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
const input = (run: NormalisedRun): RunCheckInput => ({ run, jointStudCount: 8, method: METHOD, bandPercent: 10, yieldLoad: null });
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
    expect(checkPasses(input(runOf([[ODD, EVEN], [ODD, EVEN]])))).toBeNull();
  });

  it('holds a run with a pass short of the method', () => {
    expect(checkPasses(input(runOf([[ALL]])))?.message).toBe('The run has 1 pass of tensioner steps; the method "Tensioner, two passes" prescribes 2 passes.');
  });

  it('holds a pass that misses studs or pulls groups no coverage makes', () => {
    expect(checkPasses(input(runOf([[ALL], [ODD]])))?.message).toMatch(/pass 2 covers 4 stud positions, missing 2, 4, 6, 8\.$/);
    expect(checkPasses(input(runOf([[ALL], [[1, 2, 3, 4], [5, 6, 7, 8]]])))?.message).toMatch(/with 50 % tool coverage a step takes the odd or the even positions\.$/);
  });
});
