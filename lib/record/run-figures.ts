import type { NormalisedRun } from './run-types';
import { mean } from '../stats/mean';
import { sampleStandardDeviation } from '../stats/sample-standard-deviation';
import { elasticInteractionDrift } from '../stats/elastic-interaction-drift';

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
  /** JSON array of the final loads in N (index 0 = position 1). */
  finalLoadsJson: string | null;
  /** JSON array of each stud's drift in % since it was last tightened (null where never tightened). */
  driftJson: string | null;
}

export function storedRunFigures(run: NormalisedRun): StoredRunFigures {
  const last = run.steps[run.steps.length - 1];
  const passCount = run.steps.reduce((max, step) => Math.max(max, step.pass), 0);
  if (!last || last.loadsN.length < 2) {
    return { studCount: run.studCount, stepCount: run.steps.length, passCount, finalMeanN: null, finalSdN: null, finalCv: null, finalMinN: null, finalMaxN: null, finalLoadsJson: last ? JSON.stringify(last.loadsN) : null, driftJson: null };
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
    finalLoadsJson: JSON.stringify(last.loadsN),
    driftJson: JSON.stringify(elasticInteractionDrift(run).map((d) => (d.driftPercent === null ? null : Number(d.driftPercent.toFixed(6))))),
  };
}
