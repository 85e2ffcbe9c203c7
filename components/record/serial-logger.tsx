'use client';

import type { RecordJoint } from '@/lib/data/record';
import { LINE_DELIMITERS } from '@/lib/ingest/logger-line';
import { clockRestartSentence } from '@/lib/ingest/logger-clock';
import { channelFieldsText, DELIMITER_WORDS } from '@/lib/joints/logger-line-input';
import { BridgeInstructions } from './bridge-instructions';
import { useSerialLogger, type SerialState } from './use-serial-logger';

const BUTTON = 'rounded-md bg-accent px-4 py-2 text-sm font-medium text-accent-ink disabled:opacity-50';
const QUIET = 'rounded-md border border-rule bg-paper px-3 py-1.5 text-sm disabled:opacity-50';

/** The browser's reason in brackets, without its closing full stop. */
const because = (detail: string | null) => (detail ? ` (${detail.replace(/\.$/, '')})` : '');

/** The sentence for where a connection stands; `kept` names what stays on the server. */
function phaseSentence(state: SerialState, runId: number): { text: string; tone: 'good' | 'danger' | 'muted' } {
  const kept = `${state.sent} reading${state.sent === 1 ? '' : 's'} sent before are kept in run ${runId}`;
  switch (state.phase) {
    case 'idle':
      return { text: 'Not connected.', tone: 'muted' };
    case 'choosing':
      return { text: 'Choose the logger’s port in the browser’s window.', tone: 'muted' };
    case 'reading':
      return { text: 'Connected: reading lines from the logger.', tone: 'good' };
    case 'stopping':
      return { text: 'Disconnecting…', tone: 'muted' };
    case 'stopped':
      return { text: `Disconnected. The ${kept}.`, tone: 'muted' };
    case 'closed':
      return { text: `The port closed. The ${kept}; connect again to go on, or finish the run.`, tone: 'muted' };
    case 'lost':
      return { text: `The logger was disconnected mid-run${because(state.detail)}. The ${kept}; plug it in and connect again to go on, or finish the run.`, tone: 'danger' };
    case 'busy':
      return { text: `The port could not be opened${because(state.detail)}. Another program or browser tab may be using it, or it was unplugged: close it there, then connect again.`, tone: 'danger' };
    case 'no-port':
      return { text: state.detail ?? 'No port was chosen.', tone: 'muted' };
    case 'refused':
      return { text: `The server stopped taking readings: ${state.detail ?? ''} The ${kept}.`, tone: 'danger' };
    case 'failed':
      return { text: state.detail ?? 'The connection failed.', tone: 'danger' };
  }
}

/**
 * Connect logger: the joint's line format, the Connect and Disconnect buttons and where the
 * connection stands (readings sent, malformed lines). In a browser without Web Serial, or on a page
 * that is not a secure context, it says so and shows the bridge instead.
 */
export function SerialLogger({ runId, joint }: { runId: number; joint: RecordJoint }) {
  const { support, state, connect, disconnect } = useSerialLogger(runId, joint);
  const f = joint.loggerLine;
  const active = state.phase === 'choosing' || state.phase === 'reading' || state.phase === 'stopping';
  const sentence = phaseSentence(state, runId);

  if (support === 'checking') return null;
  if (support !== 'supported') {
    return (
      <div className="space-y-2" data-testid="serial-unavailable">
        <p className="text-sm">
          {support === 'unsupported'
            ? 'This browser cannot connect to a logger itself (Connect logger needs the Web Serial API of Chrome, Edge or another Chromium-based browser). Use the bridge below instead.'
            : 'Connect logger works only on a secure page (https, or this computer’s own address). Open Evenload that way, or use the bridge below.'}
        </p>
        <BridgeInstructions runId={runId} joint={joint} />
      </div>
    );
  }
  return (
    <div className="space-y-2" data-testid="serial-logger">
      <p className="text-sm text-muted">
        {joint.name}: {f.baudRate} baud; fields separated by {DELIMITER_WORDS[f.delimiter]}, decimal {f.decimalComma ? 'comma' : 'point'}; time in field {f.timeField}, channels in{' '}
        {f.channelFields ? `fields ${channelFieldsText(f.channelFields)}` : `the ${joint.studCount} fields after it`}; loads in {f.loadUnit}. Change these on the joint.
      </p>
      <div className="flex flex-wrap items-center gap-3">
        {active ? (
          <button type="button" className={QUIET} onClick={() => void disconnect()} disabled={state.phase === 'stopping'}>Disconnect</button>
        ) : (
          <button type="button" className={BUTTON} onClick={() => void connect()}>Connect logger</button>
        )}
        <span aria-live="polite" className={`text-sm ${sentence.tone === 'good' ? 'text-good' : sentence.tone === 'danger' ? 'text-danger' : 'text-muted'}`} data-testid="serial-phase">{sentence.text}</span>
      </div>
      {state.phase !== 'idle' ? (
        <p className="text-sm" data-testid="serial-counts">
          <span className="num font-medium">{state.sent}</span> readings sent{state.waiting ? <>, <span className="num">{state.waiting}</span> waiting</> : null} ·{' '}
          <span className={state.malformedCount ? 'text-danger' : ''}><span className="num font-medium">{state.malformedCount}</span> malformed line{state.malformedCount === 1 ? '' : 's'} skipped</span>
        </p>
      ) : null}
      {state.clockRestart ? (
        <p role="status" className="rounded-md border border-rule bg-paper px-3 py-2 text-sm" data-testid="serial-clock-restart">
          {clockRestartSentence(state.clockRestart)}
        </p>
      ) : null}
      {state.malformed.length ? (
        <ul className="list-disc pl-5 text-xs text-muted" aria-label="Latest malformed lines">
          {state.malformed.map((m) => <li key={m.line}>{m.reason} <code>{m.text.replaceAll(LINE_DELIMITERS.tab, ' ⇥ ')}</code></li>)}
        </ul>
      ) : null}
      <details className="text-sm">
        <summary className="cursor-pointer text-muted">Use the bridge script instead</summary>
        <div className="mt-2"><BridgeInstructions runId={runId} joint={joint} /></div>
      </details>
    </div>
  );
}
