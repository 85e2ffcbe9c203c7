import { fitPrepared, prepareDesign, selectPredictors, type RandomInterceptModelResult } from './internal/random-intercept-fit';
import { StatsError } from './stats-error';

/**
 * Several random-intercept models on one response, one set of clusters and subsets of one set of
 * predictor columns — e.g. the full and the reduced ML fits of a likelihood-ratio test and the REML
 * fit of the full model. The design is validated, centred and summed once (one pass over the rows);
 * each fit then works on per-cluster sums only. Every answer is, number for number, what
 * `randomInterceptModel` gives for the chosen columns (same centring, same sums, same fit).
 *
 * Algorithm and references: `randomInterceptModel` (Bates et al. 2015; lme4 fixtures).
 *
 * @throws {StatsError} the errors of `randomInterceptModel` for the full design, or
 *   `randomInterceptModels requires predictor indices between 0 and 2 (got 3)`.
 * @example
 * randomInterceptModels([[1, 2, 1, 2, 1, 2]], [1, 2, 4, 5, 3, 6], ['a', 'a', 'b', 'b', 'c', 'c'], [{ predictors: [], method: 'REML' }])[0].clusterVariance; // 1.75 (as randomInterceptModel([], …))
 */
export function randomInterceptModels(
  predictors: readonly (readonly number[])[],
  y: readonly number[],
  clusters: readonly (string | number)[],
  fits: readonly { predictors: readonly number[]; method: 'REML' | 'ML' }[],
): RandomInterceptModelResult[] {
  const fn = 'randomInterceptModels';
  for (const fit of fits) {
    for (const j of fit.predictors) {
      if (!Number.isInteger(j) || j < 0 || j >= predictors.length) throw new StatsError(`${fn} requires predictor indices between 0 and ${predictors.length - 1} (got ${j})`);
    }
  }
  const data = prepareDesign('randomInterceptModel', predictors, y, clusters);
  return fits.map((fit) => fitPrepared('randomInterceptModel', fit.predictors.length === predictors.length && fit.predictors.every((j, i) => j === i) ? data : selectPredictors(data, fit.predictors), fit.method));
}
