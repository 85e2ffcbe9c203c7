import 'server-only';
import { Op, QueryTypes } from 'sequelize';
import { z } from 'zod';
import { AppError } from '@/lib/http/errors';
import { assertTextFile } from '@/lib/ingest/text-file';
import { parseColumnMapping, parseLoggerText } from '@/lib/ingest/parse-text';
import { jointForImport } from '@/lib/record/joint-import';
import { storedRunFigures } from '@/lib/record/run-figures';
import { UPLOAD_LIMIT_BYTES } from '@/lib/record/limits';
import { writeAudit } from './audit-log';
import { CalibrationCorrection, CalibrationSession, Joint, JointPosition, Run, RunFigureHistory, Upload, sequelize } from '@/models';
import { assertRole, type SessionUser } from '../auth/session';
import { assessTable, getCalibrationLimits, previousIntervals, writeSessionResults } from './calibration';
import { JOINT_LIBRARY_ROLES } from './joints';
import { nextVersion } from './optimistic-lock';
import { jointDto } from './record';
import { appendSteps, refreshRunFigures } from './runs/store-run';
import { readUploadBytes } from './runs/upload-file';

export const correctionSchema = z.object({
  table: z.string().max(20_000, { error: 'The calibration table is too long (at most 20,000 characters).' }),
  reason: z.string().trim().min(3, { error: 'Say why the calibration is corrected (at least 3 characters).' }).max(400, { error: 'Keep the reason to 400 characters or fewer.' }),
});
export type CorrectionInput = z.infer<typeof correctionSchema>;

const FIGURE_KEYS = ['finalMeanN', 'finalSdN', 'finalCv', 'finalMinN', 'finalMaxN', 'finalLoadsJson', 'driftJson'] as const;
const figuresOf = (run: Run) => Object.fromEntries(FIGURE_KEYS.map((k) => [k, run[k] ?? null]));
/** The figures an audit row keeps of a recomputed run (the full set stays in run_figure_history). */
const headline = (figures: Record<string, unknown>) => ({ finalMeanN: figures.finalMeanN, finalSdN: figures.finalSdN, finalCv: figures.finalCv });

/**
 * Corrects a calibration session's table and recomputes, in one transaction, every run pinned to it
 * that kept its raw file: the file is parsed again (the same lib/ingest parser as the upload, with
 * the mapping the upload used) with the corrected factors, its steps and readings replaced and its
 * figures refreshed. The correction is recorded (who, why, the table before) and each run whose
 * figures changed keeps its old figures beside the new (`run_figure_history`). When the session is
 * the joint's calibration in force, the joint's factors follow (a new joint version).
 * Runs entered by hand, simulated or streamed have no file and are left as they are.
 * @returns the ids of the runs whose figures changed.
 */
export async function correctCalibration(user: SessionUser, sessionId: number, input: CorrectionInput, sentVersion: unknown): Promise<{ accepted: boolean; changedRunIds: number[] }> {
  assertRole(user, JOINT_LIBRARY_ROLES);
  const limits = await getCalibrationLimits(user);
  return sequelize.transaction(async (transaction) => {
    const session = await CalibrationSession.findByPk(sessionId, { transaction, lock: transaction.LOCK.UPDATE });
    if (!session) throw new AppError('not_found', 'There is no calibration session with this id.');
    const version = nextVersion(session.version, sentVersion);
    const joint = await Joint.findByPk(session.jointId, { transaction, lock: transaction.LOCK.UPDATE });
    if (!joint) throw new AppError('not_found', 'There is no joint with this id; it may have been removed.');
    const assessed = assessTable(input.table, joint.studCount, limits, await previousIntervals(joint.id, session.performedOn, session.id, transaction));
    const [wasAccepted, oldTable] = [session.accepted, session.tableText];
    const correction = await CalibrationCorrection.create({ sessionId, correctedById: user.id, reason: input.reason, oldTableText: session.tableText, runsRecomputed: 0 }, { transaction });
    await session.update({ tableText: input.table, fullScaleKn: assessed.fullScaleKn, accepted: assessed.accepted, version }, { transaction });
    const inForce = await CalibrationSession.findOne({ where: { jointId: joint.id, accepted: true }, order: [['performedOn', 'DESC'], ['id', 'DESC']], attributes: ['id'], transaction });
    await writeSessionResults(session, assessed.results, assessed.accepted && inForce?.id === session.id, transaction);

    const factors = assessed.results.map((r) => r.factor);
    const positions = await JointPosition.findAll({ where: { jointId: joint.id }, transaction });
    const runs = await Run.findAll({ where: { calibrationSessionId: sessionId }, order: [['id', 'ASC']], transaction, lock: transaction.LOCK.UPDATE });
    const uploads = runs.length === 0 ? [] : await Upload.findAll({ where: { runId: { [Op.in]: runs.map((r) => r.id) } }, transaction });
    const changedRunIds: number[] = [];
    for (const run of runs) {
      const upload = uploads.find((u) => u.runId === run.id);
      if (!upload) continue;
      const text = assertTextFile(new Uint8Array(await readUploadBytes(upload.id, transaction)), UPLOAD_LIMIT_BYTES);
      const report = (upload.parseReport ?? {}) as { mapping?: unknown };
      const importJoint = jointForImport({ ...jointDto(joint, positions), targetLoadN: run.targetLoadN, calibration: factors });
      const parsed = parseLoggerText(text, report.mapping ? parseColumnMapping(report.mapping) : undefined, importJoint);
      const before = figuresOf(run);
      const computed = storedRunFigures(parsed.run) as unknown as Record<string, unknown>;
      if (JSON.stringify(before) === JSON.stringify(Object.fromEntries(FIGURE_KEYS.map((k) => [k, computed[k] ?? null])))) continue;
      await sequelize.query('DELETE FROM readings WHERE run_id = ?', { type: QueryTypes.DELETE, transaction, replacements: [run.id] });
      await sequelize.query('DELETE FROM tightening_steps WHERE run_id = ?', { type: QueryTypes.DELETE, transaction, replacements: [run.id] });
      await appendSteps(run.id, parsed.run, 0, transaction);
      await refreshRunFigures(run.id, parsed.run, transaction);
      await run.reload({ transaction });
      await RunFigureHistory.create({ runId: run.id, correctionId: correction.id, oldFigures: before, newFigures: figuresOf(run) }, { transaction });
      await writeAudit(transaction, user, { objectType: 'run', objectId: run.id, action: 'recompute', reason: input.reason, before: headline(before), after: headline(figuresOf(run)) });
      changedRunIds.push(run.id);
    }
    await correction.update({ runsRecomputed: changedRunIds.length }, { transaction });
    await writeAudit(transaction, user, {
      objectType: 'calibration_session',
      objectId: sessionId,
      action: 'correct',
      reason: input.reason,
      before: { accepted: wasAccepted, table: oldTable },
      after: { accepted: assessed.accepted, table: input.table, runsRecomputed: changedRunIds.length },
    });
    return { accepted: assessed.accepted, changedRunIds };
  });
}

export interface FigureHistoryEntry {
  correctedAt: string;
  reason: string;
  oldFigures: Record<string, unknown>;
  newFigures: Record<string, unknown>;
}

/** A run's figures before and after each correction that recomputed it, oldest first. */
export async function runFigureHistory(runId: number): Promise<FigureHistoryEntry[]> {
  const rows = await RunFigureHistory.findAll({ where: { runId }, order: [['id', 'ASC']] });
  if (rows.length === 0) return [];
  const corrections = await CalibrationCorrection.findAll({ where: { id: rows.map((r) => r.correctionId) } });
  return rows.map((r) => ({ correctedAt: r.createdAt.toISOString(), reason: corrections.find((c) => c.id === r.correctionId)?.reason ?? '', oldFigures: r.oldFigures, newFigures: r.newFigures }));
}
