import type { Metadata } from 'next';
import Link from 'next/link';
import { LibrarySection } from '@/components/joints/library-section';
import { formatForce, formatNumber } from '@/lib/calc/units';
import { threadLabel } from '@/lib/calc/thread';
import { JOINT_LIBRARY_ROLES, listJointLibrary } from '@/lib/data/joints';
import { TOOL_LABELS } from '@/lib/joints/method-input';
import { TENSIONER_COVERAGE_SHORT } from '@/lib/calc/tensioner-coverage';
import { requirePageUser } from '@/lib/auth/session';

export const metadata: Metadata = { title: 'Joint library' };
export const dynamic = 'force-dynamic';

const SAVED: Record<string, string> = { joint: 'The joint is saved.', method: 'The method is saved.', lubricant: 'The lubricant is saved.' };
const linkClass = 'font-medium underline decoration-rule underline-offset-4';

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

      <LibrarySection id="joints" title="Joints" newHref="/joints/new" newLabel="New joint"
        empty={library.joints.length ? null : { title: 'No joints yet', text: 'Choose “New joint” to describe your training flange, its studs and target load.' }}
        columns={[{ label: 'Joint' }, { label: 'Size and class' }, { label: 'Studs', right: true }, { label: 'Thread' }, { label: 'Grade' }, { label: 'Target stud load', right: true }, { label: 'Band', right: true }, { label: 'Runs', right: true }]}>
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
      </LibrarySection>

      <LibrarySection id="methods" title="Methods" newHref="/joints/methods/new" newLabel="New method"
        empty={library.methods.length ? null : { title: 'No methods yet', text: 'Choose “New method” to set the passes, their % of target and the stud order of each.' }}
        columns={[{ label: 'Method' }, { label: 'Tool' }, { label: 'Passes (% of target, order)' }, { label: 'Check passes', right: true }, { label: 'Stud counts' }, { label: 'Runs', right: true }]}>
        {library.methods.map((m) => (
          <tr key={m.id} className="border-t border-rule">
            <td className="px-3 py-2"><Link className={linkClass} href={`/joints/methods/${m.id}`}>{m.name}</Link></td>
            <td className="px-3 py-2">{TOOL_LABELS[m.toolKind]}{m.toolKind === 'hydraulic_tensioner' ? <span className="block text-xs text-muted">{TENSIONER_COVERAGE_SHORT[m.tensionerCoverage]}</span> : null}</td>
            <td className="px-3 py-2">{m.passes.map((p) => `${p.percentOfTarget}\u00a0% ${p.pattern}`).join(' → ')}</td>
            <td className="px-3 py-2 text-right">{m.checkPasses}</td>
            <td className="px-3 py-2">{[...new Set(m.passes.flatMap((p) => Object.keys(p.orderByStudCount)))].join(', ')}</td>
            <td className="px-3 py-2 text-right">{m.runCount}</td>
          </tr>
        ))}
      </LibrarySection>

      <LibrarySection id="lubricants" title="Lubricants" newHref="/joints/lubricants/new" newLabel="New lubricant"
        empty={library.lubricants.length ? null : { title: 'No lubricants yet', text: 'Choose “New lubricant” to add one with its nominal nut factor (K).' }}
        columns={[{ label: 'Lubricant' }, { label: 'Nominal K', right: true }, { label: 'Notes' }, { label: 'Runs', right: true }]}>
        {library.lubricants.map((l) => (
          <tr key={l.id} className="border-t border-rule">
            <td className="px-3 py-2"><Link className={linkClass} href={`/joints/lubricants/${l.id}`}>{l.name}</Link></td>
            <td className="px-3 py-2 text-right">{formatNumber(l.nominalNutFactor, 3)}</td>
            <td className="px-3 py-2 text-muted">{l.notes ?? '—'}</td>
            <td className="px-3 py-2 text-right">{l.runCount}</td>
          </tr>
        ))}
      </LibrarySection>
    </div>
  );
}
