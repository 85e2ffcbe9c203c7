import 'server-only';
import { Op, type Transaction } from 'sequelize';
import { AppError } from '@/lib/http/errors';
import { assessPosition, type PositionAssessment } from '@/lib/calibration/assess-position';
import { calibrationLevels, readCalibrationTable } from '@/lib/calibration/calibration-table';
import { TRAINING_DEFAULT_LIMITS, type CalibrationLimits } from '@/lib/calibration/calibration-limits';
import { addMonths, type CalibrationSessionInput } from '@/lib/calibration/session-input';
import { CalibrationLimit, CalibrationResult, CalibrationSession, Joint, JointPosition, sequelize } from '@/models';
import { assertRole, type SessionUser } from '../auth/session';
import { JOINT_LIBRARY_ROLES } from './joints';
import { recordJointVersion } from './joint-versions';

/**
 * Gauge calibration against the reference load cell (instructors and admins, like the joint
 * library; the limits are the admin's). A session stores the table as entered and one result per
 * position; an accepted session (every position accepted) becomes the joint's calibration: its
 * factors are written to the joint's positions in the same transaction.
 */

export interface StoredLimits extends CalibrationLimits {
  /** True while the centre has not set its own limits. */
  trainingDefault: boolean;
}

export interface CalibrationSessionView {
  id: number;
  performedOn: string;
  dueOn: string;
  loadCellCertificate: string;
  loadCellCertifiedOn: string;
  loadCellDueOn: string;
  fullScaleKn: number;
  accepted: boolean;
  tableText: string;
  version: number;
  results: (Omit<PositionAssessment, 'refusals'> & { refusals: string[] })[];
}

export async function getCalibrationLimits(user: SessionUser, transaction?: Transaction): Promise<StoredLimits> {
  assertRole(user, JOINT_LIBRARY_ROLES);
  const row = await CalibrationLimit.findByPk(1, { transaction });
  if (!row) return { ...TRAINING_DEFAULT_LIMITS, trainingDefault: true };
  return {
    linearityPercent: row.linearityPercent,
    hysteresisPercent: row.hysteresisPercent,
    zeroReturnPercent: row.zeroReturnPercent,
    intervalPercent: row.intervalPercent,
    intervalMonths: row.intervalMonths,
    trainingDefault: false,
  };
}

/** The centre's own limits (admin). */
export async function saveCalibrationLimits(user: SessionUser, limits: CalibrationLimits): Promise<void> {
  assertRole(user, ['admin']);
  await CalibrationLimit.upsert({ id: 1, ...limits, updatedById: user.id, updatedAt: new Date() });
}

/** The latest accepted interval of each position before `performedOn` (excluding `exceptSessionId`). */
export async function previousIntervals(jointId: number, performedOn: string, exceptSessionId: number | null, transaction: Transaction): Promise<Map<number, { lower: number; upper: number }>> {
  const previous = await CalibrationSession.findOne({
    where: { jointId, accepted: true, performedOn: { [Op.lte]: performedOn }, ...(exceptSessionId === null ? {} : { id: { [Op.ne]: exceptSessionId } }) },
    order: [['performedOn', 'DESC'], ['id', 'DESC']],
    transaction,
  });
  if (!previous) return new Map();
  const results = await CalibrationResult.findAll({ where: { sessionId: previous.id }, transaction });
  return new Map(results.map((r) => [r.position, { lower: r.factorLower, upper: r.factorUpper }]));
}

/** Reads and judges the table for a joint (pure parts in lib/calibration). */
export function assessTable(tableText: string, studCount: number, limits: CalibrationLimits, previous: Map<number, { lower: number; upper: number }>) {
  const levels = calibrationLevels(readCalibrationTable(tableText, studCount));
  const results = Array.from({ length: studCount }, (_, i) => assessPosition(levels, i, limits, previous.get(i + 1) ?? null));
  return { fullScaleKn: levels.fullScaleKn, results, accepted: results.every((r) => r.accepted) };
}

/** Writes the results of a session (replacing any) and, when accepted, the joint's factors. */
export async function writeSessionResults(session: CalibrationSession, results: PositionAssessment[], accepted: boolean, transaction: Transaction): Promise<void> {
  await CalibrationResult.destroy({ where: { sessionId: session.id }, transaction });
  await CalibrationResult.bulkCreate(
    results.map((r) => ({
      sessionId: session.id,
      position: r.position,
      factor: r.factor,
      factorLower: r.lower,
      factorUpper: r.upper,
      linearityPercent: r.linearityPercent,
      hysteresisPercent: r.hysteresisPercent,
      zeroReturnPercent: r.zeroReturnPercent,
      accepted: r.accepted,
      refusals: r.refusals.length === 0 ? null : r.refusals.join('; ').slice(0, 400),
      drift: r.drift,
    })),
    { transaction },
  );
  if (!accepted) return;
  for (const r of results) await JointPosition.update({ calibrationFactor: r.factor }, { where: { jointId: session.jointId, position: r.position }, transaction });
  await recordJointVersion(session.jointId, transaction);
}

/**
 * Records a calibration session for a joint in one transaction: the session, a result per position
 * and, when every position is accepted, the new factors on the joint's positions.
 * @throws AppError not_found for an unknown joint; invalid_input for a table that does not fit.
 */
export async function recordCalibration(user: SessionUser, jointId: number, input: CalibrationSessionInput): Promise<{ id: number; accepted: boolean }> {
  assertRole(user, JOINT_LIBRARY_ROLES);
  return sequelize.transaction(async (transaction) => {
    const joint = await Joint.findByPk(jointId, { transaction, lock: transaction.LOCK.UPDATE });
    if (!joint) throw new AppError('not_found', 'There is no joint with this id; it may have been removed.');
    const limits = await getCalibrationLimits(user, transaction);
    const assessed = assessTable(input.table, joint.studCount, limits, await previousIntervals(jointId, input.performedOn, null, transaction));
    const session = await CalibrationSession.create(
      {
        jointId,
        performedOn: input.performedOn,
        dueOn: input.dueOn === '' ? addMonths(input.performedOn, limits.intervalMonths) : input.dueOn,
        loadCellCertificate: input.loadCellCertificate,
        loadCellCertifiedOn: input.loadCellCertifiedOn,
        loadCellDueOn: input.loadCellDueOn,
        tableText: input.table,
        fullScaleKn: assessed.fullScaleKn,
        accepted: assessed.accepted,
        recordedById: user.id,
      },
      { transaction },
    );
    await writeSessionResults(session, assessed.results, assessed.accepted, transaction);
    return { id: session.id, accepted: assessed.accepted };
  });
}

const sessionView = (s: CalibrationSession, results: CalibrationResult[]): CalibrationSessionView => ({
  id: s.id,
  performedOn: s.performedOn,
  dueOn: s.dueOn,
  loadCellCertificate: s.loadCellCertificate,
  loadCellCertifiedOn: s.loadCellCertifiedOn,
  loadCellDueOn: s.loadCellDueOn,
  fullScaleKn: s.fullScaleKn,
  accepted: s.accepted,
  tableText: s.tableText,
  version: s.version,
  results: results
    .filter((r) => r.sessionId === s.id)
    .sort((a, b) => a.position - b.position)
    .map((r) => ({
      position: r.position,
      factor: r.factor,
      lower: r.factorLower,
      upper: r.factorUpper,
      linearityPercent: r.linearityPercent,
      hysteresisPercent: r.hysteresisPercent,
      zeroReturnPercent: r.zeroReturnPercent,
      accepted: r.accepted,
      refusals: r.refusals ? r.refusals.split('; ') : [],
      drift: r.drift,
    })),
});

/** Every calibration session of a joint, oldest first, with its results. */
export async function calibrationHistory(user: SessionUser, jointId: number): Promise<CalibrationSessionView[]> {
  assertRole(user, JOINT_LIBRARY_ROLES);
  const sessions = await CalibrationSession.findAll({ where: { jointId }, order: [['performedOn', 'ASC'], ['id', 'ASC']] });
  if (sessions.length === 0) return [];
  const results = await CalibrationResult.findAll({ where: { sessionId: sessions.map((s) => s.id) } });
  return sessions.map((s) => sessionView(s, results));
}

export interface CalibrationDue {
  jointId: number;
  jointName: string;
  /** Null when the joint's gauges were never calibrated here. */
  dueOn: string | null;
  loadCellDueOn: string | null;
}

/** Each joint's next gauge calibration (from its latest accepted session), soonest first; never calibrated first of all. */
export async function calibrationDueDates(user: SessionUser): Promise<CalibrationDue[]> {
  assertRole(user, JOINT_LIBRARY_ROLES);
  const [joints, sessions] = await Promise.all([
    Joint.findAll({ attributes: ['id', 'name'], order: [['name', 'ASC']] }),
    CalibrationSession.findAll({ where: { accepted: true }, order: [['performedOn', 'ASC'], ['id', 'ASC']] }),
  ]);
  const latest = new Map(sessions.map((s) => [s.jointId, s]));
  return joints
    .map((j) => ({ jointId: j.id, jointName: j.name, dueOn: latest.get(j.id)?.dueOn ?? null, loadCellDueOn: latest.get(j.id)?.loadCellDueOn ?? null }))
    .sort((a, b) => (a.dueOn ?? '').localeCompare(b.dueOn ?? ''));
}

/** The joint's calibration in force: its latest accepted session, or null. */
export async function latestCalibration(user: SessionUser, jointId: number, transaction?: Transaction): Promise<{ id: number; performedOn: string; dueOn: string } | null> {
  assertRole(user, JOINT_LIBRARY_ROLES);
  const s = await CalibrationSession.findOne({ where: { jointId, accepted: true }, order: [['performedOn', 'DESC'], ['id', 'DESC']], transaction });
  return s ? { id: s.id, performedOn: s.performedOn, dueOn: s.dueOn } : null;
}
