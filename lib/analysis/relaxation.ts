import type { HoldPoint } from '../record/hold-readings';
import type { PassSummary } from './types';

/**
 * Relaxation during holds: each stud's load lost since the end of the pass held after, in % of its
 * load then, (F_end − F_t) / F_end × 100 (positive = lost; common practice to report relaxation as
 * % of the initial load). A pass that follows a hold is a retightening pass.
 */

export interface HoldRelaxation {
  afterPass: number;
  elapsedS: number;
  loadsN: number[];
  /** Per stud, % of its load at the end of the pass lost by this time (null where that load was 0). */
  lostPercent: (number | null)[];
  /** Mean of the studs' % lost. */
  meanLostPercent: number | null;
}

export interface RunRelaxation {
  holds: HoldRelaxation[];
  /** Passes that follow a hold (retightening passes). */
  retighteningPasses: number[];
}

export function runRelaxation(passes: readonly PassSummary[], points: readonly HoldPoint[]): RunRelaxation {
  const holds = [...points]
    .sort((a, b) => a.afterPass - b.afterPass || a.elapsedS - b.elapsedS)
    .flatMap((point) => {
      const reference = passes.find((p) => p.pass === point.afterPass)?.loadsAfterN;
      if (!reference) return [];
      const lostPercent = point.loadsN.map((load, i) => {
        const start = reference[i] ?? 0;
        return start > 0 ? ((start - load) / start) * 100 : null;
      });
      const known = lostPercent.filter((x): x is number => x !== null);
      return [{ ...point, lostPercent, meanLostPercent: known.length ? known.reduce((a, b) => a + b, 0) / known.length : null }];
    });
  const lastPass = passes[passes.length - 1]?.pass ?? 0;
  const heldAfter = new Set(holds.map((h) => h.afterPass));
  return { holds, retighteningPasses: [...heldAfter].filter((p) => p < lastPass).map((p) => p + 1) };
}

/**
 * A run's relaxation as one number for a comparison: the mean over studs of the % of final load
 * lost by the last hold reading after the last pass, (F_final − F_hold) / F_final × 100 (studs
 * with no final load left out); null when nothing is left to average. Hand-worked: final 100 and
 * 80 kN, hold 95 and 78 kN → (5 % + 2.5 %) / 2 = 3.75 %.
 */
export function finalHoldRelaxationPercent(finalLoadsN: readonly number[], holdLoadsN: readonly number[]): number | null {
  const lost = finalLoadsN.flatMap((start, i) => (start > 0 && Number.isFinite(holdLoadsN[i]) ? [((start - holdLoadsN[i]!) / start) * 100] : []));
  return lost.length ? lost.reduce((a, b) => a + b, 0) / lost.length : null;
}
