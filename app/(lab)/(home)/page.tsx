import type { Metadata } from 'next';
import Link from 'next/link';
import { CalibrationDueDates } from '@/components/calibration/due-dates';
import { EquipmentTable } from '@/components/equipment/equipment-due';
import { LatestRuns } from '@/components/home/latest-runs';
import { SavedComparisons } from '@/components/home/saved-comparisons';
import { ROLE_LABELS } from '@/components/shell/navigation';
import { StatCard } from '@/components/ui/stat-card';
import { formatPercent } from '@/lib/calc/units';
import { calibrationDueDates } from '@/lib/data/calibration';
import { listEquipment } from '@/lib/data/equipment';
import { DUE_SOON_DAYS, dueStatus } from '@/lib/calibration/due-status';
import { homeSummary } from '@/lib/data/home';
import { listSavedComparisons } from '@/lib/data/saved-comparisons';
import { formatDate, formatDateTime } from '@/lib/format/format-date';
import { requirePageUser } from '@/lib/auth/session';

export const metadata: Metadata = { title: 'Home' };
export const dynamic = 'force-dynamic';

const cv = (value: number | null) => (value === null ? '—' : formatPercent(value * 100));

export default async function HomePage({ searchParams }: { searchParams: Promise<{ notice?: string }> }) {
  const user = await requirePageUser();
  const { notice } = await searchParams;
  const summary = await homeSummary(user);
  const saved = user.role === 'researcher' || user.role === 'instructor' ? await listSavedComparisons(user) : [];
  const today = new Date().toISOString().slice(0, 10);
  const calibrationDue = user.role === 'admin' ? await calibrationDueDates(user) : [];
  const equipmentDue = user.role === 'admin' ? (await listEquipment(user)).filter((e) => e.inService && dueStatus(e.dueOn, today) !== 'in-date') : [];
  return (
    <div className="space-y-6">
      {notice === 'not-allowed' ? (
        <p role="status" className="rounded-md border border-caution/50 bg-panel p-3 text-sm">
          That page is not open to your role ({ROLE_LABELS[user.role]}).
        </p>
      ) : null}
      <h1 className="text-2xl font-semibold">Good to see you, {user.name.split(' ')[0]}</h1>

      {summary.role === 'instructor' ? (
        <>
          <div className="grid gap-4 md:grid-cols-3">
            <StatCard label="Current cohort" value={summary.currentCohort?.name ?? 'None'} hint={summary.currentCohort ? `${summary.currentCohort.site} · ${formatDate(summary.currentCohort.startsOn)} to ${formatDate(summary.currentCohort.endsOn)}` : 'Create a cohort to invite trainees.'} />
            <StatCard label="Trainees in it" value={String(summary.currentCohort?.members ?? 0)} hint={`${summary.currentCohort?.runs ?? 0} runs recorded`} />
            <StatCard label="Runs in the last 7 days" value={String(summary.runsThisWeek)} hint="across your cohorts" />
          </div>
          <section className="rounded-card border border-rule bg-panel p-4" aria-labelledby="cohorts-heading">
            <h2 id="cohorts-heading" className="font-semibold">Your cohorts</h2>
            <div className="relative overflow-x-auto">
            <table className="mt-2 w-full text-sm">
              <thead className="text-left text-muted"><tr><th className="py-1 pr-3">Cohort</th><th className="pr-3">Site</th><th className="pr-3">Dates</th><th className="pr-3 text-right">Trainees</th><th className="text-right">Runs</th></tr></thead>
              <tbody className="num">
                {summary.cohorts.map((c) => (
                  <tr key={c.id} className="border-t border-rule">
                    <td className="py-1.5 pr-3"><Link className="underline decoration-rule underline-offset-4" href={`/cohorts/${c.id}`}>{c.name}</Link></td>
                    <td className="pr-3">{c.site}</td><td className="pr-3">{formatDate(c.startsOn)} – {formatDate(c.endsOn)}</td>
                    <td className="pr-3 text-right">{c.members}</td><td className="text-right">{c.runs}</td>
                  </tr>
                ))}
              </tbody>
            </table>
            </div>
          </section>
          <LatestRuns runs={summary.latestRuns} units={user.units} title="Latest runs in your cohorts" />
          <SavedComparisons items={saved} />
        </>
      ) : null}

      {summary.role === 'researcher' ? (
        <>
          <div className="grid gap-4 md:grid-cols-3">
            <StatCard label="Runs in the lab" value={String(summary.totalRuns)} hint={`${summary.setAside} set aside (left out of statistics)`} />
            <StatCard label="Runs in the last 7 days" value={String(summary.runsThisWeek)} />
            <StatCard label="Methods recorded" value={String(summary.byMethod.length)} />
          </div>
          <section className="rounded-card border border-rule bg-panel p-4" aria-labelledby="by-method">
            <h2 id="by-method" className="font-semibold">Scatter by method (complete runs)</h2>
            <div className="relative overflow-x-auto">
            <table className="mt-2 w-full text-sm">
              <thead className="text-left text-muted"><tr><th className="py-1">Method</th><th className="text-right">Runs</th><th className="text-right">Mean CV of final loads</th></tr></thead>
              <tbody className="num">
                {summary.byMethod.map((m) => (
                  <tr key={m.name} className="border-t border-rule"><td className="py-1.5">{m.name}</td><td className="text-right">{m.runs}</td><td className="text-right">{cv(m.meanCv)}</td></tr>
                ))}
              </tbody>
            </table>
            </div>
            <p className="mt-2 text-xs text-muted">Operators are shown as stable pseudonyms in your view.</p>
          </section>
          <SavedComparisons items={saved} />
          <LatestRuns runs={summary.latestRuns} units={user.units} />
        </>
      ) : null}

      {summary.role === 'trainee' ? (
        <>
          <div className="grid gap-4 md:grid-cols-3">
            <StatCard label="Your runs" value={String(summary.attempts)} />
            <StatCard label="Evenness of your latest run (CV)" value={cv(summary.latest?.finalCv ?? null)} hint="Lower is more even. CV is the spread of the final stud loads relative to their mean." />
            <StatCard label="Your most even run so far" value={cv(summary.bestCv)} />
          </div>
          <LatestRuns runs={summary.recent} units={user.units} title="Your runs" />
        </>
      ) : null}

      {summary.role === 'admin' ? (
        <>
          <div className="grid gap-4 md:grid-cols-4">
            {(['admin', 'instructor', 'researcher', 'trainee'] as const).map((role) => (
              <StatCard key={role} label={`${ROLE_LABELS[role]} accounts`} value={String(summary.accountsByRole[role])} />
            ))}
          </div>
          <section className="rounded-card border border-rule bg-panel p-4" aria-labelledby="accounts">
            <h2 id="accounts" className="font-semibold">Newest accounts</h2>
            <div className="relative overflow-x-auto">
            <table className="mt-2 w-full text-sm">
              <thead className="text-left text-muted"><tr><th className="py-1">Name</th><th>E-mail</th><th>Role</th><th>Created</th></tr></thead>
              <tbody>
                {summary.latestAccounts.map((a) => (
                  <tr key={a.id} className="border-t border-rule"><td className="py-1.5">{a.name}</td><td>{a.email}</td><td>{ROLE_LABELS[a.role]}</td><td className="num">{formatDateTime(a.createdAt)}</td></tr>
                ))}
              </tbody>
            </table>
            </div>
            <p className="mt-2 text-xs text-muted">{summary.totalRuns} runs are stored in the lab.</p>
          </section>
          <CalibrationDueDates joints={calibrationDue} today={today} />
          {equipmentDue.length > 0 ? (
            <section className="rounded-card border border-rule bg-panel p-4">
              <EquipmentTable items={equipmentDue} today={today} editable caption={`Equipment overdue or due within ${DUE_SOON_DAYS} days`} />
            </section>
          ) : null}
        </>
      ) : null}
    </div>
  );
}
