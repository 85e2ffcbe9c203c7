import 'server-only';
import { Op, QueryTypes } from 'sequelize';
import { AppError } from '../http/errors';
import type { NormalisedRun } from '../record/run-types';
import type { SessionUser } from '../auth/session';
import { Cohort, HardwareSet, Joint, Lubricant, LubricantLot, Method, Run, RunComment, User, sequelize } from '@/models';
import type { RunCheckReason } from '../run-check/types';
import { gasketForStress, jointGasketOf, type GasketForStress } from '../joints/gasket-input';
import { passPercentsOf } from '../analysis/pass-percents-of';
import { operatorKey, operatorLabel, runScope, seesFreeText } from './scope';
import { jointAsRecorded } from './joint-versions';
import { calculatorLtf, type CalculatorLtf } from '../calc/tensioner-coverage';
import { studDiameterM } from '../joints/joint-properties';

export interface RunHeaderDto {
  id: number;
  recordedAt: string;
  status: string;
  setAsideReason: string | null;
  /** The run check's reasons and the decision on them; null when the run passed the check. */
  review: RunReviewDto | null;
  source: string;
  notes: string | null;
  targetLoadN: number;
  bandPercent: number;
  studCount: number;
  /** The joint as it stood when the run was recorded (its version), not as it is now. */
  joint: { id: number; name: string; nominalSize: string; pressureClass: string; studGrade: string; gasketType: string; thread: string; versionNumber: number | null; gasket: RunGasketDto | null };
  method: { id: number; name: string; toolKind: string; passPercents: number[]; checkPasses: number; passOrders: number[][] };
  lubricant: { id: number; name: string; nominalNutFactor: number };
  /** `key` is the user id as text, or for researchers the pseudonym's code (scope.ts operatorKey). */
  operator: { key: string; label: string };
  cohort: { id: number; name: string } | null;
  /** The studs, nuts and washers used (with this run's use number), the lubricant lot and the gasket's condition, where recorded. */
  hardware: { setName: string | null; useNumber: number | null; lotCode: string | null; gasketCondition: 'new' | 'reused' | null };
  /** The calculator's load transfer factor for this joint, for tensioner methods only. */
  tensionerRule: CalculatorLtf | null;
}

export interface RunReviewDto {
  reasons: RunCheckReason[];
  /** Who confirmed the run or set it aside, when, and their note; null while it awaits review. */
  decision: { by: string; at: string; note: string | null } | null;
}

/** The joint's gasket as the report needs it: contact area (mm²) and stress limits (MPa) with their source. */
export type RunGasketDto = GasketForStress;

export interface RunCommentDto {
  id: number;
  authorName: string;
  body: string;
  createdAt: string;
}

export interface LoadedRun {
  header: RunHeaderDto;
  run: NormalisedRun;
  comments: RunCommentDto[];
}

type RunWithParts = Run & { joint: Joint; method: Method; lubricant: Lubricant; operator: User; cohort: Cohort | null };

const threadLabel = (j: Pick<Joint, 'threadSystem' | 'threadDiameter' | 'threadPitch'>) =>
  j.threadSystem === 'inch' ? `${j.threadDiameter} in, ${j.threadPitch} threads per inch` : `M${j.threadDiameter} × ${j.threadPitch} mm`;

/** The hardware set's name and the lubricant lot's code of a run, where recorded. */
async function hardwareOf(run: Run): Promise<RunHeaderDto['hardware']> {
  const [set, lot] = await Promise.all([
    run.hardwareSetId ? HardwareSet.findByPk(run.hardwareSetId, { attributes: ['name'] }) : null,
    run.lubricantLotId ? LubricantLot.findByPk(run.lubricantLotId, { attributes: ['lotCode'] }) : null,
  ]);
  return { setName: set?.name ?? null, useNumber: run.hardwareUseNumber ?? null, lotCode: lot?.lotCode ?? null, gasketCondition: run.gasketCondition ?? null };
}

/** The studs each multi-stud (tensioner) step covered, with applied and residual load, onto the loaded steps. */
async function attachCovers(runId: number, steps: NormalisedRun['steps']): Promise<void> {
  const covers = await sequelize.query<{ step_order: number; position: number; applied_n: number; residual_n: number }>(
    `SELECT s.step_order, c.position, c.applied_n, c.residual_n FROM step_positions c JOIN tightening_steps s ON s.id = c.step_id
     WHERE c.run_id = ? ORDER BY s.step_order, c.position`,
    { type: QueryTypes.SELECT, replacements: [runId] },
  );
  const byOrder = new Map(steps.map((step) => [step.order, step]));
  for (const row of covers) {
    const step = byOrder.get(Number(row.step_order));
    if (!step) continue;
    (step.covers ??= []).push({ position: Number(row.position), appliedN: Number(row.applied_n), residualN: Number(row.residual_n) });
  }
}

/**
 * A run the viewer may see, with its steps and readings. Throws not_found when it does not exist
 * or is not the viewer's to see (the two are not told apart).
 */
export async function loadRun(user: SessionUser, runId: number): Promise<LoadedRun> {
  const scope = await runScope(user);
  const run = (await Run.findOne({
    where: { [Op.and]: [{ id: runId }, scope] },
    include: [
      { model: Joint, as: 'joint' },
      { model: Method, as: 'method' },
      { model: Lubricant, as: 'lubricant' },
      { model: User, as: 'operator', attributes: ['id', 'name'] },
      { model: Cohort, as: 'cohort', attributes: ['id', 'name'] },
    ],
  })) as RunWithParts | null;
  if (!run) throw new AppError('not_found', 'This run does not exist, or it is not yours to see.');
  const rows = await sequelize.query<{ step_order: number; pass_number: number; tightened: number; applied_torque_nm: number | null; applied_pressure_bar: number | null; time_s: number | null; position: number; load_n: number }>(
    `SELECT s.step_order, s.pass_number, s.position AS tightened, s.applied_torque_nm, s.applied_pressure_bar, s.time_s, r.position, r.load_n
     FROM tightening_steps s JOIN readings r ON r.step_id = s.id WHERE s.run_id = ? ORDER BY s.step_order, r.position`,
    { type: QueryTypes.SELECT, replacements: [runId] },
  );
  const steps: NormalisedRun['steps'] = [];
  for (const row of rows) {
    let step = steps[steps.length - 1];
    if (!step || step.order !== row.step_order) {
      step = { order: row.step_order, pass: row.pass_number, position: row.tightened, appliedTorqueNm: row.applied_torque_nm, appliedPressureBar: row.applied_pressure_bar, timeS: row.time_s, loadsN: new Array(run.studCount).fill(0) };
      steps.push(step);
    }
    step.loadsN[row.position - 1] = row.load_n;
  }
  await attachCovers(runId, steps);
  const comments = !seesFreeText(user) ? [] : await RunComment.findAll({ where: { runId }, include: [{ model: User, as: 'author', attributes: ['id', 'name'] }], order: [['createdAt', 'ASC']] });
  const method = run.method;
  const reviewer = run.reviewedById ? await User.findByPk(run.reviewedById, { attributes: ['id', 'name'] }) : null;
  const recorded = await jointAsRecorded(run.jointVersionId ?? null);
  const asRecorded = recorded?.snapshot ?? run.joint;
  return {
    header: {
      id: run.id,
      recordedAt: run.recordedAt.toISOString(),
      status: run.status,
      setAsideReason: run.setAsideReason,
      review: run.reviewReasons
        ? {
            reasons: JSON.parse(run.reviewReasons) as RunCheckReason[],
            decision: reviewer && run.reviewedAt ? { by: operatorLabel(user, reviewer), at: run.reviewedAt.toISOString(), note: seesFreeText(user) ? run.reviewNote : null } : null,
          }
        : null,
      source: run.source,
      notes: seesFreeText(user) ? run.notes : null,
      targetLoadN: run.targetLoadN,
      bandPercent: run.bandPercent,
      studCount: run.studCount,
      joint: {
        id: run.joint.id,
        name: asRecorded.name,
        nominalSize: asRecorded.nominalSize,
        pressureClass: asRecorded.pressureClass,
        studGrade: asRecorded.studGrade,
        gasketType: asRecorded.gasketType,
        thread: threadLabel(asRecorded),
        versionNumber: recorded?.versionNumber ?? null,
        // Versions made before gaskets were snapshotted carry none: the joint's current data stand in.
        gasket: gasketForStress(recorded?.snapshot.gasket ?? jointGasketOf(run.joint)),
      },
      method: {
        id: method.id,
        name: method.name,
        toolKind: method.toolKind,
        passPercents: passPercentsOf(method),
        checkPasses: method.checkPasses,
        passOrders: method.passes.map((p) => p.orderByStudCount[String(run.studCount)] ?? []),
      },
      lubricant: { id: run.lubricant.id, name: run.lubricant.name, nominalNutFactor: run.lubricant.nominalNutFactor },
      operator: { key: operatorKey(user, run.operator.id), label: operatorLabel(user, run.operator) },
      cohort: run.cohort ? { id: run.cohort.id, name: run.cohort.name } : null,
      hardware: await hardwareOf(run),
      tensionerRule: method.toolKind === 'hydraulic_tensioner' ? calculatorLtf(studDiameterM(asRecorded) * 1000, run.joint.clampLengthMm ?? null) : null,
    },
    run: { studCount: run.studCount, targetLoadN: run.targetLoadN, steps },
    comments: comments.map((c) => {
      const author = (c as RunComment & { author: User }).author;
      return { id: c.id, authorName: operatorLabel(user, author), body: c.body, createdAt: c.createdAt.toISOString() };
    }),
  };
}
