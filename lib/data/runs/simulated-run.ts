import 'server-only';
import { z } from 'zod';
import { resolveRunHeader } from '@/lib/data/record';
import { AppError } from '@/lib/http/errors';
import { runHeaderSchema } from '@/lib/record/run-header-schema';
import type { SessionUser } from '@/lib/auth/session';
import { studDiameterM } from '@/lib/joints/joint-properties';
import { lubricantForSim, methodForSim, passWithoutOrder, simulateLibraryRun } from '@/lib/sim/from-library';
import { Joint, Lubricant, Method, sequelize } from '@/models';
import { storeRun } from './store-run';

export const simulatedRunSchema = z.object({
  header: runHeaderSchema,
  gasket: z.enum(['soft', 'medium', 'stiff'], { message: 'Choose how stiff the gasket is.' }),
  seed: z.coerce.number({ message: 'The seed must be a whole number.' }).int('The seed must be a whole number.').min(1, 'The seed must be at least 1.').max(2 ** 31 - 1, 'The seed is too large.'),
});

/**
 * Simulates one run of the chosen joint, method and lubricant through the library adapter
 * (lib/sim/from-library.ts, the same as the Classroom's: same rows, gasket and seed, same run) and
 * stores it as an ordinary run (source 'simulated') in one transaction.
 */
export async function saveSimulatedRun(user: SessionUser, input: unknown): Promise<{ runId: number; stepCount: number }> {
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
  const missing = passWithoutOrder(method, joint.studCount);
  if (missing !== null) {
    throw new AppError('invalid_input', `The method "${method.name}" has no stud order for ${joint.studCount} studs in pass ${missing}. Add one on the Joints page.`, {
      field: 'methodId',
      fieldErrors: { methodId: [`No order for ${joint.studCount} studs in pass ${missing}.`] },
    });
  }
  const { run } = simulateLibraryRun({
    joint: { studCount: joint.studCount, targetLoadN: joint.targetLoadN, studDiameterM: studDiameterM(joint) },
    method: methodForSim(method, joint.studCount),
    lubricant: lubricantForSim(lubricant),
    gasketStiffness: gasket,
    seed,
  });
  const header = { ...resolved.header, notes: [resolved.header.notes, `Simulated on the record page: seed ${seed}, ${gasket} gasket (Evenload training simulator).`].filter(Boolean).join(' ') };
  const runId = await sequelize.transaction((transaction) => storeRun(header, run, transaction));
  return { runId, stepCount: run.steps.length };
}
