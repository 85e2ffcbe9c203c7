'use client';

import Link from 'next/link';
import { useActionState, useEffect, useState } from 'react';
import useSWR from 'swr';
import { finishRecordingAction, startRecordingAction } from '@/app/(lab)/record/actions';
import type { RecordJoint } from '@/lib/data/record';
import type { StreamTokenRow } from '@/lib/data/stream-tokens';
import { fetchJson } from '@/lib/http/fetch-json';
import { formatDateTime } from '@/lib/format/format-date';
import { IDLE_FORM_STATE } from '@/lib/http/form-state';
import type { RecordFormState } from '@/app/(lab)/record/actions';
import type { StreamStatus } from '@/lib/data/runs/live-stream';
import { headerPayload, type HeaderErrors, type HeaderState } from './run-header-fields';
import { LiveBars } from './live-bars';
import { SerialLogger } from './serial-logger';
import { TokenManager } from './token-manager';

const BUTTON = 'rounded-md bg-accent px-4 py-2 text-sm font-medium text-accent-ink disabled:opacity-50';
const QUIET = 'rounded-md border border-rule bg-paper px-3 py-1.5 text-sm disabled:opacity-50';

/** Stream live: start a recording, watch readings arrive from the bridge, finish; manage bridge tokens. */
export function StreamPanel({ joint, joints, header, tokens, recordings, onHeaderErrors, canManageTokens, units }: {
  joint: RecordJoint;
  joints: RecordJoint[];
  header: HeaderState;
  tokens: StreamTokenRow[];
  recordings: Array<{ id: number; jointId: number; recordedAt: string }>;
  onHeaderErrors: (e: HeaderErrors) => void;
  canManageTokens: boolean;
  units: 'si' | 'us';
}) {
  const [watching, setWatching] = useState<number | null>(recordings[0]?.id ?? null);
  const [startState, startAction, starting] = useActionState(async (prev: RecordFormState, fd: FormData) => {
    const r = await startRecordingAction(prev, fd);
    onHeaderErrors(r.fieldErrors ?? {});
    return r;
  }, IDLE_FORM_STATE);
  const [finishState, finishAction, finishing] = useActionState(finishRecordingAction, IDLE_FORM_STATE);
  useEffect(() => {
    if (startState.status === 'ok' && startState.data?.runId) setWatching(startState.data?.runId);
  }, [startState]);
  const { data, error } = useSWR<StreamStatus>(watching ? `/api/runs/${watching}/stream` : null, fetchJson, { refreshInterval: (d) => (d && d.status !== 'recording' ? 0 : 1000) });
  const watchedJoint = joints.find((j) => j.id === recordings.find((r) => r.id === watching)?.jointId) ?? joint;

  return (
    <div className="space-y-6">
      <section aria-labelledby="recording-title" className="space-y-3">
        <h2 id="recording-title" className="font-semibold">Recording</h2>
        <p className="text-sm text-muted">
          Start a recording for the header above, then connect the logger here (or run the bridge next to it) to send its readings. Steps are found from the loads when you finish: each clear rise of one stud, or of the studs a tensioner pulls together, is a step.
        </p>
        <div className="flex flex-wrap items-center gap-3">
          <form action={startAction}>
            <input type="hidden" name="payload" value={JSON.stringify({ header: headerPayload(header) })} />
            <button type="submit" className={BUTTON} disabled={starting}>{starting ? 'Starting…' : 'Start recording'}</button>
          </form>
          {recordings.length || watching ? (
            <label className="text-sm">
              Watching{' '}
              <select value={watching ?? ''} onChange={(e) => setWatching(e.target.value ? Number(e.target.value) : null)} className="max-w-full rounded-md border border-rule bg-paper px-2 py-1.5">
                {watching && !recordings.some((r) => r.id === watching) ? <option value={watching}>Run {watching}</option> : null}
                {recordings.map((r) => <option key={r.id} value={r.id}>Run {r.id} · {formatDateTime(r.recordedAt)}</option>)}
              </select>
            </label>
          ) : null}
        </div>
        <div aria-live="polite" className="text-sm">
          {startState.message ? <p className={startState.status === 'ok' ? 'text-good' : 'text-danger'}>{startState.message}</p> : null}
        </div>

        {watching ? (
          <div className="space-y-3 rounded-md border border-rule bg-paper p-3" data-testid="stream-status">
            <div aria-live="polite" className="text-sm">
              {error ? <p className="text-danger">The readings could not be loaded: {error.message}</p> : null}
              {data ? (
                <p>
                  Run <span className="num">{data.runId}</span> is <span className="font-medium">{data.status === 'recording' ? 'recording' : data.status}</span>:{' '}
                  <span className="num font-medium" data-testid="sample-count">{data.sampleCount}</span> readings received
                  {data.lastTimeS !== null ? <>, last at <span className="num">{data.lastTimeS} s</span></> : null}
                  {data.status === 'complete' ? <> · <span className="num">{data.stepCount}</span> steps</> : null}.
                </p>
              ) : <p className="text-muted">Waiting for the first poll…</p>}
            </div>
            {data?.status === 'recording' ? (
              <section aria-labelledby="logger-title" className="space-y-2 border-t border-rule pt-3">
                <h3 id="logger-title" className="text-sm font-semibold">Logger</h3>
                <SerialLogger runId={data.runId} joint={watchedJoint} />
              </section>
            ) : null}
            {data ? <LiveBars latest={data.latest} targetLoadN={data.targetLoadN} bandPercent={data.bandPercent} units={units} /> : null}
            {data?.status === 'recording' ? (
              <form action={finishAction} className="flex items-center gap-3">
                <input type="hidden" name="runId" value={watching} />
                <button type="submit" className={BUTTON} disabled={finishing || !data.sampleCount}>{finishing ? 'Finishing…' : 'Finish'}</button>
                <span className="text-sm text-muted">Finish when the last pass is done: the steps are derived and the run becomes complete.</span>
              </form>
            ) : null}
            <div aria-live="polite" className="text-sm">
              {finishState.message ? (
                <p className={finishState.status === 'ok' ? 'text-good' : 'text-danger'}>
                  {finishState.message} {finishState.status === 'ok' && finishState.data?.runId ? <Link className="underline" href={`/runs/${finishState.data?.runId}`}>Open run {finishState.data?.runId}</Link> : null}
                </p>
              ) : null}
            </div>
          </div>
        ) : null}
      </section>

      {canManageTokens ? <TokenManager joint={joint} joints={joints} tokens={tokens} /> : (
        <p className="text-sm text-muted">The bridge needs a token for this joint; an instructor creates it here.</p>
      )}
    </div>
  );
}
