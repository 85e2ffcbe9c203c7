'use client';

import { useActionState } from 'react';
import { createStreamTokenAction, revokeStreamTokenAction } from '@/app/(lab)/record/actions';
import type { RecordJoint } from '@/lib/data/record';
import type { StreamTokenRow } from '@/lib/data/stream-tokens';
import { formatDateTime } from '@/lib/format/format-date';
import { IDLE_FORM_STATE } from '@/lib/http/form-state';
import { CopyButton } from '../ui/copy-button';

const QUIET = 'rounded-md border border-rule bg-paper px-3 py-1.5 text-sm disabled:opacity-50';

/** Bridge tokens: create one for a joint (shown once, with a copy button), list and revoke them. */
export function TokenManager({ joint, joints, tokens }: { joint: RecordJoint; joints: RecordJoint[]; tokens: StreamTokenRow[] }) {
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
          <CopyButton text={createState.data?.token.value} label="Copy token" />
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
