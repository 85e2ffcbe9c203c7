import type { Metadata } from 'next';
import { PersonControls } from '@/components/people/person-controls';
import { ResendInviteButton } from '@/components/cohorts/resend-invite-button';
import { ROLE_LABELS } from '@/components/shell/navigation';
import { listPeople } from '@/lib/data/people';
import { formatDate } from '@/lib/format/format-date';
import { requirePageUser } from '@/lib/auth/session';

export const metadata: Metadata = { title: 'People' };
export const dynamic = 'force-dynamic';

export default async function PeoplePage() {
  const user = await requirePageUser(['admin']);
  const people = await listPeople(user);
  return (
    <div className="space-y-4">
      <div>
        <h1 className="text-2xl font-semibold">People</h1>
        <p className="text-sm text-muted">Every account of the centre. A role change or a deactivation signs the person out everywhere within a minute; a deactivated account cannot sign in. Trainees join through their instructor&apos;s invitation.</p>
        <p className="mt-2 text-sm">
          <a href="/api/admin/audit-log" download className="underline underline-offset-4">Download the audit log (CSV)</a>: every change to runs, verdicts, criteria and accounts, with who, when, the reason, and the values before and after.
        </p>
      </div>
      <div className="relative overflow-x-auto rounded-card border border-rule bg-panel">
      <table className="w-full min-w-[52rem] text-sm">
        <thead className="text-left text-muted">
          <tr><th className="px-3 py-2">Name</th><th>E-mail</th><th>Role</th><th>Status</th><th>Since</th><th>Change</th></tr>
        </thead>
        <tbody>
          {people.map((p) => (
            <tr key={p.id} className="border-t border-rule align-middle">
              <td className="px-3 py-1.5 font-medium">{p.name}</td>
              <td>{p.email}</td>
              <td>{ROLE_LABELS[p.role]}</td>
              <td>{!p.isActive ? <span className="text-danger">deactivated</span> : p.pending ? <><span className="text-caution">invited</span><div className="mt-1"><ResendInviteButton userId={p.id} cohortId={null} name={p.name} /></div></> : 'active'}</td>
              <td className="num">{formatDate(p.createdAt)}</td>
              <td className="py-1.5"><PersonControls userId={p.id} name={p.name} role={p.role} isActive={p.isActive} isSelf={p.id === user.id} /></td>
            </tr>
          ))}
        </tbody>
      </table>
      </div>
    </div>
  );
}
