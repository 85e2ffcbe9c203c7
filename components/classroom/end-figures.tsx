'use client';

import { formatPercentFixed } from '@/lib/calc/units';
import { useActionState } from 'react';
import { saveSceneAction } from '@/app/(lab)/classroom/actions';
import { CautionBlock } from '@/components/caution-block';
import type { SideFigures } from '@/lib/classroom/figures';
import { IDLE_FORM_STATE } from '@/lib/http/form-state';
import type { ClassroomCohort } from '@/lib/data/classroom';
import type { BuiltScene } from './scene-model';
import { GasketPassStress } from './gasket-pass-stress';
import type { UnitSystem } from '@/lib/calc/units';

const pct = (fraction: number) => formatPercentFixed(fraction * 100);
const pctOf = (percent: number, signed = false) => formatPercentFixed(percent, { signed });

/** The end of a scene: the final-load figures side by side, the reading, and saving the simulated runs to a cohort. */
export function EndFigures({ scene, cohorts, seed, units }: { scene: BuiltScene; cohorts: ClassroomCohort[]; seed: number; units: UnitSystem }) {
  const figures = scene.figures;
  const [state, formAction, pending] = useActionState(saveSceneAction, IDLE_FORM_STATE);
  if (!figures) return null;
  const rows: { label: string; value: (s: SideFigures) => string }[] = [
    { label: 'CV', value: (s) => pct(s.cv) },
    { label: 'Range / mean', value: (s) => pctOf(s.rangeOverMeanPercent) },
    { label: 'Largest deviation from target', value: (s) => pctOf(s.largestDeviationPercent, true) },
    { label: 'Mean drift after the last tightening', value: (s) => pctOf(s.meanDriftPercent, true) },
  ];
  return (
    <div className="mt-2 grid gap-6 xl:grid-cols-[1fr_24rem]" data-testid="end-figures">
      <section aria-labelledby="figures-heading" className="space-y-4">
        <h2 id="figures-heading" className="text-2xl font-semibold">{figures.title}</h2>
        <table className="num w-full border-collapse text-left">
          <thead>
            <tr className="border-b-2 border-ink text-2xl">
              <th scope="col" className="py-2 pr-4 font-medium text-muted">Figure</th>
              {figures.sides.map((s) => <th key={s.key} scope="col" className="py-2 pr-4 text-right font-semibold">{s.label}</th>)}
            </tr>
          </thead>
          <tbody>
            {rows.map((row) => (
              <tr key={row.label} className="border-b border-rule">
                <th scope="row" className="py-1 pr-4 text-2xl font-medium">{row.label}</th>
                {figures.sides.map((s) => <td key={s.key} className="whitespace-nowrap py-1 pr-4 text-right text-4xl font-semibold">{row.value(s)}</td>)}
              </tr>
            ))}
          </tbody>
        </table>
        <div className="rounded-card border-l-4 border-l-accent bg-panel px-5 py-3" data-testid="reading">
          <p className="text-lg font-semibold text-muted">Reading ({figures.basis})</p>
          {figures.scatterReading ? <p className="text-3xl leading-snug">{figures.scatterReading}</p> : null}
          <p className={figures.scatterReading ? 'mt-2 text-2xl leading-snug text-muted' : 'text-3xl leading-snug'}>{figures.cvReading}</p>
        </div>
        <GasketPassStress scene={scene} units={units} />
      </section>
      <aside className="space-y-4">
        <CautionBlock variant="classroom" />
        {scene.key === 'tool' ? <CautionBlock variant="tensioner" /> : null}
        {scene.key !== 'real' ? (
          <form action={formAction} className="space-y-2 rounded-card border border-rule bg-panel p-4 text-lg">
            <h2 className="text-xl font-semibold">Save these simulated runs</h2>
            <p className="text-base text-muted">All {figures.sides.reduce((n, s) => n + s.runs, 0)} runs, as simulated runs in a cohort, to compare like any other run.</p>
            <input type="hidden" name="scene" value={scene.key} />
            <input type="hidden" name="jointId" value={scene.jointId ?? ''} />
            <input type="hidden" name="seed" value={seed} />
            <label className="block">
              <span>Cohort</span>
              <select name="cohortId" className="mt-1 block w-full rounded-md border border-rule bg-paper px-2 py-1" defaultValue={cohorts[0]?.id ?? ''} aria-describedby="save-scene-status">
                {cohorts.map((c) => <option key={c.id} value={c.id}>{c.name}</option>)}
              </select>
            </label>
            {cohorts.length === 0 ? <p className="text-danger">You have no cohort yet: create one under Cohorts first.</p> : null}
            {!scene.saveable ? <p className="text-danger">{scene.problems.join(' ')} Add the missing rows under Joints to save.</p> : null}
            <button type="submit" disabled={pending || !scene.saveable || cohorts.length === 0} className="rounded-md bg-accent px-4 py-2 font-semibold text-accent-ink disabled:opacity-50">
              {pending ? 'Saving…' : 'Save to cohort'}
            </button>
            <div id="save-scene-status" aria-live="polite" className="min-h-6">
              {state.status === 'error' ? <p className="text-danger">{state.message}</p> : null}
              {state.status === 'ok' ? (
                <p className="text-good">
                  {state.message} <a className="underline" href={state.data?.compareHref}>Compare them</a>
                </p>
              ) : null}
            </div>
          </form>
        ) : null}
      </aside>
    </div>
  );
}
