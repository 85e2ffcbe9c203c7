import type { Metadata } from 'next';
import Link from 'next/link';
import { PrintButton } from '@/components/ui/print-button';
import { PrintHeader, PrintSignature } from '@/components/ui/print-signature';
import { formatPercent } from '@/lib/calc/units';
import { cohortDetail } from '@/lib/data/cohorts';
import { orNotFound } from '@/lib/data/page-guards';
import { formatDate, formatDateTime } from '@/lib/format/format-date';
import { requirePageUser } from '@/lib/auth/session';

export const metadata: Metadata = { title: 'Cohort summary sheet' };
export const dynamic = 'force-dynamic';

export default async function CohortSheetPage({ params }: { params: Promise<{ id: string }> }) {
  const user = await requirePageUser(['instructor', 'admin']);
  const { id } = await params;
  const cohort = await orNotFound(() => cohortDetail(user, Number(id)));
  const c = cohort.criteria;
  return (
    <article className="print-sheet space-y-4">
      <div className="no-print flex gap-3">
        <Link href={`/cohorts/${cohort.id}`} className="rounded-md border border-rule px-3 py-1.5 text-sm hover:bg-rule/60">Back to the cohort</Link>
        <PrintButton />
      </div>
      <PrintHeader title="Cohort summary sheet" printedOn={formatDateTime(new Date().toISOString())} />
      <header>
        <h1 className="text-2xl font-semibold">{cohort.name}: summary</h1>
        <p className="text-sm">{cohort.site} · {formatDate(cohort.startsOn)} – {formatDate(cohort.endsOn)} · instructor {cohort.instructorName}</p>
        <p className="text-sm">Criteria: every final load within ±{c.bandPercent}&nbsp;% of target; CV at most {c.maxCvPercent}&nbsp;%;{c.requirePattern ? ' the prescribed pattern followed;' : ''} no stud above {c.maxYieldPercent}&nbsp;% of its minimum yield load.</p>
      </header>
      <div className="relative overflow-x-auto print:overflow-visible">
      <table className="w-full border-collapse text-sm">
        <thead className="text-left">
          <tr className="border-b border-rule"><th className="py-1">Trainee</th><th className="text-right">Assessed attempts</th><th className="text-right">Practice runs</th><th className="text-right">Latest CV</th><th className="text-right">Criteria met (latest)</th><th className="text-right">Runs signed off</th><th className="text-right">Of those, all met</th></tr>
        </thead>
        <tbody className="num">
          {cohort.members.map((m) => {
            const signed = cohort.runs.filter((r) => r.operatorId === m.id && r.verdict);
            return (
              <tr key={m.id} className="border-b border-rule">
                <td className="py-1.5">{m.name}</td>
                <td className="text-right">{m.attempts}</td>
                <td className="text-right">{m.practiceRuns}</td>
                <td className="text-right">{m.latestCv === null ? '—' : formatPercent(m.latestCv * 100)}</td>
                <td className="text-right">{m.latestMet === null ? '—' : `${m.latestMet} of ${m.latestOf}`}</td>
                <td className="text-right">{signed.length}</td>
                <td className="text-right">{signed.filter((r) => r.verdict!.allMet).length}</td>
              </tr>
            );
          })}
        </tbody>
      </table>
      </div>
      <p className="text-xs text-muted">Assessed attempts are runs the instructor recorded or confirmed as witnessed; practice runs were recorded by the trainee; simulated runs never count. Training results on an instrumented training joint; the approved procedure, local codes and qualified engineering judgement govern every real joint.</p>
      <PrintSignature roles={['Instructor']} />
    </article>
  );
}
