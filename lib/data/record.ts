import 'server-only';
import { createHash } from 'node:crypto';
import { QueryTypes, type Transaction } from 'sequelize';
import { AppError } from '@/lib/http/errors';
import { maxBelievableStudLoad, STUD_YOUNGS_MODULUS_PA, tensileStressAreaM2Of } from '@/lib/joints/joint-properties';
import type { JointForImport } from '@/lib/ingest/normalise';
import type { ChannelMap } from '@/lib/ingest/channel-map';
import { columnMappingSchema, type ColumnMapping } from '@/lib/ingest/shapes';
import { runHeaderSchema, recordedAtDate, type RunHeaderFields } from '@/lib/record/run-header-schema';
import type { RunHeader } from '@/lib/data/runs/store-run';
import { jointForImport } from '@/lib/record/joint-import';
import { loggerLineFromColumns } from '@/lib/joints/logger-line-input';
import type { LoggerLineFormat } from '@/lib/ingest/logger-line';
import type { RunSource, RunStatus } from '@/models/run';
import type { MethodPass, TensionerCoverage, ToolKind } from '@/models/method';
import { Cohort, CohortMember, HardwareSet, Joint, JointPosition, Lubricant, LubricantLot, Method, User, sequelize } from '@/models';
import type { SessionUser } from '../auth/session';
import { taughtCohortIds } from './scope';
import { formatDecimals } from '@/lib/calc/units';

/** Who may record runs, and as whom: see {@link allowedOperatorIds}. */
export const RECORD_ROLES = ['instructor', 'researcher', 'trainee'] as const;

export interface RecordJoint {
  id: number;
  name: string;
  studCount: number;
  targetLoadN: number;
  bandPercent: number;
  maxStudLoadN: number;
  maxStudLoadSource: string;
  /** Per-position calibration factors (index 0 = position 1). */
  calibration: number[];
  /** The logger channel wired to each position, where one is set (default channel k = position k). */
  channelMap?: ChannelMap;
  /** Tensile stress area of the studs in m² (lib/calc), for microstrain files; null when the thread is not valid. */
  stressAreaM2: number | null;
  /** Young's modulus used for microstrain files, Pa. */
  youngsModulusPa: number;
  /** How the logger's live lines look (Connect logger on Stream live). */
  loggerLine: LoggerLineFormat;
}

export interface RecordMethod {
  id: number;
  name: string;
  passes: MethodPass[];
  checkPasses: number;
  toolKind: ToolKind;
  /** How many studs the tool set pulls at once (lib/calc/tensioner-coverage.ts). */
  tensionerCoverage: TensionerCoverage;
}

const recordMethod = (m: Method): RecordMethod => ({ id: m.id, name: m.name, passes: m.passes, checkPasses: m.checkPasses, toolKind: m.toolKind, tensionerCoverage: m.tensionerCoverage });

export interface RecordOption {
  id: number;
  name: string;
}

export interface RecordCohort extends RecordOption {
  startsOn: string;
  endsOn: string;
}

export interface RecordOperator extends RecordOption {
  /** Cohorts this operator may be recorded in by this viewer. */
  cohortIds: number[];
}

export interface RememberedMapping {
  jointId: number;
  headerSignature: string;
  /** The trimmed header names the mapping was saved for. */
  headers: string[];
  mapping: ColumnMapping;
}

export interface RecordOptions {
  joints: RecordJoint[];
  methods: RecordMethod[];
  lubricants: RecordOption[];
  cohorts: RecordCohort[];
  operators: RecordOperator[];
  rememberedMappings: RememberedMapping[];
  /** Hardware sets with their use count so far, and lubricant lots with their lubricant. */
  hardwareSets: (RecordOption & { useCount: number })[];
  lubricantLots: (RecordOption & { lubricantId: number })[];
}

/** A joint as Record and the importer see it (also used to recompute a run from its kept file). */
export function jointDto(joint: Joint, positions: JointPosition[]): RecordJoint {
  const limit = maxBelievableStudLoad(joint);
  const calibration = Array.from({ length: joint.studCount }, (_, i) => positions.find((p) => p.position === i + 1)?.calibrationFactor ?? 1);
  const channelMap = positions.flatMap((p) => (p.channel && p.position <= joint.studCount ? [{ channel: p.channel, position: p.position }] : []));
  return {
    id: joint.id,
    name: joint.name,
    studCount: joint.studCount,
    targetLoadN: joint.targetLoadN,
    bandPercent: joint.bandPercent,
    maxStudLoadN: limit.maxStudLoadN,
    maxStudLoadSource: limit.source,
    calibration,
    channelMap,
    stressAreaM2: tensileStressAreaM2Of(joint),
    youngsModulusPa: STUD_YOUNGS_MODULUS_PA,
    loggerLine: loggerLineFromColumns(joint),
  };
}

/** Operators this person may record as, with the cohorts each may be recorded in. */
async function allowedOperators(user: SessionUser): Promise<RecordOperator[]> {
  if (user.role === 'instructor') {
    const cohortIds = await taughtCohortIds(user);
    const members = cohortIds.length ? await CohortMember.findAll({ where: { cohortId: cohortIds }, raw: true }) : [];
    const users = await User.findAll({ where: { id: [...new Set([user.id, ...members.map((m) => m.userId)])], isActive: true }, attributes: ['id', 'name'] });
    return users
      .map((u) => ({ id: u.id, name: u.name, cohortIds: u.id === user.id ? cohortIds : members.filter((m) => m.userId === u.id).map((m) => m.cohortId) }))
      .sort((a, b) => (a.id === user.id ? -1 : b.id === user.id ? 1 : a.name.localeCompare(b.name)));
  }
  if (user.role === 'trainee') {
    const memberships = await CohortMember.findAll({ where: { userId: user.id }, raw: true });
    return [{ id: user.id, name: user.name, cohortIds: memberships.map((m) => m.cohortId) }];
  }
  if (user.role === 'researcher') return [{ id: user.id, name: user.name, cohortIds: [] }];
  return [];
}

/** Everything the record page offers: joints, methods, lubricants, cohorts and operators for this person. */
export async function recordOptions(user: SessionUser): Promise<RecordOptions> {
  const [joints, positions, methods, lubricants, operators, maps] = await Promise.all([
    Joint.findAll({ order: [['name', 'ASC']] }),
    JointPosition.findAll(),
    Method.findAll({ order: [['name', 'ASC']] }),
    Lubricant.findAll({ attributes: ['id', 'name'], order: [['name', 'ASC']], raw: true }),
    allowedOperators(user),
    sequelize.query<{ joint_id: number; header_signature: string; headers: string; mapping: unknown }>('SELECT joint_id, header_signature, headers, mapping FROM column_maps', { type: QueryTypes.SELECT }),
  ]);
  const [hardwareSets, lots] = await Promise.all([
    HardwareSet.findAll({ attributes: ['id', 'name', 'useCount'], order: [['name', 'ASC']], raw: true }),
    LubricantLot.findAll({ attributes: ['id', 'lubricantId', 'lotCode'], order: [['lotCode', 'ASC']], raw: true }),
  ]);
  const cohortIds = [...new Set(operators.flatMap((o) => o.cohortIds))];
  const cohorts = cohortIds.length ? await Cohort.findAll({ where: { id: cohortIds }, attributes: ['id', 'name', 'startsOn', 'endsOn'], order: [['startsOn', 'DESC']] }) : [];
  return {
    joints: joints.map((j) => jointDto(j, positions.filter((p) => p.jointId === j.id))),
    methods: methods.map((m) => recordMethod(m)),
    lubricants,
    cohorts: cohorts.map((c) => ({ id: c.id, name: c.name, startsOn: String(c.startsOn).slice(0, 10), endsOn: String(c.endsOn).slice(0, 10) })),
    operators,
    hardwareSets: hardwareSets.map((h) => ({ id: h.id, name: h.name, useCount: h.useCount })),
    lubricantLots: lots.map((l) => ({ id: l.id, name: l.lotCode, lubricantId: l.lubricantId })),
    rememberedMappings: maps.flatMap((row) => {
      const parsed = columnMappingSchema.safeParse(typeof row.mapping === 'string' ? JSON.parse(row.mapping) : row.mapping);
      return parsed.success ? [{ jointId: Number(row.joint_id), headerSignature: row.header_signature, headers: JSON.parse(row.headers) as string[], mapping: parsed.data }] : [];
    }),
  };
}

/** A validated run header with the joint it is for, ready for storeRun. */
export interface ResolvedHeader {
  header: RunHeader;
  joint: RecordJoint;
  method: RecordMethod;
  jointImport: JointForImport;
}

/**
 * Validates a run header from a form or request (zod), then checks it against what this person may
 * do: trainees record only themselves; instructors record themselves or a member of a cohort they
 * teach, in that cohort; researchers record themselves. Unknown joint, method, lubricant or cohort
 * is a field error.
 *
 * @throws AppError('invalid_input') with `fieldErrors` naming the field; AppError('forbidden') for
 *   an operator this person may not record as.
 */
export async function resolveRunHeader(user: SessionUser, input: unknown, source: RunSource, status: RunStatus): Promise<ResolvedHeader> {
  const parsed = runHeaderSchema.safeParse(input);
  if (!parsed.success) {
    const fieldErrors = Object.fromEntries(parsed.error.issues.map((i) => [String(i.path[0] ?? 'header'), [i.message]]));
    throw new AppError('invalid_input', 'The run header is not complete: see the marked fields.', { field: Object.keys(fieldErrors)[0], fieldErrors });
  }
  const fields: RunHeaderFields = parsed.data;
  const fieldError = (field: string, message: string) => new AppError('invalid_input', message, { field, fieldErrors: { [field]: [message] } });
  const [joint, method, lubricant] = await Promise.all([Joint.findByPk(fields.jointId), Method.findByPk(fields.methodId), Lubricant.findByPk(fields.lubricantId)]);
  if (!joint) throw fieldError('jointId', 'That joint does not exist. Choose one from the list.');
  if (!method) throw fieldError('methodId', 'That method does not exist. Choose one from the list.');
  if (!lubricant) throw fieldError('lubricantId', 'That lubricant does not exist. Choose one from the list.');
  const operators = await allowedOperators(user);
  const operator = operators.find((o) => o.id === fields.operatorId);
  if (!operator) {
    throw new AppError('forbidden', user.role === 'trainee' ? 'Trainees record only their own runs: choose yourself as the operator.' : 'You may record runs only for yourself or members of the cohorts you teach.', {
      field: 'operatorId',
      fieldErrors: { operatorId: ['Choose an operator from the list.'] },
    });
  }
  if (fields.cohortId !== null && !operator.cohortIds.includes(fields.cohortId)) {
    throw fieldError('cohortId', 'That operator is not in this cohort (or it is not yours). Choose one of their cohorts, or none.');
  }
  await checkHardware(fields, lubricant.id, fieldError);
  const positions = await JointPosition.findAll({ where: { jointId: joint.id } });
  const dto = jointDto(joint, positions);
  return {
    joint: dto,
    method: recordMethod(method),
    jointImport: jointForImport(dto),
    header: {
      jointId: joint.id,
      methodId: method.id,
      lubricantId: lubricant.id,
      operatorId: operator.id,
      recordedById: user.id,
      cohortId: fields.cohortId,
      targetLoadN: joint.targetLoadN,
      bandPercent: joint.bandPercent,
      source,
      status,
      recordedAt: recordedAtDate(fields.recordedAt),
      notes: fields.notes,
      hardwareSetId: fields.hardwareSetId,
      lubricantLotId: fields.lubricantLotId,
      gasketCondition: fields.gasketCondition,
    },
  };
}

/** The header's hardware set exists, and its lubricant lot is a lot of the run's lubricant. */
async function checkHardware(fields: RunHeaderFields, lubricantId: number, fieldError: (field: string, message: string) => AppError): Promise<void> {
  if (fields.hardwareSetId !== null && !(await HardwareSet.findByPk(fields.hardwareSetId))) throw fieldError('hardwareSetId', 'That hardware set does not exist. Choose one from the list.');
  if (fields.lubricantLotId === null) return;
  const lot = await LubricantLot.findByPk(fields.lubricantLotId);
  if (!lot || lot.lubricantId !== lubricantId) throw fieldError('lubricantLotId', 'That lot is not a lot of the chosen lubricant. Choose one from the list, or none.');
}

/** sha256 of a file's trimmed header names joined by a newline: the key of a remembered mapping. */
export function headerSignature(headers: readonly string[]): string {
  return createHash('sha256').update(headers.map((h) => h.trim()).join('\n')).digest('hex');
}

/** Remembers (inserts or replaces) the mapping for this joint and header. */
export async function rememberMapping(user: SessionUser, jointId: number, headers: readonly string[], mapping: ColumnMapping, transaction: Transaction): Promise<void> {
  const now = new Date();
  await sequelize.query(
    `INSERT INTO column_maps (joint_id, header_signature, headers, mapping, saved_by_id, created_at, updated_at) VALUES (?,?,?,?,?,?,?)
     ON DUPLICATE KEY UPDATE mapping = VALUES(mapping), headers = VALUES(headers), saved_by_id = VALUES(saved_by_id), updated_at = VALUES(updated_at)`,
    { transaction, replacements: [jointId, headerSignature(headers), JSON.stringify(headers), JSON.stringify(mapping), user.id, now, now] },
  );
}

