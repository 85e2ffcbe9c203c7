import { stepPositions } from '../calc/tensioner-coverage';
import { kn } from './format';
import type { RunCheckInput, RunCheckReason } from './types';

/**
 * A stud that was tightened in some step but did not rise by 2 % of the target at any of its own
 * steps (the snapshot before the first step is taken as 0 N), and whose readings move less than
 * 2 % of the target over the whole run, while the other
 * studs' readings move by a median of at least 25 % of the target, is a dead or stuck channel
 * (common practice: a gauge that does not move while the joint around it is loaded has lost its
 * lead, its supply or its zero). Both fractions are our own choice.
 */
export const FLAT_SPAN_FRACTION = 0.02;
export const LOADING_SPAN_FRACTION = 0.25;

const median = (values: number[]): number => {
  const sorted = [...values].sort((a, b) => a - b);
  const mid = Math.floor(sorted.length / 2);
  return sorted.length % 2 ? sorted[mid]! : (sorted[mid - 1]! + sorted[mid]!) / 2;
};

/** Dead or stuck channels: no stud reads flat while its neighbours load. */
export function checkFlatChannel({ run }: RunCheckInput): RunCheckReason | null {
  if (run.steps.length < 2 || run.studCount < 2) return null;
  const min = new Array<number>(run.studCount).fill(Infinity);
  const max = new Array<number>(run.studCount).fill(-Infinity);
  for (const step of run.steps) {
    step.loadsN.forEach((load, i) => {
      if (load < min[i]!) min[i] = load;
      if (load > max[i]!) max[i] = load;
    });
  }
  const spans = max.map((high, i) => high - min[i]!);
  // Only studs the steps say were tightened: in a run that stops early the others are rightly flat.
  const tightened = new Set(run.steps.flatMap((step) => stepPositions(step).map((p) => p - 1)));
  const rose = new Set<number>();
  const ordered = [...run.steps].sort((a, b) => a.order - b.order);
  ordered.forEach((step, k) => {
    for (const position of stepPositions(step)) {
      const before = k === 0 ? 0 : ordered[k - 1]!.loadsN[position - 1]!;
      if (step.loadsN[position - 1]! - before >= FLAT_SPAN_FRACTION * run.targetLoadN) rose.add(position - 1);
    }
  });
  const flat = spans.flatMap((span, i) => (tightened.has(i) && !rose.has(i) && span < FLAT_SPAN_FRACTION * run.targetLoadN ? [i] : []));
  const others = spans.filter((_, i) => tightened.has(i) && !flat.includes(i));
  if (flat.length === 0 || others.length === 0) return null;
  if (median(others) < LOADING_SPAN_FRACTION * run.targetLoadN) return null;
  const studs = flat.map((i) => `stud ${i + 1} (${kn(max[i]!)})`).join(', ');
  return {
    rule: 'flat_channel',
    message: `${flat.length === 1 ? 'One stud reads' : `${flat.length} studs read`} flat through the run while the others load: ${studs}. Check the gauge, its lead and the channel map.`,
  };
}
