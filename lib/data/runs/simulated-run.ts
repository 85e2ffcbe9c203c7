import 'server-only';
import { z } from 'zod';
import { resolveRunHeader } from '@/lib/data/record';
import { sequelize } from '@/lib/platform/db';
import { AppError } from '@/lib/http/errors';
import { runHeaderSchema } from '@/lib/record/run-header-schema';
import type { SessionUser } from '@/lib/auth/session';
import { simulateRun, type SimTool } from '@/lib/sim/simulate-run';
import { Joint, Lubricant, Method } from '@/models';
import { storeRun } from './store-run';

export const simulatedRunSchema = z.object({
  header: runHeaderSchema,
  gasket: z.enum(['soft', 'medium', 'stiff'], { message: 'Choose how stiff the gasket is.' }),
  seed: z.coerce.number({ message: 'The seed must be a whole number.' }).int('The seed must be a whole number.').min(1, 'The seed must be at least 1.').max(2 ** 31 - 1, 'The seed is too large.'),
});

/**
 * The stud-to-stud scatter of K the simulator draws for a lubricant, from its nominal K: drier,
 * higher-K conditions scatter more. Invented model values in the spirit of docs/REFERENCE.md §5
 * (torque dry ±35 %, lubricated ±25 % ✓ [SPRING]); not measurements.
 */
export function kScatterFor(nominalK: number): number {
  return nominalK >= 0.18 ? 0.1 : nominalK >= 0.14 ? 0.06 : 0.05;
}

const TOOL: Record<string, SimTool> = {
  manual_torque_wrench: 'manual_torque_wrench',
  hydraulic_torque_wrench: 'hydraulic_torque_wrench',
  hydraulic_tensioner: 'hydraulic_tensioner',
  other: 'manual_torque_wrench',
};

/**
 * Simulates one run of the chosen joint, method and lubricant with the tightening simulator
 * (lib/sim, see MODEL.md) and stores it as an ordinary run (source 'simulated') in one transaction.
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
  const studCount = joint.studCount;
  const passes = method.passes.map((pass, index) => {
    const order = pass.orderByStudCount[String(studCount)];
    if (!order) throw new AppError('invalid_input', `The method "${method.name}" has no stud order for ${studCount} studs in pass ${index + 1}. Add one on the Joints page.`, { field: 'methodId', fieldErrors: { methodId: [`No order for ${studCount} studs in pass ${index + 1}.`] } });
    return { percentOfTarget: pass.percentOfTarget, order: [...order] };
  });
  const diameterM = joint.threadSystem === 'inch' ? joint.threadDiameter * 0.0254 : joint.threadDiameter / 1000;
  const { run } = simulateRun({
    studCount,
    targetLoadN: joint.targetLoadN,
    studDiameterM: diameterM,
    method: { tool: TOOL[method.toolKind] ?? 'manual_torque_wrench', passes, checkPasses: method.checkPasses },
    lubricant: { nominalK: lubricant.nominalNutFactor, kScatterCv: kScatterFor(lubricant.nominalNutFactor), runToRunCv: 0.03 },
    gasketStiffness: gasket,
    seed,
  });
  const header = { ...resolved.header, notes: [resolved.header.notes, `Simulated on the record page: seed ${seed}, ${gasket} gasket (Evenload training simulator).`].filter(Boolean).join(' ') };
  const runId = await sequelize.transaction((transaction) => storeRun(header, run, transaction));
  return { runId, stepCount: run.steps.length };
}
