import type { Metadata } from 'next';
import Link from 'next/link';
import { EmptyState } from '@/components/ui/empty-state';
import { formatForce, formatNumber } from '@/lib/calc/units';
import { threadLabel } from '@/lib/calc/thread';
import { JOINT_LIBRARY_ROLES, listJointLibrary } from '@/lib/data/joints';
import { TOOL_LABELS } from '@/lib/joints/method-input';
import { requirePageUser } from '@/lib/session';

export const metadata: Metadata = { title: 'Joint library' };
export const dynamic = 'force-dynamic';

const SAVED: Record<string, string> = { joint: 'The joint is saved.', method: 'The method is saved.', lubricant: 'The lubricant is saved.' };
const linkClass = 'font-medium underline decoration-rule underline-offset-4';
const newClass = 'rounded-md bg-accent px-3 py-1.5 text-sm font-medium text-accent-ink';

export default async function JointLibraryPage({ searchParams }: { searchParams: Promise<{ saved?: string }> }) {
  const user = await requirePageUser(JOINT_LIBRARY_ROLES);
  const [{ saved }, library] = await Promise.all([searchParams, listJointLibrary(user)]);
  const units = user.units;
  return (
    <div className="space-y-6">
      <div>
        <h1 className="text-2xl font-semibold">Joint library</h1>
        <p className="text-sm text-muted">The training joints, the methods trainees tighten them with, and the lubricants. Shared by every instructor of the centre.</p>
        <nav aria-label="Library sections" className="mt-2 flex gap-4 text-sm">
          <a className={linkClass} href="#joints">Joints ({library.joints.length})</a>
          <a className={linkClass} href="#methods">Methods ({library.methods.length})</a>
          <a className={linkClass} href="#lubricants">Lubricants ({library.lubricants.length})</a>
        </nav>
      </div>
      <div role="status" aria-live="polite">
        {saved && SAVED[saved] ? <p className="rounded-md border border-good bg-panel p-3 text-sm text-good">{SAVED[saved]}</p> : null}
      </div>

      <section id="joints" aria-labelledby="joints-heading" className="rounded-card border border-rule bg-panel p-4">
        <div className="flex items-center justify-between gap-2">
          <h2 id="joints-heading" className="text-lg font-semibold">Joints</h2>
          <Link href="/joints/new" className={newClass}>New joint</Link>
        </div>
        {library.joints.length === 0 ? (
          <div className="mt-3"><EmptyState title="No joints yet">Choose “New joint” to describe your training flange, its studs and target load.</EmptyState></div>
        ) : (
          <div className="mt-3 overflow-x-auto">
            <table className="w-full text-sm">
              <thead className="bg-rule/40 text-left"><tr>
                <th className="px-3 py-2">Joint</th><th className="px-3 py-2">Size and class</th><th className="px-3 py-2 text-right">Studs</th>
                <th className="px-3 py-2">Thread</th><th className="px-3 py-2">Grade</th><th className="px-3 py-2 text-right">Target stud load</th>
                <th className="px-3 py-2 text-right">Band</th><th className="px-3 py-2 text-right">Runs</th>
              </tr></thead>
              <tbody className="num">
                {library.joints.map((j) => (
                  <tr key={j.id} className="border-t border-rule">
                    <td className="px-3 py-2"><Link className={linkClass} href={`/joints/${j.id}`}>{j.name}</Link></td>
                    <td className="px-3 py-2">{j.nominalSize} · {j.pressureClass}</td>
                    <td className="px-3 py-2 text-right">{j.studCount}</td>
                    <td className="px-3 py-2">{threadLabel(j.thread)}</td>
                    <td className="px-3 py-2">{j.studGrade}</td>
                    <td className="px-3 py-2 text-right">{formatForce(j.targetLoadN, units)}</td>
                    <td className="px-3 py-2 text-right">±{formatNumber(j.bandPercent, 2)}&nbsp;%</td>
                    <td className="px-3 py-2 text-right">{j.runCount}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        )}
      </section>

      <section id="methods" aria-labelledby="methods-heading" className="rounded-card border border-rule bg-panel p-4">
        <div className="flex items-center justify-between gap-2">
          <h2 id="methods-heading" className="text-lg font-semibold">Methods</h2>
          <Link href="/joints/methods/new" className={newClass}>New method</Link>
        </div>
        {library.methods.length === 0 ? (
          <div className="mt-3"><EmptyState title="No methods yet">Choose “New method” to set the passes, their % of target and the stud order of each.</EmptyState></div>
        ) : (
          <div className="mt-3 overflow-x-auto">
            <table className="w-full text-sm">
              <thead className="bg-rule/40 text-left"><tr>
                <th className="px-3 py-2">Method</th><th className="px-3 py-2">Tool</th><th className="px-3 py-2">Passes (% of target, order)</th>
                <th className="px-3 py-2 text-right">Check passes</th><th className="px-3 py-2">Stud counts</th><th className="px-3 py-2 text-right">Runs</th>
              </tr></thead>
              <tbody className="num">
                {library.methods.map((m) => (
                  <tr key={m.id} className="border-t border-rule">
                    <td className="px-3 py-2"><Link className={linkClass} href={`/joints/methods/${m.id}`}>{m.name}</Link></td>
                    <td className="px-3 py-2">{TOOL_LABELS[m.toolKind]}</td>
                    <td className="px-3 py-2">{m.passes.map((p) => `${p.percentOfTarget}\u00a0% ${p.pattern}`).join(' → ')}</td>
                    <td className="px-3 py-2 text-right">{m.checkPasses}</td>
                    <td className="px-3 py-2">{[...new Set(m.passes.flatMap((p) => Object.keys(p.orderByStudCount)))].join(', ')}</td>
                    <td className="px-3 py-2 text-right">{m.runCount}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        )}
      </section>

      <section id="lubricants" aria-labelledby="lubricants-heading" className="rounded-card border border-rule bg-panel p-4">
        <div className="flex items-center justify-between gap-2">
          <h2 id="lubricants-heading" className="text-lg font-semibold">Lubricants</h2>
          <Link href="/joints/lubricants/new" className={newClass}>New lubricant</Link>
        </div>
        {library.lubricants.length === 0 ? (
          <div className="mt-3"><EmptyState title="No lubricants yet">Choose “New lubricant” to add one with its nominal nut factor (K).</EmptyState></div>
        ) : (
          <div className="mt-3 overflow-x-auto">
            <table className="w-full text-sm">
              <thead className="bg-rule/40 text-left"><tr>
                <th className="px-3 py-2">Lubricant</th><th className="px-3 py-2 text-right">Nominal K</th><th className="px-3 py-2">Notes</th><th className="px-3 py-2 text-right">Runs</th>
              </tr></thead>
              <tbody className="num">
                {library.lubricants.map((l) => (
                  <tr key={l.id} className="border-t border-rule">
                    <td className="px-3 py-2"><Link className={linkClass} href={`/joints/lubricants/${l.id}`}>{l.name}</Link></td>
                    <td className="px-3 py-2 text-right">{formatNumber(l.nominalNutFactor, 3)}</td>
                    <td className="px-3 py-2 text-muted">{l.notes ?? '—'}</td>
                    <td className="px-3 py-2 text-right">{l.runCount}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        )}
      </section>
    </div>
  );
}
