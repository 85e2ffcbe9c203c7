import Link from 'next/link';
import type { CohortDetail, CohortRunRow } from '@/lib/data/cohorts';
import { formatPercent } from '@/lib/calc/units';
import { formatDateTime } from '@/lib/format/format-date';
import { CollapsibleList, pageOf } from '../ui/collapsible-list';
import { EmptyState } from '../ui/empty-state';
import { CriterionTable } from './criterion-figures';
import { ResendInviteButton } from './resend-invite-button';
import { SendResultsForm, SignOffForm } from './verdict-forms';

/** The page numbers of the cohort page's lists, from its address (`?awaiting=2&signed=1&members=3`). */
export type ListPages = Partial<Record<'awaiting' | 'signed' | 'members', number>>;

interface ListsProps {
  cohort: CohortDetail;
  pages: ListPages;
  hrefFor: (param: string, page: number) => string;
}

const plural = (n: number, one: string, many: string) => `${n} ${n === 1 ? one : many}`;

function RunHeader({ run, children }: { run: CohortRunRow; children?: React.ReactNode }) {
  return (
    <header className="mb-2 flex flex-wrap items-baseline gap-x-4 text-sm">
      <span className="font-semibold">{run.operatorName}</span>
      <span className="num text-muted">{formatDateTime(run.recordedAt)}</span>
      <span>{run.methodName}</span>
      {children}
      <Link href={`/runs/${run.id}`} className="ml-auto underline underline-offset-4">Run report</Link>
    </header>
  );
}

/**
 * The trainees' complete runs without a verdict (the instructor's own runs, such as saved classroom
 * scenes, are not judged and only counted), folded and paged.
 */
export function AwaitingVerdicts({ cohort, pages, hrefFor }: ListsProps) {
  const memberIds = new Set(cohort.members.map((m) => m.id));
  const complete = cohort.runs.filter((r) => r.status === 'complete' && !r.verdict).reverse();
  const awaiting = complete.filter((r) => memberIds.has(r.operatorId) && r.attemptKind !== 'simulated');
  const others = complete.length - awaiting.length;
  const allMet = awaiting.filter((r) => r.judgement?.allMet).length;
  const { shown, page, pages: count } = pageOf(awaiting, pages.awaiting ?? 1);
  const summary = [awaiting.length ? `${allMet} with every criterion met` : null, others ? `${plural(others, 'run', 'runs')} not by trainees of the cohort left out` : null].filter(Boolean).join(' · ');
  return (
    <CollapsibleList id="awaiting" title="Runs awaiting a verdict" count={awaiting.length} summary={summary} open={pages.awaiting !== undefined} param="awaiting" page={page} pages={count} hrefFor={hrefFor}>
      {awaiting.length === 0 ? <EmptyState title="Nothing to judge">Complete runs of this cohort&apos;s trainees appear here to be judged and signed off.</EmptyState> : null}
      {shown.map((run) => (
        <article key={run.id} aria-label={`Run ${run.id} by ${run.operatorName}`} className="rounded-card border border-rule bg-paper p-4">
          <RunHeader run={run}><span className="text-muted">{run.jointName}</span></RunHeader>
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
    </CollapsibleList>
  );
}

/** The signed-off results, folded and paged. */
export function SignedOff({ cohort, pages, hrefFor }: ListsProps) {
  const signed = cohort.runs.filter((r) => r.status === 'complete' && r.verdict).reverse();
  const employerOf = new Map(cohort.members.map((m) => [m.id, m.employerContact]));
  const { shown, page, pages: count } = pageOf(signed, pages.signed ?? 1);
  const met = signed.filter((r) => r.verdict!.allMet).length;
  return (
    <CollapsibleList id="signed" title="Signed off" count={signed.length} summary={signed.length ? `${met} with all criteria met` : undefined} open={pages.signed !== undefined} param="signed" page={page} pages={count} hrefFor={hrefFor}>
      {signed.length === 0 ? <p className="text-sm text-muted">No result signed off yet.</p> : null}
      {shown.map((run) => (
        <article key={run.id} aria-label={`Signed-off run ${run.id} by ${run.operatorName}`} className="rounded-card border border-rule bg-paper p-4">
          <RunHeader run={run}>
            <span className={`font-medium ${run.verdict!.allMet ? 'text-good' : 'text-danger'}`}>{run.verdict!.allMet ? 'All criteria met' : 'Criteria not all met'}</span>
          </RunHeader>
          <CriterionTable results={run.verdict!.results} caption={`Signed-off result of run ${run.id}`} />
          <p className="mt-2 text-sm">
            Signed off by {run.verdict!.signedByName} on <span className="num">{formatDateTime(run.verdict!.signedAt)}</span>
            {run.verdict!.comment ? <>: “{run.verdict!.comment}”</> : '.'}
            {run.verdict!.resultsSentAt ? <span className="text-muted"> Results e-mailed <span className="num">{formatDateTime(run.verdict!.resultsSentAt)}</span>.</span> : null}
          </p>
          <div className="mt-2"><SendResultsForm cohortId={cohort.id} runId={run.id} employerContact={employerOf.get(run.operatorId) ?? null} sentAt={run.verdict!.resultsSentAt} /></div>
        </article>
      ))}
    </CollapsibleList>
  );
}

/** The members with their latest figures: open when there are few, paged. */
export function MembersList({ cohort, pages, hrefFor }: ListsProps) {
  const { members } = cohort;
  const { shown, page, pages: count } = pageOf(members, pages.members ?? 1);
  const pending = members.filter((m) => m.pending).length;
  return (
    <CollapsibleList id="members" title="Members" count={members.length} summary={pending ? `${pending} invited, password not set` : undefined} open={pages.members !== undefined || members.length <= 10} param="members" page={page} pages={count} hrefFor={hrefFor}>
      {members.length === 0 ? (
        <EmptyState title="No trainees yet">Invite them above by e-mail address; they appear here at once.</EmptyState>
      ) : (
        <div className="relative overflow-x-auto">
          <table className="w-full text-sm">
            <thead className="text-left text-muted">
              <tr><th className="py-1 pr-3">Trainee</th><th className="pr-3">E-mail</th><th className="pr-3">Account</th><th className="pr-3 text-right">Assessed attempts</th><th className="pr-3 text-right">Practice</th><th className="pr-3 text-right">Latest CV</th><th className="pr-3 text-right">Criteria met (latest)</th><th className="text-right">Sheet</th></tr>
            </thead>
            <tbody className="num">
              {shown.map((m) => (
                <tr key={m.id} className="border-t border-rule">
                  <td className="py-1.5 pr-3 font-medium">{m.name}</td>
                  <td className="pr-3">{m.email}</td>
                  <td className="pr-3">{!m.isActive ? <span className="text-muted">deactivated</span> : m.pending ? <span className="text-caution">{m.inviteExpired ? 'invitation expired — invite again' : 'invited, password not set'}</span> : 'active'}{m.pending && m.isActive ? <div className="mt-1"><ResendInviteButton userId={m.id} cohortId={cohort.id} name={m.name} /></div> : null}</td>
                  <td className="pr-3 text-right">{m.attempts}</td>
                  <td className="pr-3 text-right">{m.practiceRuns}</td>
                  <td className="pr-3 text-right">{m.latestCv === null ? '—' : formatPercent(m.latestCv * 100)}</td>
                  <td className="pr-3 text-right">{m.latestMet === null ? '—' : `${m.latestMet} of ${m.latestOf}`}</td>
                  <td className="text-right"><Link href={`/cohorts/${cohort.id}/trainees/${m.id}`} className="underline underline-offset-4">Result sheet</Link></td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </CollapsibleList>
  );
}
