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
  /** Adds a step. Without a tightened position, the stud whose load rose most is taken (with a warning when none rose). */
  close(step: PendingStep): void;
}

/** Creates an empty collector for a joint of `studCount` studs. */
export function createStepCollector(studCount: number): StepCollector {
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
    if (!(rise > 0)) warnings.push(`Lines ${p.firstLine}–${p.lastLine}: no stud load rose in step ${clipInput(p.label)}; tightened position ${best + 1} is a guess.`);
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
