import { z } from 'zod';

/** A run id in a URL: a positive whole number. */
export const runIdSchema = z.coerce.number({ message: 'must be a run number' }).int('must be a whole number').positive('must be a positive run number').max(2 ** 31);

export const runParamsSchema = z.object({ id: runIdSchema });
