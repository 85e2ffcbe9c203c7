/**
 * The one error type of the statistics layer. Every function in `lib/stats` validates its input
 * and throws a `StatsError` whose message follows a fixed grammar:
 * `<functionName> requires <what it needs>[ (got <what it got>)]`, for example
 * `oneWayAnova requires at least two groups` or
 * `mean requires finite values (got NaN at index 3)`.
 *
 * References: house style, DEVELOPERS.md "Statistics".
 *
 * @example
 * try { mean([]); } catch (e) { (e as StatsError).message; } // 'mean requires at least one value'
 */
export class StatsError extends Error {
  override readonly name = 'StatsError';

  constructor(message: string) {
    super(message);
    Object.setPrototypeOf(this, new.target.prototype);
  }
}
