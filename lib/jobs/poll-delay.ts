/**
 * How long a worker sleeps between looks at the job table: the interval spread uniformly over
 * ±50 %, so instances started together do not poll in step. `random` is a number in [0, 1).
 */
export function pollDelayMs(intervalMs: number, random: number): number {
  if (!(intervalMs > 0)) throw new RangeError('pollDelayMs needs a positive interval');
  if (!(random >= 0 && random < 1)) throw new RangeError('pollDelayMs needs a random number in [0, 1)');
  return Math.round(intervalMs * (0.5 + random));
}
