import { kn, percent } from './format';
import type { RunCheckInput, RunCheckReason } from './types';

/**
 * Yield: no stud's load, at any step, reaches the stud's minimum yield load (the grade's minimum
 * yield strength × the thread's tensile stress area; ASTM A193 / A193M, Table 2). A stud loaded past
 * yield may have stretched for good, and a reading there is as likely a wrong unit or target. The
 * limit is the yield load itself (100 %): assessment criteria hold trainees to a lower share
 * (lib/assessment/criteria.ts); this check only holds runs whose loads cannot be taken as they are.
 */
export function checkYield({ run, yieldLoad }: RunCheckInput): RunCheckReason | null {
  if (!yieldLoad || run.steps.length === 0) return null;
  let peak = -Infinity;
  let peakStud = 0;
  let peakStep = 0;
  for (const step of run.steps) {
    step.loadsN.forEach((load, index) => {
      if (load > peak) [peak, peakStud, peakStep] = [load, index + 1, step.order];
    });
  }
  if (peak < yieldLoad.yieldLoadN) return null;
  const over = run.steps[run.steps.length - 1]!.loadsN.filter((load) => load >= yieldLoad.yieldLoadN).length;
  return {
    rule: 'over_yield',
    message:
      `Stud ${peakStud} reached ${kn(peak)} at step ${peakStep}, ${percent((peak / run.targetLoadN) * 100)} of the target and ` +
      `${percent((peak / yieldLoad.yieldLoadN) * 100)} of the stud's minimum yield load of ${kn(yieldLoad.yieldLoadN)} (${yieldLoad.source}); ` +
      `${over} of ${run.studCount} studs end at or above it.`,
  };
}
