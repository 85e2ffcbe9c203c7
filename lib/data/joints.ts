import 'server-only';
import { fn, col, UniqueConstraintError } from 'sequelize';
import { nextVersion } from './optimistic-lock';
import { recordJointVersion } from './joint-versions';
import { forgetMethodAnalyses } from './runs/stored-analysis';
import { refreshGasketFigures } from './runs/gasket-figures';
import { AppError } from '@/lib/http/errors';
import type { JointInput } from '@/lib/joints/joint-input';
import { jointGasketOf, type JointGasket } from '@/lib/joints/gasket-input';
import { loggerLineColumns, loggerLineFromColumns } from '@/lib/joints/logger-line-input';
import type { LoggerLineFormat } from '@/lib/ingest/logger-line';
import { gradeIdOf, gradeStoredName, threadSpecOf } from '@/lib/joints/joint-properties';
import type { LubricantInput, MethodInput } from '@/lib/joints/method-input';
import type { ThreadSpec } from '@/lib/calc/thread';
import type { GradeId } from '@/lib/calc/grades';
import { Joint, JointPosition, Lubricant, Method, Run, sequelize } from '@/models';
import type { MethodPass, TensionerCoverage, ToolKind } from '@/models/method';
import type { Role } from '@/models/user';
import { assertRole, type SessionUser } from '../auth/session';

/**
 * The joint library: joints (with positions and calibration), methods (orders per pass) and
 * lubricants. The library is shared by the whole centre; only instructors and admins may read or
 * change it (PRODUCT.md, Joints), so every function checks the role of the user it is given.
 */
export const JOINT_LIBRARY_ROLES: readonly Role[] = ['instructor', 'admin'];

export interface JointSummary {
  id: number;
  name: string;
  nominalSize: string;
  pressureClass: string;
  studCount: number;
  thread: ThreadSpec;
  studGrade: string;
  targetLoadN: number;
  bandPercent: number;
  runCount: number;
  /** Sent back by the edit form (optimistic locking). */
  version: number;
}

export interface JointDetail extends JointSummary {
  gradeId: GradeId | null;
  nutGrade: string | null;
  washer: string | null;
  gasketType: string;
  notes: string | null;
  positions: { position: number; calibrationFactor: number; note: string | null; channel: string | null }[];
  gasket: JointGasket;
  loggerLine: LoggerLineFormat;
}

export interface MethodSummary {
  id: number;
  name: string;
  toolKind: ToolKind;
  passes: MethodPass[];
  checkPasses: number;
  /** How many studs the tool set pulls at once (lib/calc/tensioner-coverage.ts). */
  tensionerCoverage: TensionerCoverage;
  notes: string | null;
  runCount: number;
  version: number;
}

export interface LubricantSummary {
  id: number;
  name: string;
  nominalNutFactor: number;
  notes: string | null;
  runCount: number;
  version: number;
}

export interface JointLibrary {
  joints: JointSummary[];
  methods: MethodSummary[];
  lubricants: LubricantSummary[];
}

async function runCounts(column: 'jointId' | 'methodId' | 'lubricantId'): Promise<Map<number, number>> {
  const rows = (await Run.findAll({
    attributes: [column, [fn('COUNT', col('id')), 'n']],
    group: [column],
    raw: true,
  })) as unknown as Record<string, number>[];
  return new Map(rows.map((r) => [Number(r[column]), Number(r.n)]));
}

const jointSummary = (j: Joint, runs: number): JointSummary => ({
  id: j.id,
  name: j.name,
  nominalSize: j.nominalSize,
  pressureClass: j.pressureClass,
  studCount: j.studCount,
  thread: threadSpecOf(j),
  studGrade: j.studGrade,
  targetLoadN: j.targetLoadN,
  bandPercent: j.bandPercent,
  runCount: runs,
  version: j.version,
});

const methodSummary = (m: Method, runs: number): MethodSummary => ({
  id: m.id,
  name: m.name,
  toolKind: m.toolKind,
  passes: m.passes,
  checkPasses: m.checkPasses,
  tensionerCoverage: m.tensionerCoverage,
  notes: m.notes ?? null,
  runCount: runs,
  version: m.version,
});

const lubricantSummary = (l: Lubricant, runs: number): LubricantSummary => ({
  id: l.id,
  name: l.name,
  nominalNutFactor: l.nominalNutFactor,
  notes: l.notes ?? null,
  runCount: runs,
  version: l.version,
});

/** Everything the /joints page lists, with how many runs use each entry. */
export async function listJointLibrary(user: SessionUser): Promise<JointLibrary> {
  assertRole(user, JOINT_LIBRARY_ROLES);
  const [joints, methods, lubricants, jointRuns, methodRuns, lubricantRuns] = await Promise.all([
    Joint.findAll({ order: [['name', 'ASC']] }),
    Method.findAll({ order: [['name', 'ASC']] }),
    Lubricant.findAll({ order: [['name', 'ASC']] }),
    runCounts('jointId'),
    runCounts('methodId'),
    runCounts('lubricantId'),
  ]);
  return {
    joints: joints.map((j) => jointSummary(j, jointRuns.get(j.id) ?? 0)),
    methods: methods.map((m) => methodSummary(m, methodRuns.get(m.id) ?? 0)),
    lubricants: lubricants.map((l) => lubricantSummary(l, lubricantRuns.get(l.id) ?? 0)),
  };
}

/** The stud counts of the joints in the library, ascending (the method form offers an order for each). */
export async function libraryStudCounts(user: SessionUser): Promise<number[]> {
  assertRole(user, JOINT_LIBRARY_ROLES);
  const rows = (await Joint.findAll({ attributes: ['studCount'], group: ['studCount'], raw: true })) as unknown as { studCount: number }[];
  return rows.map((r) => Number(r.studCount)).sort((a, b) => a - b);
}

/** One joint with its positions, or null when there is none with this id. */
export async function getJoint(user: SessionUser, id: number): Promise<JointDetail | null> {
  assertRole(user, JOINT_LIBRARY_ROLES);
  const joint = await Joint.findByPk(id);
  if (!joint) return null;
  const [positions, runs] = await Promise.all([
    JointPosition.findAll({ where: { jointId: id }, order: [['position', 'ASC']] }),
    Run.count({ where: { jointId: id } }),
  ]);
  return {
    ...jointSummary(joint, runs),
    gradeId: gradeIdOf(joint.studGrade),
    nutGrade: joint.nutGrade ?? null,
    washer: joint.washer ?? null,
    gasketType: joint.gasketType,
    notes: joint.notes ?? null,
    positions: positions.map((p) => ({ position: p.position, calibrationFactor: p.calibrationFactor, note: p.note ?? null, channel: p.channel ?? null })),
    gasket: jointGasketOf(joint),
    loggerLine: loggerLineFromColumns(joint),
  };
}

export async function getMethod(user: SessionUser, id: number): Promise<MethodSummary | null> {
  assertRole(user, JOINT_LIBRARY_ROLES);
  const method = await Method.findByPk(id);
  if (!method) return null;
  return methodSummary(method, await Run.count({ where: { methodId: id } }));
}

export async function getLubricant(user: SessionUser, id: number): Promise<LubricantSummary | null> {
  assertRole(user, JOINT_LIBRARY_ROLES);
  const lubricant = await Lubricant.findByPk(id);
  if (!lubricant) return null;
  return lubricantSummary(lubricant, await Run.count({ where: { lubricantId: id } }));
}

const jointColumns = (input: JointInput) => ({
  name: input.name,
  nominalSize: input.nominalSize,
  pressureClass: input.pressureClass,
  studCount: input.studCount,
  threadSystem: input.thread.system,
  threadDiameter: input.thread.system === 'inch' ? input.thread.diameterIn : input.thread.diameterMm,
  threadPitch: input.thread.system === 'inch' ? input.thread.threadsPerInch : input.thread.pitchMm,
  studGrade: gradeStoredName(input.studGrade),
  nutGrade: input.nutGrade,
  washer: input.washer,
  gasketType: input.gasketType,
  targetLoadN: input.targetLoadN,
  bandPercent: input.bandPercent,
  notes: input.notes,
  gasketInnerMm: input.gasket.innerMm,
  gasketOuterMm: input.gasket.outerMm,
  gasketAreaMm2: input.gasket.areaMm2,
  gasketMinSeatingMpa: input.gasket.minSeatingMpa,
  gasketMaxMpa: input.gasket.maxMpa,
  gasketStressSource: input.gasket.stressSource,
  flangeFacing: input.gasket.flangeFacing,
  clampLengthMm: input.gasket.clampLengthMm,
  ...(input.loggerLine ? loggerLineColumns(input.loggerLine) : {}),
});

/**
 * Creates (id null) or updates a joint and all its positions in one transaction: either both are
 * stored or neither. A joint with runs keeps its stud count (its runs' readings are per position);
 * a new target applies to new runs only (each run keeps the target it was recorded with).
 * @throws AppError `forbidden` for a role outside instructor/admin, `not_found` for an unknown id,
 * `conflict` (field studCount) for a stud count change on a joint with runs.
 */
export async function saveJoint(user: SessionUser, id: number | null, input: JointInput, sentVersion?: unknown): Promise<{ id: number }> {
  assertRole(user, JOINT_LIBRARY_ROLES);
  if (input.positions.length !== input.studCount || input.positions.some((p, i) => p.position !== i + 1)) {
    throw new AppError('invalid_input', 'Every position from 1 to the stud count needs a row.', { field: 'positions' });
  }
  return sequelize.transaction(async (transaction) => {
    let jointId: number;
    if (id === null) {
      const created = await Joint.create(jointColumns(input), { transaction });
      jointId = created.id;
    } else {
      const joint = await Joint.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });
      if (!joint) throw new AppError('not_found', 'There is no joint with this id; it may have been removed.');
      const version = nextVersion(joint.version, sentVersion);
      if (joint.studCount !== input.studCount) {
        const runs = await Run.count({ where: { jointId: id }, transaction });
        if (runs > 0) {
          throw new AppError(
            'conflict',
            `This joint has ${runs} run${runs === 1 ? '' : 's'} recorded on its ${joint.studCount} studs, so its stud count cannot change. Create a new joint for ${input.studCount} studs instead.`,
            { field: 'studCount' },
          );
        }
      }
      await joint.update({ ...jointColumns(input), version }, { transaction });
      await JointPosition.destroy({ where: { jointId: id }, transaction });
      jointId = id;
    }
    await JointPosition.bulkCreate(
      input.positions.map((p) => ({ jointId, position: p.position, calibrationFactor: p.calibrationFactor, note: p.note, channel: p.channel ?? null })),
      { transaction },
    );
    await recordJointVersion(jointId, transaction);
    // Runs pinned to versions made before gaskets were snapshotted follow the joint's current gasket data.
    if (id !== null) await refreshGasketFigures(sequelize, { unsnapshottedOfJoint: jointId, touch: true }, transaction);
    return { id: jointId };
  });
}

function nameTaken(error: unknown, what: string, name: string): never {
  if (error instanceof UniqueConstraintError) {
    throw new AppError('conflict', `A ${what} called "${name}" already exists. Choose another name.`, { field: 'name' });
  }
  throw error;
}

/** Creates or updates a method (one row, one transaction). */
export async function saveMethod(user: SessionUser, id: number | null, input: MethodInput, sentVersion?: unknown): Promise<{ id: number }> {
  assertRole(user, JOINT_LIBRARY_ROLES);
  try {
    return await sequelize.transaction(async (transaction) => {
      if (id === null) return { id: (await Method.create(input, { transaction })).id };
      const method = await Method.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });
      if (!method) throw new AppError('not_found', 'There is no method with this id; it may have been removed.');
      await method.update({ ...input, version: nextVersion(method.version, sentVersion) }, { transaction });
      // The stored analyses of its runs name each pass's % of target: analysed again on request.
      await forgetMethodAnalyses(id, transaction);
      return { id };
    });
  } catch (error) {
    return nameTaken(error, 'method', input.name);
  }
}

/** Creates or updates a lubricant (one row, one transaction). */
export async function saveLubricant(user: SessionUser, id: number | null, input: LubricantInput, sentVersion?: unknown): Promise<{ id: number }> {
  assertRole(user, JOINT_LIBRARY_ROLES);
  try {
    return await sequelize.transaction(async (transaction) => {
      if (id === null) return { id: (await Lubricant.create(input, { transaction })).id };
      const lubricant = await Lubricant.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });
      if (!lubricant) throw new AppError('not_found', 'There is no lubricant with this id; it may have been removed.');
      await lubricant.update({ ...input, version: nextVersion(lubricant.version, sentVersion) }, { transaction });
      return { id };
    });
  } catch (error) {
    return nameTaken(error, 'lubricant', input.name);
  }
}
