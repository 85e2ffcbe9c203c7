import type { AuditEntryDto } from '@/lib/data/audit-log';
import { formatDateTime } from '@/lib/format/format-date';

const ACTION_LABELS: Record<string, string> = {
  set_aside: 'Set aside',
  restore: 'Restored',
  confirm_attempt: 'Confirmed as a witnessed attempt',
  confirm_review: 'Confirmed after review',
  tool_check: 'Tools checked against their calibration',
  recompute: 'Figures recomputed after a calibration correction',
  correct: 'Calibration corrected',
  sign_off: 'Signed off',
  create: 'Created',
  update: 'Changed',
  role: 'Role changed',
  deactivate: 'Deactivated',
  reactivate: 'Reactivated',
  end_sessions: 'Signed out everywhere',
  issue: 'Record of training issued',
  revoke: 'Record of training revoked',
  replace: 'Replaced by a reissued record',
  record_validity: 'Validity of records changed',
  pass_override: 'Pass recorded with an override',
  theory_pass_mark: 'Theory pass mark changed',
  checklist: 'Observation checklist changed',
  tick: 'Observed',
  untick: 'Marked as not observed',
  invite_create: 'Account created by invitation',
  accept_invitation: 'Invitation accepted',
  password_reset: 'Password reset',
  review_link: 'Review link made',
  review_revoke: 'Review link withdrawn',
};

/** Keys an audit row keeps for the export and for finding rows, not for reading on the object's own page. */
const KEYS_NOT_SHOWN = new Set(['traineeId']);

/** What changed between before and after, as "field: old → new" lines (only fields that differ). */
function changes(before: unknown, after: unknown): string[] {
  const b = (before && typeof before === 'object' ? before : {}) as Record<string, unknown>;
  const a = (after && typeof after === 'object' ? after : {}) as Record<string, unknown>;
  const show = (v: unknown) => (v === null || v === undefined ? '—' : typeof v === 'object' ? JSON.stringify(v) : String(v));
  return [...new Set([...Object.keys(b), ...Object.keys(a)])].filter((k) => !KEYS_NOT_SHOWN.has(k) && show(b[k]) !== show(a[k])).map((k) => `${k}: ${show(b[k])} → ${show(a[k])}`);
}

/** The history of one object from the audit log: who did what, when, why, and what changed. */
export function AuditHistory({ entries, title = 'History' }: { entries: AuditEntryDto[]; title?: string }) {
  return (
    <section aria-labelledby="history-heading" className="rounded-card border border-rule bg-panel p-4">
      <h2 id="history-heading" className="text-lg font-semibold">{title}</h2>
      {entries.length === 0 ? (
        <p className="mt-2 text-sm text-muted">No changes recorded yet.</p>
      ) : (
        <ol className="mt-2 space-y-2 text-sm">
          {entries.map((entry) => (
            <li key={entry.id} className="rounded-md border border-rule bg-paper p-2">
              <div><strong>{ACTION_LABELS[entry.action] ?? entry.action}</strong> by {entry.actorName} · <span className="num">{formatDateTime(entry.at)}</span></div>
              {entry.reason ? <div>Reason: {entry.reason}</div> : null}
              {changes(entry.before, entry.after).map((line) => <div key={line} className="text-xs text-muted">{line}</div>)}
            </li>
          ))}
        </ol>
      )}
    </section>
  );
}
