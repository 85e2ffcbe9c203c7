import 'server-only';
import { z } from 'zod';
import { resolveRunHeader } from '@/lib/data/record';
import { AppError } from '@/lib/http/errors';
import { runHeaderSchema } from '@/lib/record/run-header-schema';
import type { SessionUser } from '@/lib/auth/session';
import { studDiameterM } from '@/lib/joints/joint-properties';
import { coverageNeedsEvenStuds, lubricantForSim, methodForSim, passWithoutOrder, simulateLibraryRun } from '@/lib/sim/from-library';
import { Joint, Lubricant, Method, Run, sequelize } from '@/models';
import { runScope } from '@/lib/data/scope';
import type { RunStatus } from '@/models/run';
import type { RunCheckReason } from '@/lib/run-check/types';
import { Op, UniqueConstraintError } from 'sequelize';
import { storeRunWithStatus } from './store-run';
import { simulationKey } from './simulation-key';

export const simulatedRunSchema = z.object({
  header: runHeaderSchema,
  gasket: z.enum(['soft', 'medium', 'stiff'], { message: 'Choose how stiff the gasket is.' }),
  seed: z.coerce.number({ message: 'The seed must be a whole number.' }).int('The seed must be a whole number.').min(1, 'The seed must be at least 1.').max(2 ** 31 - 1, 'The seed is too large.'),
});

export interface SimulatedRunResult {
  runId: number;
  stepCount: number;
  status: RunStatus;
  reasons: RunCheckReason[];
  /** True when this request was stored before (same header, gasket and seed): nothing new was stored. */
  alreadyStored: boolean;
}

/**
 * The run stored for this key, when there is one. Named only to someone who may see it (as an
 * upload's duplicate); anyone else gets a 409 saying it was stored before.
 */
async function storedSimulation(user: SessionUser, key: string): Promise<SimulatedRunResult | null> {
  const run = await Run.findOne({ where: { simulationKey: key }, attributes: ['id', 'stepCount', 'status', 'reviewReasons'] });
  if (!run) return null;
  const visible = (await Run.count({ where: { [Op.and]: [await runScope(user), { id: run.id }] } })) > 0;
  if (!visible) throw new AppError('conflict', 'This simulation (same joint, method, lubricant, operator, cohort, gasket and seed) is already stored; it is not stored twice.', { field: 'seed' });
  const reasons = run.reviewReasons ? (JSON.parse(run.reviewReasons) as RunCheckReason[]) : [];
  return { runId: run.id, stepCount: run.stepCount, status: run.status, reasons, alreadyStored: true };
}

/**
 * Simulates one run of the chosen joint, method and lubricant through the library adapter
 * (lib/sim/from-library.ts, the same as the Classroom's: same rows, gasket and seed, same run) and
 * stores it as an ordinary run (source 'simulated') in one transaction. Idempotent per header and
 * seed: the same request again stores nothing and answers with the run stored the first time
 * (`alreadyStored`); the unique `runs.simulation_key` settles two requests at once.
 */
export async function saveSimulatedRun(user: SessionUser, input: unknown): Promise<SimulatedRunResult> {
  const parsed = simulatedRunSchema.safeParse(input);
  if (!parsed.success) {
    const fieldErrors = parsed.error.flatten().fieldErrors as Record<string, string[] | undefined>;
    throw new AppError('invalid_input', parsed.error.issues[0]?.message ?? 'The simulation settings are not valid.', { fieldErrors });
  }
  const { header: headerInput, gasket, seed } = parsed.data;
  const resolved = await resolveRunHeader(user, headerInput, 'simulated', 'complete');
  const [joint, method, lubricant] = await Promise.all([
    Joint.findByPk(resolved.header.jointId),
    Method.findByPk(resolved.header.methodId),
    Lubricant.findByPk(resolved.header.lubricantId),
  ]);
  if (!joint || !method || !lubricant) throw new AppError('not_found', 'The joint, method or lubricant no longer exists.');
  const key = simulationKey({ joint, method, lubricant, operatorId: resolved.header.operatorId, cohortId: resolved.header.cohortId, gasket, seed });
  const before = await storedSimulation(user, key);
  if (before) return before;
  const missing = passWithoutOrder(method, joint.studCount);
  if (missing !== null) {
    throw new AppError('invalid_input', `The method "${method.name}" has no stud order for ${joint.studCount} studs in pass ${missing}. Add one on the Joints page.`, {
      field: 'methodId',
      fieldErrors: { methodId: [`No order for ${joint.studCount} studs in pass ${missing}.`] },
    });
  }
  if (coverageNeedsEvenStuds(method, joint.studCount)) {
    const message = `The method "${method.name}" puts a tensioner on every second stud, which needs an even number of studs; this joint has ${joint.studCount}.`;
    throw new AppError('invalid_input', message, { field: 'methodId', fieldErrors: { methodId: [message] } });
  }
  const { run } = simulateLibraryRun({
    joint: { studCount: joint.studCount, targetLoadN: joint.targetLoadN, studDiameterM: studDiameterM(joint) },
    method: methodForSim(method, joint.studCount),
    lubricant: lubricantForSim(lubricant),
    gasketStiffness: gasket,
    seed,
  });
  const header = {
    ...resolved.header,
    simulationKey: key,
    notes: [resolved.header.notes, `Simulated on the record page: seed ${seed}, ${gasket} gasket (Evenload training simulator).`].filter(Boolean).join(' '),
  };
  try {
    const stored = await sequelize.transaction((transaction) => storeRunWithStatus(header, run, transaction));
    return { ...stored, stepCount: run.steps.length, alreadyStored: false };
  } catch (error) {
    // The same request twice at once: the unique key decides, the other answers with the stored run.
    if (error instanceof UniqueConstraintError || (error as { parent?: { errno?: number } })?.parent?.errno === 1062) {
      const stored = await storedSimulation(user, key);
      if (stored) return stored;
    }
    throw error;
  }
}
