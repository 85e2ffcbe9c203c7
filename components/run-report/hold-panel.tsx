'use client';

import { useActionState, useMemo } from 'react';
import { PlotFigure } from '@/components/charts/plot-figure';
import type { RunRelaxation } from '@/lib/analysis/relaxation';
import { elapsedText, relaxationChart } from '@/lib/charts/relaxation-chart';
import { percentText } from '@/lib/charts/chart-format';
import { formatForce, type UnitSystem } from '@/lib/calc/units';
import { IDLE_FORM_STATE, type FormState } from '@/lib/http/form-state';
import { FormMessage } from '../ui/form-message';

type HoldAction = (state: FormState, formData: FormData) => Promise<FormState>;

const EXAMPLE = 'elapsed,1,2,3,4,…\n0,81.2,80.9,81.5,80.7,…\n10 min,80.1,79.8,80.6,79.9,…\n1 h,79.5,79.2,80.1,79.4,…';

/**
 * Hold readings: relaxation per stud against the time since the pass (% of its load then), a note for
 * each retightening pass (a pass after a hold), and for instructors and researchers the form to add
 * readings (a CSV file or the same text typed in).
 */
export function HoldPanel({ relaxation, units, action }: { relaxation: RunRelaxation; units: UnitSystem; action: HoldAction | null }) {
  const groups = useMemo(() => [...new Set(relaxation.holds.map((h) => h.afterPass))], [relaxation]);
  const lastGroup = groups[groups.length - 1];
  const spec = useMemo(() => (lastGroup === undefined ? null : relaxationChart(relaxation.holds.filter((h) => h.afterPass === lastGroup))), [relaxation, lastGroup]);
  if (!action && relaxation.holds.length === 0) return null;
  return (
    <section aria-labelledby="hold-heading" className="rounded-card border border-rule bg-panel p-4">
      <h2 id="hold-heading" className="text-lg font-semibold">Hold and relaxation</h2>
      {relaxation.holds.length === 0 ? <p className="mt-1 text-sm text-muted">No hold readings yet.</p> : null}
      {relaxation.retighteningPasses.map((p) => (
        <p key={p} className="mt-1 text-sm" data-testid="retightening-pass">Pass {p} is a retightening pass: it follows a hold.</p>
      ))}
      {groups.map((pass) => (
        <div key={pass} className="mt-3 overflow-x-auto">
          <h3 className="text-sm font-semibold">After pass {pass}</h3>
          <table className="mt-1 w-full text-sm">
            <thead className="text-left text-muted">
              <tr><th className="py-1">Time</th><th className="px-3 text-right">Mean lost</th><th className="px-3 text-right">Most lost</th><th className="px-3 text-right">Lowest load</th></tr>
            </thead>
            <tbody className="num">
              {relaxation.holds.filter((h) => h.afterPass === pass).map((h) => {
                const known = h.lostPercent.map((x, i) => ({ x, stud: i + 1 })).filter((e): e is { x: number; stud: number } => e.x !== null);
                const worst = known.reduce<{ x: number; stud: number } | null>((a, b) => (a === null || b.x > a.x ? b : a), null);
                return (
                  <tr key={h.elapsedS} className="border-t border-rule">
                    <td className="py-1.5">{elapsedText(h.elapsedS)}</td>
                    <td className="px-3 text-right">{h.meanLostPercent === null ? '—' : percentText(h.meanLostPercent)}</td>
                    <td className="px-3 text-right">{worst ? `${percentText(worst.x)} (stud ${worst.stud})` : '—'}</td>
                    <td className="px-3 text-right">{formatForce(Math.min(...h.loadsN), units)}</td>
                  </tr>
                );
              })}
            </tbody>
          </table>
        </div>
      ))}
      {spec ? <PlotFigure {...spec} className="mt-4" /> : null}
      {action ? <HoldForm action={action} units={units} /> : null}
    </section>
  );
}

function HoldForm({ action, units }: { action: HoldAction; units: UnitSystem }) {
  const [state, formAction, pending] = useActionState(action, IDLE_FORM_STATE);
  return (
    <form action={formAction} className="no-print mt-4 space-y-2" aria-label="Add hold readings">
      <input type="hidden" name="units" value={units} />
      <p className="text-sm text-muted">
        One row per time after the pass: elapsed time (seconds, or with s, min or h), an optional after_pass column (the last pass when left out),
        then one column per stud, 1 to the last, in {units === 'si' ? 'kN' : 'lbf'}.
      </p>
      <label className="block text-sm font-medium">
        Hold readings file (CSV)
        <input type="file" name="holdFile" accept=".csv,.txt,text/csv,text/plain" className="mt-1 block text-sm" />
      </label>
      <label className="block text-sm font-medium">
        or type them
        <textarea name="holdText" rows={4} placeholder={EXAMPLE} className="num mt-1 w-full rounded-md border border-rule bg-paper p-2 font-mono text-sm" />
      </label>
      <FormMessage status={state.status} message={state.message} />
      <button type="submit" disabled={pending} className="rounded-md bg-accent px-4 py-2 text-accent-ink disabled:opacity-60">
        {pending ? 'Saving…' : 'Save hold readings'}
      </button>
    </form>
  );
}
