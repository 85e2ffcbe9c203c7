import { compareGroups } from '@/lib/analysis/compare-groups';
import type { NormalisedRun } from '@/lib/record/run-types';
import { elasticInteractionDrift } from '@/lib/stats/elastic-interaction-drift';
import { mean } from '@/lib/stats/mean';
import { summariseRun } from '@/lib/stats/summarise-run';
import { formatDecimals } from '@/lib/calc/units';

/** The end figures of one side: means over its runs (CV as a fraction, the others in %). */
export interface SideFigures {
  key: string;
  label: string;
  runs: number;
  cv: number;
  /** (max − min)/mean in %. */
  rangeOverMeanPercent: number;
  /** Largest deviation of a final load from target, in % of target. */
  largestDeviationPercent: number;
  /** Mean drift of the studs after their last tightening, in % (negative = lost load). */
  meanDriftPercent: number;
}

export interface SceneFigures {
  sides: SideFigures[];
  /** The plain-words reading of the run-CV comparison (Welch's ANOVA), or a sentence why there is none. */
  cvReading: string;
  /** The reading of the scatter of the final loads (Levene), when it could be computed. */
  scatterReading: string | null;
  /** "over 30 simulated runs each". */
  basis: string;
  /** The end screen's heading, e.g. "Final loads, mean over 30 simulated runs each". */
  title: string;
}

/** The four figures of one run. */
export function runFigures(run: NormalisedRun, bandPercent: number): Omit<SideFigures, 'key' | 'label' | 'runs'> {
  const summary = summariseRun(run, { bandPercent });
  const drift = elasticInteractionDrift(run).map((d) => d.driftPercent).filter((d): d is number => typeof d === 'number');
  return {
    cv: summary.cv,
    rangeOverMeanPercent: summary.rangeOverMean * 100,
    largestDeviationPercent: summary.largestDeviationFromTargetPercent,
    meanDriftPercent: drift.length ? mean(drift) : 0,
  };
}

/** Figures of a group of runs: the mean of each run's figure. */
export function sideFigures(key: string, label: string, runs: readonly NormalisedRun[], bandPercent: number): SideFigures {
  const each = runs.map((run) => runFigures(run, bandPercent));
  const avg = (pick: (f: (typeof each)[number]) => number) => (each.length ? mean(each.map(pick)) : Number.NaN);
  return {
    key,
    label,
    runs: runs.length,
    cv: avg((f) => f.cv),
    rangeOverMeanPercent: avg((f) => f.rangeOverMeanPercent),
    largestDeviationPercent: avg((f) => f.largestDeviationPercent),
    meanDriftPercent: avg((f) => f.meanDriftPercent),
  };
}

/**
 * The end screen of a simulated scene: figures per side and the readings of compareGroups (the
 * same tests and wording as /compare), over many simulated runs per side.
 */
export function sceneFigures(groups: readonly { key: string; label: string; runs: readonly NormalisedRun[] }[], bandPercent: number, subject: string): SceneFigures {
  const sides = groups.map((g) => sideFigures(g.key, g.label, g.runs, bandPercent));
  const result = compareGroups(
    groups.map((g) => ({
      key: g.key,
      label: g.label,
      runs: g.runs.map((run) => ({
        targetLoadN: run.targetLoadN,
        finalLoadsN: run.steps[run.steps.length - 1]?.loadsN ?? [],
        driftPercent: elasticInteractionDrift(run).map((d) => d.driftPercent),
      })),
    })),
    { subject },
  );
  const welch = result.tests.find((t) => t.id === 'welch-ln-cv');
  const withinSd = result.tests.find((t) => t.id === 'welch-within-sd');
  const counts = [...new Set(groups.map((g) => g.runs.length))];
  const basis = counts.length === 1 ? `over ${counts[0]} simulated runs each` : `over ${counts.join(' / ')} simulated runs`;
  return {
    sides,
    cvReading: welch ? welch.reading : (result.warnings[0] ?? 'No reading: the groups are too small to compare.'),
    scatterReading: withinSd?.reading ?? null,
    basis,
    title: `Final loads, mean ${basis}`,
  };
}

/**
 * Where one measured run's CV sits among simulated runs' CVs, in plain words, e.g.
 * "The measured run's CV (6.1 %) is higher than 24 of the 30 simulated runs."
 */
export function placeAmongSimulated(realCv: number, simulatedCvs: readonly number[]): string {
  const lower = simulatedCvs.filter((cv) => cv < realCv).length;
  const pct = formatDecimals(realCv * 100, 1);
  const n = simulatedCvs.length;
  if (n === 0) return 'No simulated runs to compare with.';
  if (lower === n) return `The measured run's CV (${pct} %) is higher than all ${n} simulated runs: it scattered more than the model does with this method.`;
  if (lower === 0) return `The measured run's CV (${pct} %) is lower than all ${n} simulated runs: more even than the model expects.`;
  return `The measured run's CV (${pct} %) is higher than ${lower} of the ${n} simulated runs: it lies within what the model gives for this method.`;
}
