import type { JointForImport } from '@/lib/ingest/normalise';
import type { LoggerLineFormat, MalformedLine } from '@/lib/ingest/logger-line';
import type { ClockRestart } from '@/lib/ingest/logger-clock';
import type { StreamReading } from '@/lib/record/stream-reading';

/**
 * What the page sends the serial worker: the joint's format and the run's last stored time (readings
 * of a restarted logger clock continue after it), then raw bytes as they arrive, then the end.
 */
export type SerialWorkerRequest =
  | { type: 'start'; format: LoggerLineFormat; joint: JointForImport; lastStoredS: number | null }
  | { type: 'bytes'; bytes: Uint8Array }
  | { type: 'end' };

/** What the serial worker answers: readings and malformed lines of each chunk, or why it cannot read at all. */
export type SerialWorkerResponse =
  | { type: 'batch'; readings: StreamReading[]; malformed: MalformedLine[]; clockRestarts: ClockRestart[]; ended: boolean }
  | { type: 'error'; message: string };
