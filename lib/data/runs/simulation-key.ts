import { createHash } from 'node:crypto';

/** What makes two Simulate requests the same: the library rows (at their versions), who and where, the gasket and the seed. */
export interface SimulationKeyInput {
  joint: { id: number; version: number };
  method: { id: number; version: number };
  lubricant: { id: number; version: number };
  operatorId: number;
  cohortId: number | null;
  gasket: string;
  seed: number;
}

/**
 * The idempotency key of a simulated run: sha256 of the normalised request as JSON with its keys in
 * a fixed order. The recorded-at time and the notes are left out (they do not change the run the
 * simulator gives), the library rows' versions are in (an edited joint, method or lubricant gives
 * another run).
 */
export function simulationKey(input: SimulationKeyInput): string {
  const normalised = [
    ['joint', input.joint.id, input.joint.version],
    ['method', input.method.id, input.method.version],
    ['lubricant', input.lubricant.id, input.lubricant.version],
    ['operator', input.operatorId],
    ['cohort', input.cohortId],
    ['gasket', input.gasket],
    ['seed', input.seed],
  ];
  return createHash('sha256').update(JSON.stringify(normalised)).digest('hex');
}
