import type { JointForImport } from '@/lib/ingest/normalise';
import type { RecordJoint } from '@/lib/data/record';

/** What lib/ingest needs to know about a joint. */
export function jointForImport(joint: RecordJoint): JointForImport {
  return {
    studCount: joint.studCount,
    targetLoadN: joint.targetLoadN,
    maxStudLoadN: joint.maxStudLoadN,
    maxStudLoadSource: joint.maxStudLoadSource,
    calibration: joint.calibration,
    channelMap: joint.channelMap,
    stressAreaM2: joint.stressAreaM2 ?? undefined,
    youngsModulusPa: joint.youngsModulusPa,
  };
}

