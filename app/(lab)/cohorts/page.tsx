import type { Metadata } from 'next';
import Link from 'next/link';
import { CreateCohortForm } from '@/components/cohorts/create-cohort-form';
import { EmptyState } from '@/components/ui/empty-state';
import { listCohorts } from '@/lib/data/cohorts';
import { formatDate } from '@/lib/format/format-date';
import { requirePageUser } from '@/lib/auth/session';

export const metadata: Metadata = { title: 'Cohorts' };
export const dynamic = 'force-dynamic';

export default async function CohortsPage() {
  const user = await requirePageUser(['instructor', 'admin']);
  const cohorts = await listCohorts(user);
  return (
    <div className="space-y-6">
      <div>
        <h1 className="text-2xl font-semibold">Cohorts</h1>
        <p className="text-sm text-muted">{user.role === 'admin' ? 'Every cohort of the centre.' : 'The courses you teach.'} Choose one to invite trainees, set its criteria and sign results off.</p>
      </div>
      <section aria-labelledby="cohort-list" className="rounded-card border border-rule bg-panel p-4">
        <h2 id="cohort-list" className="font-semibold">Courses</h2>
        {cohorts.length === 0 ? (
          <div className="mt-3"><EmptyState title="No cohorts yet">Create one below: a course name, its site and its dates.</EmptyState></div>
        ) : (
          <div className="mt-2 relative overflow-x-auto">
          <table className="w-full text-sm">
            <thead className="text-left text-muted">
              <tr><th className="py-1">Course</th><th>Site</th><th>Dates</th>{user.role === 'admin' ? <th>Instructor</th> : null}<th className="text-right">Trainees</th><th className="text-right">Runs</th><th className="text-right">Signed off</th></tr>
            </thead>
            <tbody className="num">
              {cohorts.map((c) => (
                <tr key={c.id} className="border-t border-rule">
                  <td className="py-1.5"><Link href={`/cohorts/${c.id}`} className="font-medium underline decoration-rule underline-offset-4">{c.name}</Link></td>
                  <td>{c.site}</td>
                  <td>{formatDate(c.startsOn)} – {formatDate(c.endsOn)}</td>
                  {user.role === 'admin' ? <td>{c.instructorName}</td> : null}
                  <td className="text-right">{c.members}</td>
                  <td className="text-right">{c.runs}</td>
                  <td className="text-right">{c.signedOff}</td>
                </tr>
              ))}
            </tbody>
          </table>
          </div>
        )}
      </section>
      <section aria-labelledby="new-cohort" className="rounded-card border border-rule bg-panel p-4">
        <h2 id="new-cohort" className="mb-3 font-semibold">New cohort</h2>
        <CreateCohortForm />
      </section>
    </div>
  );
}
