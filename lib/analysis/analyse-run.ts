import { stepPositions } from '@/lib/calc/tensioner-coverage';
import type { NormalisedRun } from '../record/run-types';
import { coefficientOfVariation } from '../stats/coefficient-of-variation';
import { elasticInteractionDrift } from '../stats/elastic-interaction-drift';
import { interactionCoefficients } from '../stats/interaction-coefficients';
import { loadsAfterEachPass } from '../stats/loads-after-each-pass';
import { lossPerPass } from '../stats/loss-per-pass';
import { summariseRun } from '../stats/summarise-run';
import type { RunAnalysis } from './types';

/**
 * Everything the run report shows, computed from the normalised run by the statistics layer.
 * `passPercents[i]` is the method's % of target for pass i + 1 (check passes at 100 %).
 */
export function analyseRun(runId: number, run: NormalisedRun, options: { bandPercent: number; passPercents?: readonly number[] }): RunAnalysis {
  const summary = summariseRun(run, { bandPercent: options.bandPercent });
  const snapshots = loadsAfterEachPass(run);
  const losses = new Map(lossPerPass(run).map((loss) => [loss.pass, loss]));
  let reach: RunAnalysis['reach'] = [];
  try {
    reach = interactionCoefficients(run)
      .byDistance.filter((entry) => entry.distance > 0)
      .map((entry) => ({ distance: entry.distance, coefficient: entry.coefficient, standardError: entry.standardError ?? 0, observations: entry.observations }));
  } catch {
    // A run of a single step has no earlier snapshot to estimate reach from: the report says so.
    reach = [];
  }
  return {
    runId,
    studCount: run.studCount,
    targetLoadN: run.targetLoadN,
    bandPercent: options.bandPercent,
    finalLoadsN: run.steps[run.steps.length - 1]?.loadsN.slice() ?? [],
    steps: run.steps.map((s) => ({ order: s.order, pass: s.pass, position: s.position, ...(s.covers && s.covers.length > 1 ? { positions: stepPositions(s) } : {}), loadsN: s.loadsN, timeS: s.timeS ?? null, appliedTorqueNm: s.appliedTorqueNm ?? null })),
    passes: snapshots.map((snapshot) => ({
      pass: snapshot.pass,
      percentOfTarget: options.passPercents?.[snapshot.pass - 1] ?? null,
      loadsAfterN: snapshot.loadsN,
      meanLossPercent: losses.get(snapshot.pass)?.meanChangePercent ?? 0,
      cv: coefficientOfVariation(snapshot.loadsN),
    })),
    drift: elasticInteractionDrift(run).map((d) => ({
      position: d.position,
      afterLastTighteningN: d.loadAfterTighteningN ?? d.finalLoadN,
      finalN: d.finalLoadN,
      driftPercent: d.driftPercent ?? 0,
    })),
    reach,
    figures: {
      meanN: summary.meanN,
      sdN: summary.sdN,
      cv: summary.cv,
      rangeOverMean: summary.rangeOverMean,
      largestDeviationPercent: summary.largestDeviationFromTargetPercent,
      shareWithinBand: summary.shareWithinBand,
      cp: summary.cp,
      cpk: summary.cpk,
    },
  };
}
