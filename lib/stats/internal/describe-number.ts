/**
 * Text for a bad number inside a `StatsError` message: `NaN`, `Infinity`, `-Infinity`, or the
 * number itself. Internal helper of the statistics layer.
 *
 * References: none (formatting helper).
 * @throws never
 * @example
 * describeNumber(Number.NaN); // 'NaN'
 */
export function describeNumber(value: unknown): string {
  if (typeof value !== 'number') return `a ${typeof value}`;
  return String(value);
}
