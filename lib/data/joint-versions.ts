import { UniqueConstraintError, type Transaction } from 'sequelize';
import { AppError } from '@/lib/http/errors';
import { sameJoint, type JointSnapshot } from '@/lib/joints/joint-snapshot';
import { jointGasketOf } from '@/lib/joints/gasket-input';
import { CalibrationSession, Joint, JointPosition, JointVersion } from '@/models';

/**
 * Joint versions: a snapshot of a joint and its positions each time it changes (an edit through the
 * joint form, an accepted calibration), so a run keeps the joint it was recorded on. Runs are pinned
 * by {@link runPins} when they are stored.
 */

async function snapshotOf(jointId: number, transaction: Transaction): Promise<JointSnapshot> {
  const joint = await Joint.findByPk(jointId, { transaction });
  if (!joint) throw new AppError('not_found', 'There is no joint with this id; it may have been removed.');
  const positions = await JointPosition.findAll({ where: { jointId }, order: [['position', 'ASC']], transaction });
  return {
    name: joint.name,
    nominalSize: joint.nominalSize,
    pressureClass: joint.pressureClass,
    studCount: joint.studCount,
    threadSystem: joint.threadSystem,
    threadDiameter: joint.threadDiameter,
    threadPitch: joint.threadPitch,
    studGrade: joint.studGrade,
    nutGrade: joint.nutGrade ?? null,
    washer: joint.washer ?? null,
    gasketType: joint.gasketType,
    targetLoadN: joint.targetLoadN,
    bandPercent: joint.bandPercent,
    gasket: jointGasketOf(joint),
    positions: positions.map((p) => ({ position: p.position, calibrationFactor: p.calibrationFactor, note: p.note ?? null, channel: p.channel ?? null })),
  };
}

const latestVersion = (jointId: number, transaction: Transaction) => JointVersion.findOne({ where: { jointId }, order: [['versionNumber', 'DESC']], transaction });

/**
 * Makes a new version of the joint from its current rows, unless the latest version already says the
 * same; returns the id of the version in force. Call inside the transaction that changed the joint.
 */
export async function recordJointVersion(jointId: number, transaction: Transaction): Promise<number> {
  const snapshot = await snapshotOf(jointId, transaction);
  const latest = await latestVersion(jointId, transaction);
  if (latest && sameJoint(latest.snapshot, snapshot)) return latest.id;
  const created = await JointVersion.create({ jointId, versionNumber: (latest?.versionNumber ?? 0) + 1, snapshot }, { transaction });
  return created.id;
}

/**
 * What a new run is pinned to: the joint's version in force (made now if the joint has none yet, e.g.
 * a joint written by a seeder) and its latest accepted calibration session (null when none).
 */
export async function runPins(jointId: number, transaction: Transaction): Promise<{ jointVersionId: number; calibrationSessionId: number | null }> {
  let version = await latestVersion(jointId, transaction);
  if (!version) {
    try {
      version = await JointVersion.findByPk(await recordJointVersion(jointId, transaction), { transaction });
    } catch (error) {
      // Two first runs of a seeded joint at once: the unique (joint, number) index decides; use the winner's.
      if (!(error instanceof UniqueConstraintError)) throw error;
      version = await latestVersion(jointId, transaction);
    }
  }
  const calibration = await CalibrationSession.findOne({ where: { jointId, accepted: true }, order: [['performedOn', 'DESC'], ['id', 'DESC']], attributes: ['id'], transaction });
  return { jointVersionId: version!.id, calibrationSessionId: calibration?.id ?? null };
}

/** A run's joint as recorded, with its version number, or null for a run stored before versions. */
export async function jointAsRecorded(jointVersionId: number | null): Promise<{ versionNumber: number; snapshot: JointSnapshot } | null> {
  if (jointVersionId === null) return null;
  const version = await JointVersion.findByPk(jointVersionId);
  return version ? { versionNumber: version.versionNumber, snapshot: version.snapshot } : null;
}
