/** Types shared by the normaliser (`../normalise.ts`) and its shape readers. */

import type { ChannelMap } from '../channel-map';

/** What the import needs to know about the joint the run was recorded on. */
export interface JointForImport {
  /** Which logger channel is wired to which position (`channel-map.ts`); default channel k = position k. */
  channelMap?: ChannelMap;
  /** The method's steps for this stud count (pass, position, check pass), when known: derivation keeps steps the method has after the last rise (check passes). */
  plannedSteps?: ReadonlyArray<{ pass: number; position: number; check: boolean }>;
  studCount: number;
  /** Target stud load in N. */
  targetLoadN: number;
  /** Largest believable stud load in N; anything above is rejected as absurd. */
  maxStudLoadN: number;
  /** Where `maxStudLoadN` comes from, for the message, e.g. `1.2 × the stud's minimum tensile load of 156 kN`. */
  maxStudLoadSource?: string;
  /** Per-position calibration factor for microstrain files (index 0 = position 1); default all 1. */
  calibration?: number[];
  /** Stress area at the gauges in m², needed for microstrain files. */
  stressAreaM2?: number;
  /** Young's modulus of the studs in Pa, needed for microstrain files. */
  youngsModulusPa?: number;
}

/** What every data row gives besides its loads, read before the shape reader sees the row. */
export interface RowExtras {
  /** Marker key of the row ('' = before the first step marker). */
  key: string;
  /** Text of the current step marker (the step's label in messages). */
  label: string;
  /** Current pass number from the pass column, or null. */
  pass: number | null;
  /** Applied torque in N·m, or null. */
  torque: number | null;
  /** Applied pressure in bar, or null. */
  pressure: number | null;
  /** Tightened position from the tightened-position column, or null. */
  tightened: number | null;
}

/** A step being read: its lines, the loads of every stud (N) and what the rows said about it. */
export interface PendingStep {
  firstLine: number;
  lastLine: number;
  loads: Float64Array;
  timeS: number | null;
  torque: number | null;
  pressure: number | null;
  pass: number | null;
  tightened: number | null;
  label: string;
}

/** Reads the data rows of one file shape. */
export interface ShapeReader {
  /** Reads one data row (width checked, markers and extras already read). */
  read(row: readonly string[], line: number, extras: RowExtras): void;
  /** Closes what the reader still holds after the last row. */
  close(): void;
}
