/**
 * Where snapshots of every stud (wide rows, long time stamps) go: to the step deriver when the file
 * has no step column, else into marker segments. A segment is a run of consecutive snapshots with
 * the same (pass, step) marker; its reading is the last snapshot. Snapshots before the first marker
 * are the baseline the first step's rise is measured from.
 */
import type { Snapshot, StepDeriver } from '../derive-steps';
import { emptyStep, type StepCollector } from './steps';
import type { PendingStep } from './types';

/** A snapshot with its marker key ('' = before the first marker) and the tightened position, if given. */
export type KeyedSnapshot = Snapshot & { key: string; tightened: number | null };

/** Takes snapshots in file order. */
export interface SnapshotSink {
  take(snapshot: KeyedSnapshot): void;
  /** Closes the last marker segment. */
  close(): void;
}

/** Creates the sink; with a `deriver` every snapshot goes to it, else segments go to `collector`. */
export function createSnapshotSink(studCount: number, collector: StepCollector, deriver: StepDeriver | null): SnapshotSink {
  let segment: (PendingStep & { key: string }) | null = null;
  let baseline: Float64Array | null = null;
  const copyInto = (to: Float64Array, from: ArrayLike<number>) => {
    for (let k = 0; k < studCount; k++) to[k] = from[k]!;
  };
  return {
    take(s) {
      if (deriver) {
        deriver.push(s);
        return;
      }
      if (s.key === '') {
        baseline ??= new Float64Array(studCount);
        copyInto(baseline, s.loadsN);
        return;
      }
      if (!segment || segment.key !== s.key) {
        if (segment) collector.close(segment);
        else collector.startFrom(baseline ?? s.loadsN);
        segment = { ...emptyStep(studCount, s.line, s.key.split('\u0000')[1] ?? ''), key: s.key };
      }
      copyInto(segment.loads, s.loadsN);
      segment.lastLine = s.line;
      segment.timeS = s.timeS;
      segment.pass = s.pass ?? null;
      if (s.appliedTorqueNm != null) segment.torque = s.appliedTorqueNm;
      if (s.appliedPressureBar != null) segment.pressure = s.appliedPressureBar;
      if (s.tightened !== null) segment.tightened = s.tightened;
    },
    close() {
      if (segment) collector.close(segment);
    },
  };
}
