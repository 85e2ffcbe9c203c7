import { percent, plainPercent } from './format';
import type { RunCheckInput, RunCheckReason } from './types';

/**
 * How far off the band a run may end before it is held: every stud outside the band on the same
 * side, and the mean final load more than 3 band widths, and at least 25 %, away from target. Our
 * own choice (training default): a trainee's uneven run misses the band by some percent; a whole
 * run far to one side is more often a wrong unit, target or joint than a tightening.
 */
export const OFF_BAND_WIDTHS = 3;
export const OFF_BAND_MIN_PERCENT = 25;

/** Target band: the final loads are not all far to one side of the target band. */
export function checkBand({ run, bandPercent }: RunCheckInput): RunCheckReason | null {
  const last = run.steps[run.steps.length - 1];
  if (!last || run.targetLoadN <= 0) return null;
  const percents = last.loadsN.map((load) => (load / run.targetLoadN) * 100);
  const above = percents.every((p) => p > 100 + bandPercent);
  const below = percents.every((p) => p < 100 - bandPercent);
  const mean = percents.reduce((sum, p) => sum + p, 0) / percents.length;
  const limit = Math.max(OFF_BAND_WIDTHS * bandPercent, OFF_BAND_MIN_PERCENT);
  if (!(above || below) || Math.abs(mean - 100) <= limit) return null;
  const [low, high] = [percent(Math.min(...percents)), percent(Math.max(...percents))];
  const range = low === high ? low : `${low} to ${high}`;
  return {
    rule: 'off_band',
    message: `Every stud ended ${above ? 'above' : 'below'} the ±${plainPercent(bandPercent)} band: final loads ${range} of the target. Check the unit, the target and the joint chosen.`,
  };
}
