/** Collecting finished steps: the tightened stud, the reading, the lines, and the pass given. */
import type { NormalisedStep } from '@/lib/record/run-types';
import { clipInput } from '../text-limits';
import type { PendingStep } from './types';

/** Lines a step was read from. */
export interface StepLines {
  order: number;
  firstLine: number;
  lastLine: number;
}

/** The steps of a run as the shape readers close them. */
export interface StepCollector {
  readonly steps: NormalisedStep[];
  readonly stepLines: StepLines[];
  /** The pass each step's rows gave (null without a pass column), in step order. */
  readonly passesGiven: (number | null)[];
  readonly warnings: string[];
  /** Sets the reading before the first step (the baseline the first rise is measured from). */
  startFrom(loads: ArrayLike<number>): void;
  /**
   * Adds a step. Without a tightened position: the stud whose load rose most, when one rose by more
   * than `riseN`; else the method's stud for this step ({@link planStud}); else the stud that rose
   * most, with a warning that it is a guess.
   */
  close(step: PendingStep): void;
}

/** What the collector knows of the method, to name the stud of a step in which no load rose. */
export interface CollectorPlan {
  /** The method's steps for this stud count, in order. */
  steps?: ReadonlyArray<{ pass: number; position: number; check: boolean }>;
  /** A rise above this (N) is a tightening; at or below it nothing moved (the derivation threshold). */
  riseN: number;
}

/**
 * The stud of a step in which no load rose, from the method's order and the stud snapshot: when every
 * step so far tightened the method's studs in the method's order, and the method's next step is a check
 * pass, it is that step's stud, provided the snapshot shows it already at load (above `riseN`: a check
 * finds a tightened nut). Null when any of this does not hold. Our rule.
 */
export function planStud(plan: CollectorPlan, stepsSoFar: ReadonlyArray<{ position: number }>, loads: ArrayLike<number>): number | null {
  const next = plan.steps?.[stepsSoFar.length];
  if (!next || !next.check) return null;
  if (!stepsSoFar.every((s, i) => s.position === plan.steps![i]!.position)) return null;
  return (loads[next.position - 1] ?? 0) > plan.riseN ? next.position : null;
}

/** Creates an empty collector for a joint of `studCount` studs. */
export function createStepCollector(studCount: number, plan: CollectorPlan = { riseN: 0 }): StepCollector {
  const steps: NormalisedStep[] = [];
  const stepLines: StepLines[] = [];
  const passesGiven: (number | null)[] = [];
  const warnings: string[] = [];
  let previousReading: Float64Array = new Float64Array(studCount);

  const mostRisen = (p: PendingStep): number => {
    let best = -1;
    let rise = Number.NEGATIVE_INFINITY;
    for (let k = 0; k < studCount; k++) {
      const d = p.loads[k]! - previousReading[k]!;
      if (d > rise) {
        rise = d;
        best = k;
      }
    }
    if (rise > plan.riseN) return best + 1;
    const planned = planStud(plan, steps, p.loads);
    if (planned !== null) return planned;
    warnings.push(`Lines ${p.firstLine}–${p.lastLine}: no stud load rose in step ${clipInput(p.label)}; tightened position ${best + 1} is a guess.`);
    return best + 1;
  };

  return {
    steps,
    stepLines,
    passesGiven,
    warnings,
    startFrom(loads) {
      previousReading = Float64Array.from({ length: studCount }, (_, k) => loads[k]!);
    },
    close(p) {
      const position = p.tightened ?? mostRisen(p);
      const order = steps.length + 1;
      steps.push({
        order,
        pass: p.pass ?? 0,
        position,
        appliedTorqueNm: p.torque,
        appliedPressureBar: p.pressure,
        timeS: p.timeS,
        loadsN: Array.from(p.loads),
      });
      passesGiven.push(p.pass);
      stepLines.push({ order, firstLine: p.firstLine, lastLine: p.lastLine });
      previousReading = p.loads;
    },
  };
}

/** A new pending step with no loads read yet. */
export function emptyStep(studCount: number, line: number, label: string): PendingStep {
  return { label, firstLine: line, lastLine: line, loads: new Float64Array(studCount), timeS: null, torque: null, pressure: null, pass: null, tightened: null };
}
