import type { Metadata } from 'next';
import Link from 'next/link';
import { CriteriaForm } from '@/components/cohorts/criteria-form';
import { CriterionTable } from '@/components/cohorts/criterion-figures';
import { InviteForm } from '@/components/cohorts/invite-form';
import { ResendInviteButton } from '@/components/cohorts/resend-invite-button';
import { SendResultsForm, SignOffForm } from '@/components/cohorts/verdict-forms';
import { EmptyState } from '@/components/ui/empty-state';
import { CRITERIA_LIMITS } from '@/lib/assessment/criteria';
import { formatPercent } from '@/lib/calc/units';
import { cohortDetail } from '@/lib/data/cohorts';
import { orNotFound } from '@/lib/data/page-guards';
import { formatDate, formatDateTime } from '@/lib/format/format-date';
import { requirePageUser } from '@/lib/auth/session';

export const metadata: Metadata = { title: 'Cohort' };
export const dynamic = 'force-dynamic';

export default async function CohortPage({ params }: { params: Promise<{ id: string }> }) {
  const user = await requirePageUser(['instructor', 'admin']);
  const { id } = await params;
  const cohort = await orNotFound(() => cohortDetail(user, Number(id)));
  const complete = cohort.runs.filter((r) => r.status === 'complete').reverse();
  const awaiting = complete.filter((r) => !r.verdict && r.attemptKind !== 'simulated');
  const signed = complete.filter((r) => r.verdict);
  const employerOf = new Map(cohort.members.map((m) => [m.id, m.employerContact]));
  return (
    <div className="space-y-6">
      <div className="flex flex-wrap items-end gap-4">
        <div>
          <p className="text-sm text-muted"><Link href="/cohorts" className="underline underline-offset-4">Cohorts</Link></p>
          <h1 className="text-2xl font-semibold">{cohort.name}</h1>
          <p className="text-sm text-muted">{cohort.site} · {formatDate(cohort.startsOn)} – {formatDate(cohort.endsOn)} · instructor {cohort.instructorName}</p>
        </div>
        <Link href={`/cohorts/${cohort.id}/sheet`} className="ml-auto rounded-md border border-rule px-3 py-1.5 text-sm hover:bg-rule/60">Cohort summary sheet</Link>
      </div>

      <div className="grid gap-4 lg:grid-cols-2">
        <section aria-labelledby="invite-heading" className="rounded-card border border-rule bg-panel p-4">
          <h2 id="invite-heading" className="mb-2 font-semibold">Invite trainees</h2>
          <InviteForm cohortId={cohort.id} />
        </section>
        <section aria-labelledby="criteria-heading" className="rounded-card border border-rule bg-panel p-4">
          <h2 id="criteria-heading" className="font-semibold">Acceptance criteria</h2>
          <p className="mb-2 text-xs text-muted">{cohort.criteria.isDefault ? 'The defaults apply until you save your own.' : 'Saved for this cohort.'} Signed-off results keep the criteria they were judged with.</p>
          <CriteriaForm cohortId={cohort.id} criteria={cohort.criteria} limits={CRITERIA_LIMITS} />
        </section>
      </div>

      <section aria-labelledby="members-heading" className="rounded-card border border-rule bg-panel p-4">
        <h2 id="members-heading" className="font-semibold">Members</h2>
        {cohort.members.length === 0 ? (
          <div className="mt-3"><EmptyState title="No trainees yet">Invite them above by e-mail address; they appear here at once.</EmptyState></div>
        ) : (
          <table className="mt-2 w-full text-sm">
            <thead className="text-left text-muted">
              <tr><th className="py-1">Trainee</th><th>E-mail</th><th>Account</th><th className="text-right">Assessed attempts</th><th className="text-right">Practice</th><th className="text-right">Latest CV</th><th className="text-right">Criteria met (latest)</th><th className="text-right">Sheet</th></tr>
            </thead>
            <tbody className="num">
              {cohort.members.map((m) => (
                <tr key={m.id} className="border-t border-rule">
                  <td className="py-1.5 font-medium">{m.name}</td>
                  <td>{m.email}</td>
                  <td>{!m.isActive ? <span className="text-muted">deactivated</span> : m.pending ? <span className="text-caution">{m.inviteExpired ? 'invitation expired' : 'invited, password not set'}</span> : 'active'}{m.pending && m.isActive ? <div className="mt-1"><ResendInviteButton userId={m.id} cohortId={cohort.id} name={m.name} /></div> : null}</td>
                  <td className="text-right">{m.attempts}</td>
                  <td className="text-right">{m.practiceRuns}</td>
                  <td className="text-right">{m.latestCv === null ? '—' : formatPercent(m.latestCv * 100)}</td>
                  <td className="text-right">{m.latestMet === null ? '—' : `${m.latestMet} of ${m.latestOf}`}</td>
                  <td className="text-right"><Link href={`/cohorts/${cohort.id}/trainees/${m.id}`} className="underline underline-offset-4">Result sheet</Link></td>
                </tr>
              ))}
            </tbody>
          </table>
        )}
      </section>

      <section aria-labelledby="awaiting-heading" className="space-y-3">
        <h2 id="awaiting-heading" className="text-lg font-semibold">Runs awaiting a verdict ({awaiting.length})</h2>
        {awaiting.length === 0 ? <EmptyState title="Nothing to judge">Complete runs of this cohort&apos;s trainees appear here to be judged and signed off.</EmptyState> : null}
        {awaiting.map((run) => (
          <article key={run.id} aria-label={`Run ${run.id} by ${run.operatorName}`} className="rounded-card border border-rule bg-panel p-4">
            <header className="mb-2 flex flex-wrap items-baseline gap-x-4 text-sm">
              <span className="font-semibold">{run.operatorName}</span>
              <span className="num text-muted">{formatDateTime(run.recordedAt)}</span>
              <span>{run.methodName}</span>
              <span className="text-muted">{run.jointName}</span>
              <Link href={`/runs/${run.id}`} className="ml-auto underline underline-offset-4">Run report</Link>
            </header>
            <p className="mb-2 text-sm text-muted">{run.sourceLine}</p>
            {run.attemptKind === 'practice' ? (
              <p className="text-sm text-caution">Practice run: the trainee recorded it. If you witnessed it, confirm that on the <Link href={`/runs/${run.id}`} className="underline underline-offset-4">run report</Link>; then it can be signed off.</p>
            ) : run.judgement ? (
              <>
                <CriterionTable results={run.judgement.results} caption={`Judgement of run ${run.id}`} />
                <p className={`mt-2 text-sm font-medium ${run.judgement.allMet ? 'text-good' : 'text-danger'}`}>{run.judgement.allMet ? 'Every criterion met.' : 'Not every criterion met.'}</p>
                <div className="mt-2"><SignOffForm cohortId={cohort.id} runId={run.id} /></div>
              </>
            ) : (
              <p className="text-sm text-caution">This run has no final load for every stud, so it cannot be judged.</p>
            )}
          </article>
        ))}
      </section>

      <section aria-labelledby="signed-heading" className="space-y-3">
        <h2 id="signed-heading" className="text-lg font-semibold">Signed off ({signed.length})</h2>
        {signed.map((run) => (
          <article key={run.id} aria-label={`Signed-off run ${run.id} by ${run.operatorName}`} className="rounded-card border border-rule bg-panel p-4">
            <header className="mb-2 flex flex-wrap items-baseline gap-x-4 text-sm">
              <span className="font-semibold">{run.operatorName}</span>
              <span className="num text-muted">{formatDateTime(run.recordedAt)}</span>
              <span>{run.methodName}</span>
              <span className={`font-medium ${run.verdict!.allMet ? 'text-good' : 'text-danger'}`}>{run.verdict!.allMet ? 'All criteria met' : 'Criteria not all met'}</span>
              <Link href={`/runs/${run.id}`} className="ml-auto underline underline-offset-4">Run report</Link>
            </header>
            <CriterionTable results={run.verdict!.results} caption={`Signed-off result of run ${run.id}`} />
            <p className="mt-2 text-sm">
              Signed off by {run.verdict!.signedByName} on <span className="num">{formatDateTime(run.verdict!.signedAt)}</span>
              {run.verdict!.comment ? <>: “{run.verdict!.comment}”</> : '.'}
              {run.verdict!.resultsSentAt ? <span className="text-muted"> Results e-mailed <span className="num">{formatDateTime(run.verdict!.resultsSentAt)}</span>.</span> : null}
            </p>
            <div className="mt-2"><SendResultsForm cohortId={cohort.id} runId={run.id} employerContact={employerOf.get(run.operatorId) ?? null} sentAt={run.verdict!.resultsSentAt} /></div>
          </article>
        ))}
      </section>
    </div>
  );
}
