/// <reference lib="webworker" />
/**
 * The serial logger's worker: decodes the bytes the page reads from the port (UTF-8, a character
 * split across two reads waits for the next) and runs the joint's line parser
 * (lib/ingest/logger-line.ts) on them, so a fast logger never blocks the page. Answers each chunk
 * with its readings and malformed lines.
 */
import { isAppError } from '@/lib/http/errors';
import { createLoggerLineParser, type LoggerLineParser } from '@/lib/ingest/logger-line';
import type { SerialWorkerRequest, SerialWorkerResponse } from './serial-messages';

const post = (message: SerialWorkerResponse) => (self as unknown as DedicatedWorkerGlobalScope).postMessage(message);

let parser: LoggerLineParser | null = null;
let decoder = new TextDecoder();

self.onmessage = (event: MessageEvent<SerialWorkerRequest>) => {
  const msg = event.data;
  try {
    if (msg.type === 'start') {
      parser = createLoggerLineParser(msg.format, msg.joint, { lastStoredS: msg.lastStoredS });
      decoder = new TextDecoder();
    } else if (parser && msg.type === 'bytes') {
      post({ type: 'batch', ...parser.push(decoder.decode(msg.bytes, { stream: true })), ended: false });
    } else if (parser && msg.type === 'end') {
      const tail = parser.push(decoder.decode());
      const last = parser.end();
      post({ type: 'batch', readings: [...tail.readings, ...last.readings], malformed: [...tail.malformed, ...last.malformed], clockRestarts: [...tail.clockRestarts, ...last.clockRestarts], ended: true });
    }
  } catch (error) {
    post({ type: 'error', message: isAppError(error) ? error.message : `The lines could not be read: ${(error as Error)?.message ?? error}` });
  }
};
