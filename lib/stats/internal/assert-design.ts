import { StatsError } from '../stats-error';
import { assertValues } from './assert-values';

/**
 * Validates a regression design: at least one predictor column, every column as long as the
 * response, all values finite, and more observations than parameters.
 *
 * References: house style, STYLE.md "The statistics layer".
 * @throws {StatsError} `<fn> requires at least one predictor`, `<fn> requires predictor 2 to have as many values as the response (got 9, expected 10)`,
 *   `<fn> requires more observations than parameters (got 3 for 3)`, non-finite values.
 * @example
 * assertDesign('multipleLinearRegression', [[1, 2, 3]], [1, 2, 4], 2); // passes
 */
export function assertDesign(
  fn: string,
  predictors: readonly (readonly number[])[],
  response: readonly number[],
  parameters: number,
): void {
  if (!Array.isArray(predictors) || predictors.length === 0) throw new StatsError(`${fn} requires at least one predictor`);
  assertValues(fn, response, 1, 'of the response');
  predictors.forEach((c, j) => {
    if (!Array.isArray(c) || c.length !== response.length) {
      throw new StatsError(
        `${fn} requires predictor ${j + 1} to have as many values as the response (got ${Array.isArray(c) ? c.length : 0}, expected ${response.length})`,
      );
    }
    assertValues(fn, c, 1, `of predictor ${j + 1}`);
  });
  if (response.length <= parameters) {
    throw new StatsError(`${fn} requires more observations than parameters (got ${response.length} for ${parameters})`);
  }
}
