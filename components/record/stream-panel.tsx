'use client';

import Link from 'next/link';
import { useActionState, useEffect, useState } from 'react';
import useSWR from 'swr';
import { createStreamTokenAction, finishRecordingAction, revokeStreamTokenAction, startRecordingAction } from '@/app/(lab)/record/actions';
import { formatForce } from '@/lib/calc/units';
import type { RecordJoint } from '@/lib/data/record';
import type { StreamTokenRow } from '@/lib/data/stream-tokens';
import { fetchJson } from '@/lib/http/fetch-json';
import { formatDateTime } from '@/lib/format/format-date';
import { IDLE_FORM_STATE } from '@/lib/http/form-state';
import type { RecordFormState } from '@/app/(lab)/record/actions';
import type { StreamStatus } from '@/lib/data/runs/live-stream';
import { headerPayload, type HeaderErrors, type HeaderState } from './run-header-fields';

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
  const max = Math.max(joint.targetLoadN, ...(data?.latest.map((l) => l.loadN) ?? [0]));

  return (
    <div className="space-y-6">
      <section aria-labelledby="recording-title" className="space-y-3">
        <h2 id="recording-title" className="font-semibold">Recording</h2>
        <p className="text-sm text-muted">
          Start a recording for the header above; the bridge next to the logger then posts readings to it. Steps are found from the loads when you finish (each clear rise of one stud is a step).
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
              {data && data.sampleCount === 0 ? (
                <p className="text-muted">No readings yet. Start the bridge: <code className="text-xs">npx tsx scripts/stream-bridge.ts --url {typeof window === 'undefined' ? '' : window.location.origin} --run {watching} --token &lt;token&gt; --file run.csv</code></p>
              ) : null}
            </div>
            {data && data.latest.length ? (
              <ul className="grid gap-1 sm:grid-cols-2" aria-label="Latest load of each stud">
                {data.latest.map((l) => (
                  <li key={l.position} className="flex items-center gap-2 text-sm">
                    <span className="num w-14">Stud {l.position}</span>
                    <span className="h-3 flex-1 rounded bg-rule/50"><span className="block h-3 rounded bg-accent" style={{ width: `${Math.max(0, Math.min(100, (l.loadN / max) * 100))}%` }} /></span>
                    <span className="num w-24 text-right">{formatForce(l.loadN, units)}</span>
                  </li>
                ))}
              </ul>
            ) : null}
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

function TokenManager({ joint, joints, tokens }: { joint: RecordJoint; joints: RecordJoint[]; tokens: StreamTokenRow[] }) {
  const [createState, createAction, creating] = useActionState(createStreamTokenAction, IDLE_FORM_STATE);
  const [revokeState, revokeAction] = useActionState(revokeStreamTokenAction, IDLE_FORM_STATE);
  return (
    <section aria-labelledby="tokens-title" className="space-y-3">
      <h2 id="tokens-title" className="font-semibold">Bridge tokens</h2>
      <p className="text-sm text-muted">A token lets one bridge post readings for one joint (sent as <code>Authorization: Bearer …</code>). Revoke it when a bridge is retired or the token has leaked.</p>
      <form action={createAction} className="flex flex-wrap items-end gap-3">
        <label className="min-w-0 max-w-full text-sm">
          <span className="block">Joint</span>
          <select name="jointId" defaultValue={joint.id} className="mt-1 max-w-full rounded-md border border-rule bg-paper px-2 py-1.5">
            {joints.map((j) => <option key={j.id} value={j.id}>{j.name}</option>)}
          </select>
        </label>
        <label className="text-sm">
          <span className="block">Name of the bridge</span>
          <input name="label" placeholder="Bay 2 logger" maxLength={120} className="mt-1 rounded-md border border-rule bg-paper px-2 py-1.5" aria-describedby="token-label-error" />
        </label>
        <button type="submit" className={QUIET} disabled={creating}>Create token</button>
        <span id="token-label-error" aria-live="polite" className="text-sm text-danger">{createState.fieldErrors?.label?.[0] ?? createState.fieldErrors?.jointId?.[0] ?? (createState.status !== 'ok' ? createState.message : '')}</span>
      </form>
      {createState.status === 'ok' && createState.data?.token ? (
        <div className="rounded-md border border-caution p-3 text-sm" role="status">
          <p className="font-medium">{createState.message}</p>
          <code className="mt-1 block break-all rounded bg-paper p-2" data-testid="new-token">{createState.data?.token.value}</code>
        </div>
      ) : null}
      {tokens.length ? (
        <div className="relative overflow-x-auto">
        <table className="w-full text-sm">
          <thead className="text-left text-muted"><tr><th className="py-1">Name</th><th>Joint</th><th>Created</th><th>Last used</th><th /></tr></thead>
          <tbody>
            {tokens.map((t) => (
              <tr key={t.id} className="border-t border-rule">
                <td className="py-1">{t.label}</td><td>{t.jointName}</td><td>{formatDateTime(t.createdAt)}</td><td>{t.lastUsedAt ? formatDateTime(t.lastUsedAt) : '—'}</td>
                <td className="text-right">
                  {t.revokedAt ? <span className="text-muted">Revoked {formatDateTime(t.revokedAt)}</span> : (
                    <form action={revokeAction}><input type="hidden" name="tokenId" value={t.id} /><button type="submit" className={QUIET} aria-label={`Revoke token ${t.label}`}>Revoke</button></form>
                  )}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
        </div>
      ) : <p className="text-sm text-muted">No tokens yet: create one above and give it to the bridge.</p>}
      <p aria-live="polite" className="text-sm">{revokeState.message ? <span className={revokeState.status === 'ok' ? 'text-good' : 'text-danger'}>{revokeState.message}</span> : null}</p>
    </section>
  );
}
