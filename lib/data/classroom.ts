import 'server-only';
import { Op } from 'sequelize';
import { AppError } from '../http/errors';
import { sceneSetup, seedFamily, simulateSide, SCENES, type Library, type SceneKey } from '../classroom/scenes';
import { studDiameterM } from '../joints/joint-properties';
import { gasketForStress, jointGasketOf } from '../joints/gasket-input';
import { currentCohortOf } from '../cohorts/current-cohort';
import { storeRun as storeRunInDb } from './runs/store-run';
import { assertRole, type SessionUser } from '../auth/session';
import { Cohort, Joint, Lubricant, Method, Run, User, sequelize } from '@/models';
import { operatorLabel, runScope } from './scope';

/** Who may open the classroom and save its runs. */
export const CLASSROOM_ROLES = ['instructor'] as const;

export interface ClassroomCohort {
  id: number;
  name: string;
  startsOn: string;
  endsOn: string;
}

export interface ClassroomRunOption {
  id: number;
  label: string;
  source: string;
  cohortId: number | null;
}

/** Joints, methods and lubricants of the library, as the scenes need them. */
export async function classroomLibrary(user: SessionUser): Promise<Library> {
  assertRole(user, CLASSROOM_ROLES);
  const [joints, methods, lubricants] = await Promise.all([
    Joint.findAll({ order: [['studCount', 'ASC'], ['id', 'ASC']] }),
    Method.findAll({ order: [['id', 'ASC']] }),
    Lubricant.findAll({ order: [['id', 'ASC']] }),
  ]);
  return {
    joints: joints.map((j) => ({ id: j.id, name: j.name, studCount: j.studCount, targetLoadN: j.targetLoadN, bandPercent: j.bandPercent, studDiameterM: studDiameterM(j), gasket: gasketForStress(jointGasketOf(j)) })),
    methods: methods.map((m) => ({
      id: m.id,
      name: m.name,
      toolKind: m.toolKind,
      checkPasses: m.checkPasses,
      tensionerCoverage: m.tensionerCoverage,
      passes: m.passes.map((p) => ({ percentOfTarget: p.percentOfTarget, pattern: p.pattern, orderByStudCount: p.orderByStudCount })),
    })),
    lubricants: lubricants.map((l) => ({ id: l.id, name: l.name, nominalNutFactor: l.nominalNutFactor })),
  };
}

/** The instructor's own cohorts, the current one (lib/cohorts/current-cohort.ts, as Home calls it) first. */
export async function classroomCohorts(user: SessionUser, today = new Date().toISOString().slice(0, 10)): Promise<ClassroomCohort[]> {
  assertRole(user, CLASSROOM_ROLES);
  const rows = await Cohort.findAll({ where: { instructorId: user.id }, order: [['startsOn', 'DESC'], ['id', 'DESC']], raw: true });
  const cohorts = rows.map((c) => ({ id: c.id, name: c.name, startsOn: String(c.startsOn).slice(0, 10), endsOn: String(c.endsOn).slice(0, 10) }));
  const current = cohorts.indexOf(currentCohortOf(cohorts, today)!);
  if (current > 0) cohorts.unshift(...cohorts.splice(current, 1));
  return cohorts;
}

/**
 * Complete measured runs (never simulated ones) the instructor may see in their cohorts, latest
 * first (at most 40), for the "real run" scene. `defaultRunId` is the latest of the current
 * cohort, else the latest.
 */
export async function classroomRealRuns(user: SessionUser, cohorts: readonly ClassroomCohort[]): Promise<{ runs: ClassroomRunOption[]; defaultRunId: number | null }> {
  assertRole(user, CLASSROOM_ROLES);
  const scope = await runScope(user);
  const rows = (await Run.findAll({
    where: { [Op.and]: [scope, { status: 'complete' }, { cohortId: { [Op.ne]: null } }, { source: { [Op.ne]: 'simulated' } }, { stepCount: { [Op.gt]: 0 } }] },
    include: [{ model: User, as: 'operator', attributes: ['id', 'name'] }, { model: Joint, as: 'joint', attributes: ['id', 'name'] }],
    order: [['recordedAt', 'DESC'], ['id', 'DESC']],
    limit: 40,
  })) as (Run & { operator: User; joint: Joint })[];
  const runs = rows.map((r) => ({
    id: r.id,
    source: r.source,
    cohortId: r.cohortId,
    label: `${operatorLabel(user, r.operator)} · ${r.recordedAt.toISOString().slice(0, 10)} · ${r.joint.name}`,
  }));
  const currentId = cohorts[0]?.id;
  const pick = runs.find((r) => r.cohortId === currentId) ?? runs[0];
  return { runs, defaultRunId: pick?.id ?? null };
}

export interface SaveSceneInput {
  scene: Exclude<SceneKey, 'real'>;
  jointId: number;
  cohortId: number;
  seed: number;
}

export interface SaveSceneResult {
  runIds: number[];
  compareHref: string;
}

/**
 * Saves a scene's simulated runs (every side, every seed of its family) to one of the
 * instructor's cohorts as ordinary runs — source 'simulated', operator = the instructor, the
 * library's joint, method and lubricant rows — in ONE transaction: all or nothing. The runs are
 * re-simulated here from (scene, joint, seed); nothing the browser computed is trusted.
 *
 * @throws AppError forbidden (role), not_found (cohort not theirs, or no such joint),
 *   invalid_input (a side has no library method or lubricant to point at).
 */
export async function saveSceneRuns(user: SessionUser | null, input: SaveSceneInput, deps: { storeRun?: typeof storeRunInDb; now?: Date } = {}): Promise<SaveSceneResult> {
  assertRole(user, CLASSROOM_ROLES);
  const cohort = await Cohort.findOne({ where: { id: input.cohortId, instructorId: user.id } });
  if (!cohort) throw new AppError('not_found', 'That cohort does not exist or is not yours: pick one of your own cohorts.', { field: 'cohortId' });
  const setup = sceneSetup(input.scene, await classroomLibrary(user), input.jointId);
  if (!setup) throw new AppError('not_found', 'That joint is not in the library: pick another joint.', { field: 'jointId' });
  if (setup.missing.length) {
    throw new AppError('invalid_input', `These runs need library rows to point at: ${setup.missing.join(' ')} Add them under Joints, then save again.`, { field: 'scene' });
  }
  const store = deps.storeRun ?? storeRunInDb;
  const recordedAt = deps.now ?? new Date();
  const runIds = await sequelize.transaction(async (transaction) => {
    const ids: number[] = [];
    for (const side of setup.sides) {
      for (const seed of seedFamily(input.seed)) {
        const run = simulateSide(side, setup.joint, seed);
        ids.push(
          await store(
            {
              jointId: setup.joint.id,
              methodId: side.methodId!,
              lubricantId: side.lubricantId!,
              operatorId: user.id,
              cohortId: cohort.id,
              targetLoadN: setup.joint.targetLoadN,
              bandPercent: setup.joint.bandPercent,
              source: 'simulated',
              status: 'complete',
              recordedAt,
              notes: `Classroom scene "${SCENES[input.scene].title}", ${side.label}, seed ${seed} (simulated by the Evenload model).`,
            },
            run,
            transaction,
          ),
        );
      }
    }
    return ids;
  });
  return { runIds, compareHref: compareHrefFor(input.scene, setup.sides, setup.joint.id, recordedAt) };
}

/** The /compare address that shows a saved scene's groups (methods or lubricants, this joint, that day). */
export function compareHrefFor(scene: Exclude<SceneKey, 'real'>, sides: readonly { methodId: number | null; lubricantId: number | null }[], jointId: number, day: Date): string {
  const by = SCENES[scene].compareBy ?? 'method';
  const ids = [...new Set(sides.map((s) => (by === 'lubricant' ? s.lubricantId : s.methodId)))].join(',');
  const date = day.toISOString().slice(0, 10);
  return `/compare?by=${by}&ids=${ids}&jointId=${jointId}&from=${date}&to=${date}`;
}
