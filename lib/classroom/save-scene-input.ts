import { z } from 'zod';

/** The save form's fields: the scene, the joint it ran on, the seed of its family and the cohort. */
export const saveSceneSchema = z.object({
  scene: z.enum(['passes', 'pattern', 'lube', 'tool'], { message: 'Pick a simulated scene to save.' }),
  jointId: z.coerce.number({ message: 'Pick a joint.' }).int().positive('Pick a joint.'),
  cohortId: z.coerce.number({ message: 'Pick one of your cohorts.' }).int().positive('Pick one of your cohorts.'),
  seed: z.coerce.number({ message: 'The seed must be a whole number.' }).int('The seed must be a whole number.').min(1).max(1_000_000_000),
});

export type SaveSceneFields = z.infer<typeof saveSceneSchema>;
