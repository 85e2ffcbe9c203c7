/**
 * When a failed job is tried again: exponential back-off with a cap. Pure; lib/data/jobs calls it
 * when an attempt fails. Attempt 1 failed → base, 2 → 2·base, 3 → 4·base, … never more than the cap.
 */
export interface RetryPolicy {
  /** The wait after the first failed attempt. */
  baseMs: number;
  /** The longest wait between attempts. */
  capMs: number;
}

/** 30 s, 1 min, 2 min, … up to 6 h: a mail server that is down for an afternoon is retried a few times an hour, then every 6 h. */
export const DEFAULT_RETRY_POLICY: RetryPolicy = { baseMs: 30_000, capMs: 6 * 60 * 60_000 };

/** The wait before the next attempt after `failedAttempts` attempts have failed (1 or more). */
export function retryDelayMs(failedAttempts: number, policy: RetryPolicy = DEFAULT_RETRY_POLICY): number {
  if (!Number.isInteger(failedAttempts) || failedAttempts < 1) throw new RangeError('retryDelayMs needs the number of failed attempts (a whole number from 1)');
  if (!(policy.baseMs > 0) || !(policy.capMs >= policy.baseMs)) throw new RangeError('retryDelayMs needs 0 < baseMs <= capMs');
  // 2^(n-1) grows past any cap long before it overflows: stop doubling once the cap is reached.
  const exponent = Math.min(failedAttempts - 1, 52);
  return Math.min(policy.capMs, policy.baseMs * 2 ** exponent);
}
