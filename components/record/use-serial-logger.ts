'use client';

import { useEffect, useRef, useState } from 'react';
import type { RecordJoint } from '@/lib/data/record';
import type { MalformedLine } from '@/lib/ingest/logger-line';
import type { ClockRestart } from '@/lib/ingest/logger-clock';
import { jointForImport } from '@/lib/record/joint-import';
import { streamBody, type StreamReading } from '@/lib/record/stream-reading';
import type { SerialWorkerResponse } from './serial-messages';

/**
 * "Connect logger": reads a serial port with the Web Serial API (Chromium-based browsers), hands
 * the bytes to the serial worker (`serial-worker.ts`, the joint's line parser) and posts its
 * readings in batches to `POST /api/runs/:id/stream` with the page's session, one request at a
 * time. What was sent stays on the server whatever happens to the port afterwards. Each connection
 * starts from the run's last stored time (asked of the server, or the last reading queued here), so a
 * logger whose clock restarted continues after it and never replaces stored readings.
 */

/** The few parts of the Web Serial API used here (not in TypeScript's DOM library yet). */
interface SerialPortLike {
  open(options: { baudRate: number }): Promise<void>;
  close(): Promise<void>;
  readonly readable: ReadableStream<Uint8Array> | null;
}
interface SerialLike {
  requestPort(options?: object): Promise<SerialPortLike>;
}

/** Whether this browser can connect a logger itself. */
export type SerialSupport = 'checking' | 'supported' | 'unsupported' | 'insecure';

/** Where a connection stands. */
export type SerialPhase = 'idle' | 'choosing' | 'reading' | 'stopping' | 'stopped' | 'closed' | 'lost' | 'busy' | 'no-port' | 'refused' | 'failed';

export interface SerialState {
  phase: SerialPhase;
  /** Readings the server has accepted in this connection. */
  sent: number;
  /** Readings parsed and waiting to be sent. */
  waiting: number;
  malformedCount: number;
  /** The latest malformed lines (at most three), newest last. */
  malformed: MalformedLine[];
  /** Why the connection ended or could not start, in words. */
  detail: string | null;
  /** The latest restart of the logger's clock in this connection (its readings continue after the last one). */
  clockRestart: ClockRestart | null;
}

const INITIAL: SerialState = { phase: 'idle', sent: 0, waiting: 0, malformedCount: 0, malformed: [], detail: null, clockRestart: null };
/** Readings per request (the endpoint takes at most 20,000). */
const BATCH = 2000;
/** Read errors after which the port gives a new stream (Web Serial spec): the line is lost, the connection is not. */
const NON_FATAL = new Set(['BreakError', 'FramingError', 'ParityError', 'BufferOverrunError']);

const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

/** The run's last stored time as the server has it; null when it cannot be asked (the caller falls back on what it queued). */
async function lastStoredTime(runId: number): Promise<number | null> {
  try {
    const response = await fetch(`/api/runs/${runId}/stream`, { cache: 'no-store' });
    if (!response.ok) return null;
    const status = (await response.json()) as { lastTimeS?: number | null };
    return typeof status.lastTimeS === 'number' ? status.lastTimeS : null;
  } catch {
    return null;
  }
}

const laterOf = (a: number | null, b: number | null) => (a === null ? b : b === null ? a : Math.max(a, b));
const serialOf = () => (typeof navigator === 'undefined' ? undefined : (navigator as Navigator & { serial?: SerialLike }).serial);

interface Connection {
  reader: ReadableStreamDefaultReader<Uint8Array> | null;
  queue: StreamReading[];
  stopping: boolean;
  sending: boolean;
  parsedAll: boolean;
  refused: string | null;
}

export function useSerialLogger(runId: number, joint: RecordJoint) {
  const [support, setSupport] = useState<SerialSupport>('checking');
  const [state, setState] = useState<SerialState>(INITIAL);
  const current = useRef<Connection | null>(null);
  /** The latest time queued in any connection of this page (the server may not have it yet). */
  const lastQueuedT = useRef<number | null>(null);

  useEffect(() => {
    // Browsers hide navigator.serial outside secure contexts, so that is asked first.
    setSupport(!window.isSecureContext ? 'insecure' : serialOf() ? 'supported' : 'unsupported');
    return () => {
      const c = current.current;
      if (c) {
        c.stopping = true;
        void c.reader?.cancel().catch(() => undefined);
      }
    };
  }, []);

  async function send(c: Connection) {
    if (c.sending || c.refused) return;
    c.sending = true;
    try {
      while (c.queue.length && !c.refused) {
        const batch = c.queue.slice(0, BATCH);
        let response: Response;
        try {
          response = await fetch(`/api/runs/${runId}/stream`, { method: 'POST', headers: { 'content-type': 'application/x-ndjson' }, body: streamBody(batch) });
        } catch {
          return; // offline for a moment: the batch stays queued and the timer tries again
        }
        if (!response.ok) {
          const body = (await response.json().catch(() => null)) as { error?: { message?: string } } | null;
          c.refused = body?.error?.message ?? `The server answered ${response.status}.`;
          void c.reader?.cancel().catch(() => undefined);
          return;
        }
        c.queue.splice(0, batch.length);
        setState((s) => ({ ...s, sent: s.sent + batch.length, waiting: c.queue.length }));
      }
    } finally {
      c.sending = false;
    }
  }

  async function connect() {
    const serial = serialOf();
    if (!serial || current.current) return;
    setState({ ...INITIAL, phase: 'choosing' });
    let port: SerialPortLike;
    try {
      port = await serial.requestPort();
    } catch (error) {
      const e = error as DOMException;
      setState({ ...INITIAL, phase: 'no-port', detail: e.name === 'NotFoundError' ? 'No port was chosen.' : `The port could not be chosen: ${e.message}` });
      return;
    }
    try {
      await port.open({ baudRate: joint.loggerLine.baudRate });
    } catch (error) {
      setState({ ...INITIAL, phase: 'busy', detail: (error as Error).message });
      return;
    }
    const c: Connection = { reader: null, queue: [], stopping: false, sending: false, parsedAll: false, refused: null };
    current.current = c;
    const worker = new Worker(new URL('./serial-worker.ts', import.meta.url), { type: 'module' });
    worker.onmessage = (event: MessageEvent<SerialWorkerResponse>) => {
      const msg = event.data;
      if (msg.type === 'error') {
        c.refused = msg.message;
        c.parsedAll = true;
        void c.reader?.cancel().catch(() => undefined);
        return;
      }
      c.queue.push(...msg.readings);
      for (const r of msg.readings) lastQueuedT.current = laterOf(lastQueuedT.current, r.t);
      if (msg.ended) c.parsedAll = true;
      const restart = msg.clockRestarts.at(-1) ?? null;
      setState((s) => ({
        ...s,
        clockRestart: restart ?? s.clockRestart,
        waiting: c.queue.length,
        malformedCount: s.malformedCount + msg.malformed.length,
        malformed: msg.malformed.length ? [...s.malformed, ...msg.malformed].slice(-3) : s.malformed,
      }));
      void send(c);
    };
    const lastStoredS = laterOf(await lastStoredTime(runId), lastQueuedT.current);
    worker.postMessage({ type: 'start', format: joint.loggerLine, joint: jointForImport(joint), lastStoredS });
    const timer = setInterval(() => void send(c), 1000);
    setState({ ...INITIAL, phase: 'reading' });

    let end: SerialPhase = 'closed';
    let detail: string | null = null;
    while (port.readable && !c.stopping && !c.refused) {
      const reader = port.readable.getReader();
      c.reader = reader;
      try {
        for (;;) {
          const { value, done } = await reader.read();
          if (done) break;
          if (value?.length) worker.postMessage({ type: 'bytes', bytes: value });
        }
        break;
      } catch (error) {
        const e = error as DOMException;
        if (c.stopping || NON_FATAL.has(e.name)) continue;
        end = 'lost';
        detail = e.message;
        break;
      } finally {
        reader.releaseLock();
      }
    }
    if (c.stopping) end = 'stopped';
    worker.postMessage({ type: 'end' });
    for (let waited = 0; (!c.parsedAll || c.queue.length || c.sending) && !c.refused && waited < 30_000; waited += 100) {
      await sleep(100);
      void send(c);
    }
    clearInterval(timer);
    worker.terminate();
    await port.close().catch(() => undefined);
    current.current = null;
    if (c.refused) [end, detail] = ['refused', c.refused];
    setState((s) => ({ ...s, phase: end, detail, waiting: c.queue.length }));
  }

  async function disconnect() {
    const c = current.current;
    if (!c) return;
    c.stopping = true;
    setState((s) => ({ ...s, phase: 'stopping' }));
    await c.reader?.cancel().catch(() => undefined);
  }

  return { support, state, connect, disconnect };
}
