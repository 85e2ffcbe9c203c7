import { formatDecimals } from '../calc/units';
import type { RunCheckInput, RunCheckReason } from './types';

/**
 * A gap between two successive steps longer than 10 × the run's median step interval and longer
 * than 5 minutes means the log has a hole (the logger stopped, a file was joined, or the run was
 * left and taken up again). Both limits are our own choice.
 */
export const GAP_MEDIAN_FACTOR = 10;
export const GAP_MIN_SECONDS = 300;

/** Gaps in time: no unexplained hole between two successive steps. */
export function checkTimeGaps({ run }: RunCheckInput): RunCheckReason | null {
  const timed = run.steps.filter((step) => typeof step.timeS === 'number' && Number.isFinite(step.timeS)).sort((a, b) => a.order - b.order);
  if (timed.length < 3) return null;
  const intervals = timed.slice(1).map((step, i) => step.timeS! - timed[i]!.timeS!);
  const sorted = [...intervals].sort((a, b) => a - b);
  const median = sorted[Math.floor(sorted.length / 2)]!;
  const limit = Math.max(GAP_MEDIAN_FACTOR * median, GAP_MIN_SECONDS);
  const at = intervals.findIndex((interval) => interval > limit);
  if (at < 0) return null;
  const minutes = formatDecimals(intervals[at]! / 60, 1, 0);
  return {
    rule: 'time_gap',
    message: `No reading for ${minutes} min between step ${timed[at]!.order} and step ${timed[at + 1]!.order} (the steps are usually ${formatDecimals(median, 1, 0)} s apart). Check the log is whole.`,
  };
}
