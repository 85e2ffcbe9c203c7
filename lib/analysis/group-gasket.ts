import { mean } from '../stats/mean';
import type { ComparedRun, GroupGasketFigures } from './compare-types';

/**
 * A compare group's gasket figures from its runs' stored figures: the mean of the runs' average
 * gasket stress after the final step, over the runs that have gasket data, and the share of the
 * runs with a known minimum seating stress whose average reaches it (≥).
 */
export function groupGasketFigures(runs: readonly Pick<ComparedRun, 'gasket'>[]): GroupGasketFigures {
  // filter, not flatMap: a group may hold thousands of runs, and flatMap costs many times as much in V8.
  const withGasket = runs.filter((r) => r.gasket).map((r) => r.gasket!);
  const withSeating = withGasket.filter((g) => g.minSeatingMpa !== null);
  return {
    meanStressMpa: withGasket.length ? mean(withGasket.map((g) => g.stressMpa)) : null,
    runsWithGasket: withGasket.length,
    seatedShare: withSeating.length ? withSeating.filter((g) => g.stressMpa >= g.minSeatingMpa!).length / withSeating.length : null,
    runsWithSeating: withSeating.length,
  };
}
