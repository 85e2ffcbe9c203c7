/**
 * One live reading as the stream endpoint takes it (`POST /api/runs/:id/stream`, newline-delimited
 * JSON): `{ t, stud, load }` in seconds, stud position and newtons. Browser-safe: the server checks
 * every reading with this schema, the Record page's serial worker and the bridge script make them.
 */
import { z } from 'zod';

/** Zod schema of one reading (the server's check). */
export const streamReadingSchema = z.object({ t: z.number().finite().min(0), stud: z.number().int().min(1), load: z.number().finite() }).strict();

/** One live reading: seconds, stud position, newtons. */
export type StreamReading = z.output<typeof streamReadingSchema>;

/** How far below zero a streamed load may read (gauge noise), as a share of the target: 5 %. Our own choice. */
export const STREAM_NEGATIVE_FLOOR_SHARE = 0.05;

/** A batch as the endpoint's body: one reading per line. */
export function streamBody(readings: readonly StreamReading[]): string {
  return readings.map((r) => JSON.stringify(r)).join('\n') + '\n';
}
