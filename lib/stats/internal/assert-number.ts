import { StatsError } from '../stats-error';
import { describeNumber } from './describe-number';

/**
 * Validates one scalar argument. `rule` is 'finite', 'positive' (> 0), 'nonNegative' (>= 0) or
 * 'probability' (strictly between 0 and 1). Message: `fUpperTail requires a positive dfNumerator (got -1)`.
 *
 * References: house style, STYLE.md "The statistics layer".
 * @throws {StatsError} when the value breaks the rule.
 * @example
 * assertNumber('chiSquareUpperTail', 'df', 3, 'positive'); // passes
 */
export function assertNumber(
  fn: string,
  name: string,
  value: unknown,
  rule: 'finite' | 'positive' | 'nonNegative' | 'probability' = 'finite',
): asserts value is number {
  const ok =
    typeof value === 'number' &&
    Number.isFinite(value) &&
    (rule === 'finite' ||
      (rule === 'positive' && value > 0) ||
      (rule === 'nonNegative' && value >= 0) ||
      (rule === 'probability' && value > 0 && value < 1));
  if (!ok) {
    const adjective = { finite: 'finite', positive: 'positive', nonNegative: 'non-negative', probability: 'probability in (0, 1) as' }[rule];
    const article = rule === 'probability' ? 'a' : /^[aeiou]/.test(adjective) ? 'an' : 'a';
    throw new StatsError(`${fn} requires ${article} ${adjective} ${name} (got ${describeNumber(value)})`);
  }
}
