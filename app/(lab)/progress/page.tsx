import type { Metadata } from 'next';
import Link from 'next/link';
import { ProgressChart } from '@/components/charts/progress-chart';
import { CautionBlock } from '@/components/caution-block';
import { CriterionTable } from '@/components/cohorts/criterion-figures';
import { EmptyState } from '@/components/ui/empty-state';
import { MyRecordsSection } from '@/components/qualification/my-records-section';
import { formatPercent } from '@/lib/calc/units';
import { traineeProgress } from '@/lib/data/progress';
import { myTrainingRecords } from '@/lib/data/qualification/training-records';
import { formatDateTime } from '@/lib/format/format-date';
import { requirePageUser } from '@/lib/auth/session';

export const metadata: Metadata = { title: 'Progress' };
export const dynamic = 'force-dynamic';

const KIND_LABELS = { assessed: 'Assessed attempt', practice: 'Practice', simulated: 'Simulated (practice)' } as const;
const pct = (value: number | null) => (value === null ? '—' : formatPercent(value));

export default async function ProgressPage() {
  const user = await requirePageUser(['trainee']);
  const progress = await traineeProgress(user);
  const records = await myTrainingRecords(user);
  const limit = (key: 'cv' | 'band') => progress.latest?.results.find((r) => r.key === key)?.limit ?? null;
  return (
    <div className="space-y-6">
      <div>
        <h1 className="text-2xl font-semibold">Your progress</h1>
        <p className="text-sm text-muted">Your complete runs in order, how even their final loads were, and what your instructor said.</p>
      </div>

      <MyRecordsSection records={records} />

      <section aria-labelledby="evenness" className="grid gap-4 lg:grid-cols-[2fr_1fr]">
        <div className="rounded-card border border-rule bg-panel p-4 text-sm">
          <h2 id="evenness" className="font-semibold">What evenness means</h2>
          <p className="mt-1">
            When a flange is tightened, every stud should end up carrying about the same load — the target load. Evenness is how
            close the final loads are to each other and to that target. We measure it two ways: the CV (the spread of the final
            loads relative to their mean; lower is more even) and the largest deviation (how far the farthest stud ended from the
            target, in % of it).
          </p>
          <p className="mt-2">
            It matters because the gasket is squeezed by the studs together: uneven loads leave one side under-squeezed, where a joint
            can leak, and can over-load single studs. Tightening a stud also relaxes its neighbours a little, which is why the method
            asks for several passes in a set order.
          </p>
        </div>
        <CautionBlock variant="classroom" />
      </section>

      {progress.runs.length === 0 ? (
        <EmptyState title="No complete runs yet">Your runs appear here after your instructor records your first attempt on the training joint.</EmptyState>
      ) : (
        <>
          <section aria-labelledby="chart-heading" className="rounded-card border border-rule bg-panel p-4">
            <h2 id="chart-heading" className="sr-only">Evenness over attempts</h2>
            <p className="mb-2 text-sm">
              <strong className="num">{progress.runs.filter((r) => r.kind === 'assessed').length}</strong> assessed attempts (witnessed by your instructor) ·{' '}
              <strong className="num">{progress.runs.filter((r) => r.kind !== 'assessed').length}</strong> practice or simulated runs. Only assessed attempts count towards your course outcome.
            </p>
            <ProgressChart points={progress.runs.map((r) => ({ attempt: r.attempt, cvPercent: r.cvPercent, largestDeviationPercent: r.largestDeviationPercent }))} cvLimit={limit('cv')} bandLimit={limit('band')} />
            <div className="mt-3 relative overflow-x-auto">
            <table className="w-full min-w-[36rem] text-sm">
              <caption className="text-left text-xs text-muted">The chart&apos;s figures as a table.</caption>
              <thead className="text-left text-muted">
                <tr><th className="py-1">Attempt</th><th>Recorded</th><th>Method</th><th className="text-right">CV of final loads</th><th className="text-right">Largest deviation from target</th><th className="pl-3">Counts as</th><th className="pl-3">Verdict</th></tr>
              </thead>
              <tbody className="num">
                {progress.runs.map((r) => (
                  <tr key={r.id} className="border-t border-rule">
                    <td className="py-1.5"><Link href={`/runs/${r.id}`} className="underline underline-offset-4">{r.attempt}</Link></td>
                    <td>{formatDateTime(r.recordedAt)}</td>
                    <td>{r.methodName}</td>
                    <td className="text-right">{pct(r.cvPercent)}</td>
                    <td className="text-right">{pct(r.largestDeviationPercent)}</td>
                    <td className="pl-3">{KIND_LABELS[r.kind]}</td>
                    <td className="pl-3">{r.verdict ? <span className={r.verdict.allMet ? 'text-good' : 'text-danger'}>{r.verdict.allMet ? 'All criteria met' : 'Not all met'}</span> : <span className="text-muted">not signed off</span>}</td>
                  </tr>
                ))}
              </tbody>
            </table>
            </div>
          </section>

          <section aria-labelledby="now-heading" className="rounded-card border border-rule bg-panel p-4">
            <h2 id="now-heading" className="font-semibold">The criteria you meet now</h2>
            {progress.latest ? (
              <>
                <p className="mb-2 text-sm text-muted">Your latest run in “{progress.latest.cohortName}”, judged against that course&apos;s criteria.</p>
                <CriterionTable results={progress.latest.results} caption="Criteria met by your latest run" />
              </>
            ) : (
              <p className="text-sm text-muted">None of your runs belongs to a course yet, so there are no criteria to judge them against.</p>
            )}
          </section>

          <section aria-labelledby="comments-heading" className="rounded-card border border-rule bg-panel p-4">
            <h2 id="comments-heading" className="font-semibold">Comments from your instructor</h2>
            {progress.comments.length === 0 ? (
              <p className="text-sm text-muted">No comments yet. When your instructor signs a result off with a comment, it appears here.</p>
            ) : (
              <ul className="mt-2 divide-y divide-rule text-sm">
                {progress.comments.map((c, i) => (
                  <li key={i} className="py-2">
                    <span className="font-medium">{c.author}</span> on attempt {c.attempt} <span className="num text-muted">({formatDateTime(c.at)})</span>: {c.body}
                  </li>
                ))}
              </ul>
            )}
          </section>
        </>
      )}
    </div>
  );
}
