import type { JointGasket } from './gasket-input';

/**
 * A joint and its positions as they stood when a version was made (joint_versions.snapshot).
 * `gasket` and each position's `channel` were added later: versions made before carry neither, and
 * a report falls back to the joint's current gasket data for them.
 */
export interface JointSnapshot {
  name: string;
  nominalSize: string;
  pressureClass: string;
  studCount: number;
  threadSystem: 'inch' | 'metric';
  threadDiameter: number;
  threadPitch: number;
  studGrade: string;
  nutGrade: string | null;
  washer: string | null;
  gasketType: string;
  targetLoadN: number;
  bandPercent: number;
  gasket?: JointGasket;
  positions: { position: number; calibrationFactor: number; note: string | null; channel?: string | null }[];
}

/** The parts of a snapshot a change is made of: true when the two describe the same joint. */
export function sameJoint(a: JointSnapshot, b: JointSnapshot): boolean {
  return JSON.stringify(a) === JSON.stringify(b);
}
