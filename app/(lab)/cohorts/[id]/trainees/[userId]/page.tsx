import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { CriterionTable } from '@/components/cohorts/criterion-figures';
import { PrintButton } from '@/components/ui/print-button';
import { PrintHeader, PrintSignature } from '@/components/ui/print-signature';
import { RecordOfTrainingSection } from '@/components/qualification/record-of-training-section';
import { cohortDetail } from '@/lib/data/cohorts';
import { traineeQualification } from '@/lib/data/qualification/training-records';
import { orNotFound } from '@/lib/data/page-guards';
import { formatDate, formatDateTime } from '@/lib/format/format-date';
import { requirePageUser } from '@/lib/auth/session';

export const metadata: Metadata = { title: 'Result sheet' };
export const dynamic = 'force-dynamic';

export default async function TraineeSheetPage({ params }: { params: Promise<{ id: string; userId: string }> }) {
  const user = await requirePageUser(['instructor', 'admin']);
  const { id, userId } = await params;
  const cohort = await orNotFound(() => cohortDetail(user, Number(id)));
  const member = cohort.members.find((m) => m.id === Number(userId));
  if (!member) notFound();
  const qualification = await traineeQualification(user, cohort.id, member.id);
  const complete = cohort.runs.filter((r) => r.operatorId === member.id && r.status === 'complete');
  const runs = complete.filter((r) => r.attemptKind === 'assessed');
  const practice = complete.filter((r) => r.attemptKind !== 'assessed');
  return (
    <article className="print-sheet space-y-4">
      <div className="no-print flex gap-3">
        <Link href={`/cohorts/${cohort.id}`} className="rounded-md border border-rule px-3 py-1.5 text-sm hover:bg-rule/60">Back to the cohort</Link>
        <PrintButton />
      </div>
      <PrintHeader title="Result sheet" printedOn={formatDateTime(new Date().toISOString())} />
      <header>
        <h1 className="text-2xl font-semibold">Result sheet: {member.name}</h1>
        <p className="text-sm">{cohort.name} · {cohort.site} · {formatDate(cohort.startsOn)} – {formatDate(cohort.endsOn)} · instructor {cohort.instructorName}</p>
      </header>
      {runs.length === 0 ? <p className="text-sm">No assessed attempts yet.</p> : null}
      {runs.map((run, index) => {
        const results = run.verdict?.results ?? run.judgement?.results ?? [];
        return (
          <section key={run.id} className="break-inside-avoid rounded-card border border-rule p-3">
            <h2 className="font-semibold">Attempt {index + 1} · <span className="num">{formatDateTime(run.recordedAt)}</span> · {run.methodName}</h2>
            <p className="text-sm text-muted">{run.sourceLine}</p>
            <CriterionTable results={results} caption={`Attempt ${index + 1}`} />
            <p className="mt-1 text-sm">
              {run.verdict
                ? <>Signed off by {run.verdict.signedByName} on <span className="num">{formatDateTime(run.verdict.signedAt)}</span>{run.verdict.comment ? `: “${run.verdict.comment}”` : '.'}</>
                : <span className="text-muted">Not signed off yet (judged against the current criteria).</span>}
            </p>
          </section>
        );
      })}
      {practice.length ? (
        <section className="break-inside-avoid text-sm">
          <h2 className="font-semibold">Practice and simulated runs (not assessed)</h2>
          <ul className="mt-1 list-disc pl-5">
            {practice.map((run) => <li key={run.id}><span className="num">{formatDateTime(run.recordedAt)}</span> · {run.methodName} · {run.sourceLine}</li>)}
          </ul>
        </section>
      ) : null}
      <RecordOfTrainingSection
        cohortId={cohort.id}
        traineeId={member.id}
        qualification={qualification}
        attempts={runs.map((r) => ({ runId: r.id, recordedAt: r.recordedAt, methodName: r.methodName, verdict: r.verdict ? { allMet: r.verdict.allMet, signedByName: r.verdict.signedByName, signedAt: r.verdict.signedAt } : null }))}
      />
      <PrintSignature roles={['Trainee', 'Instructor']} />
      <p className="text-xs text-muted">Training results on an instrumented training joint; the approved procedure, local codes and qualified engineering judgement govern every real joint.</p>
    </article>
  );
}
