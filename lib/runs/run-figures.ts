import type { NormalisedRun } from '../run-types';
import { mean } from '../stats/mean';
import { sampleStandardDeviation } from '../stats/sample-standard-deviation';

/** The per-run figures stored on `runs` so comparisons aggregate in SQL. */
export interface StoredRunFigures {
  studCount: number;
  stepCount: number;
  passCount: number;
  finalMeanN: number | null;
  finalSdN: number | null;
  finalCv: number | null;
  finalMinN: number | null;
  finalMaxN: number | null;
}

export function storedRunFigures(run: NormalisedRun): StoredRunFigures {
  const last = run.steps[run.steps.length - 1];
  const passCount = run.steps.reduce((max, step) => Math.max(max, step.pass), 0);
  if (!last || last.loadsN.length < 2) {
    return { studCount: run.studCount, stepCount: run.steps.length, passCount, finalMeanN: null, finalSdN: null, finalCv: null, finalMinN: null, finalMaxN: null };
  }
  const finalMeanN = mean(last.loadsN);
  const finalSdN = sampleStandardDeviation(last.loadsN);
  return {
    studCount: run.studCount,
    stepCount: run.steps.length,
    passCount,
    finalMeanN,
    finalSdN,
    finalCv: finalMeanN > 0 ? finalSdN / finalMeanN : null,
    finalMinN: Math.min(...last.loadsN),
    finalMaxN: Math.max(...last.loadsN),
  };
}
