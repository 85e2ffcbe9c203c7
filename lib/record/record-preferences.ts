import { z } from 'zod';

/** The ways a run gets in on the Record page, in tab order. */
export const WAYS_IN = ['upload', 'manual', 'stream', 'simulate'] as const;
export type WayIn = (typeof WAYS_IN)[number];

const id = z.coerce.number().int().positive().nullable().optional();

/**
 * What Record remembers per person (table `user_preferences`): the last way in and the header's
 * joint, method, lubricant and operator. The cohort is not remembered: it defaults to the current
 * cohort of the operator (lib/cohorts/current-cohort.ts), so an old course is never picked by habit.
 */
export const recordPreferencesSchema = z
  .object({
    wayIn: z.enum(WAYS_IN).nullable().optional(),
    header: z.object({ jointId: id, methodId: id, lubricantId: id, operatorId: id }).strict().optional(),
  })
  .strict();

export type RecordPreferences = z.infer<typeof recordPreferencesSchema>;
