'use client';

import { useMemo, useState } from 'react';
import { FlangeView } from '@/components/charts/flange-view';
import { PlotFigure } from '@/components/charts/plot-figure';
import { driftChart, finalLoadsChart, loadsThroughTimeChart, passSummaryChart, reachChart } from '@/lib/charts';
import type { RunAnalysis } from '@/lib/analysis/types';
import { formatForce } from '@/lib/calc/units';

/** The run report's pictures: the flange at a replayable step, loads through time, drift and reach. */
export function RunCharts({ analysis, units }: { analysis: RunAnalysis; units: 'si' | 'us' }) {
  const lastStep = analysis.steps.length;
  const [step, setStep] = useState(lastStep);
  const current = analysis.steps[step - 1];
  const finalSpec = useMemo(() => finalLoadsChart(analysis, { units }), [analysis, units]);
  const timeSpec = useMemo(() => loadsThroughTimeChart(analysis, { units, currentStep: step === lastStep ? undefined : step }), [analysis, units, step, lastStep]);
  const driftSpec = useMemo(() => driftChart(analysis, { units }), [analysis, units]);
  const passSpec = useMemo(() => passSummaryChart(analysis.passes), [analysis]);
  const reachSpec = useMemo(() => (analysis.reach.length ? reachChart(analysis.reach) : null), [analysis]);

  return (
    <>
      <section aria-labelledby="flange-heading" className="grid gap-4 lg:grid-cols-[auto_1fr]">
        <div className="rounded-card border border-rule bg-panel p-4">
          <h2 id="flange-heading" className="text-lg font-semibold">The flange {step === lastStep ? 'at the end' : `after step ${step}`}</h2>
          <p className="text-sm text-muted">Studs numbered clockwise from 1 at the top. Focus or point at a stud for its load.</p>
          <div className="mt-3 flex justify-center">
            <FlangeView loadsN={current?.loadsN ?? analysis.finalLoadsN} targetN={analysis.targetLoadN} bandPercent={analysis.bandPercent} units={units}
              activePosition={step === lastStep ? undefined : current?.position}
              label={`Flange view, ${step === lastStep ? 'final loads' : `after step ${step} of ${lastStep}`}`} />
          </div>
        </div>
        <PlotFigure {...finalSpec} className="rounded-card border border-rule bg-panel p-4" />
      </section>

      <section aria-labelledby="replay-heading" className="rounded-card border border-rule bg-panel p-4">
        <h2 id="replay-heading" className="text-lg font-semibold">The run through time</h2>
        <div className="no-print mt-2 flex flex-wrap items-center gap-3">
          <button type="button" onClick={() => setStep(1)} className="rounded-md border border-rule px-2 py-1 text-sm" aria-label="First step">First</button>
          <button type="button" onClick={() => setStep((s) => Math.max(1, s - 1))} className="rounded-md border border-rule px-2 py-1 text-sm" aria-label="Previous step">Back</button>
          <label className="flex flex-1 items-center gap-2 text-sm">
            <span className="text-muted">Replay</span>
            <input type="range" min={1} max={lastStep} value={step} onChange={(e) => setStep(Number(e.target.value))} className="min-w-40 flex-1 accent-[var(--el-accent)]"
              aria-valuetext={current ? `Step ${step} of ${lastStep}: ${current.positions ? `studs ${current.positions.join(', ')}` : `stud ${current.position}`} in pass ${current.pass}` : undefined} />
          </label>
          <button type="button" onClick={() => setStep((s) => Math.min(lastStep, s + 1))} className="rounded-md border border-rule px-2 py-1 text-sm" aria-label="Next step">Next</button>
          <button type="button" onClick={() => setStep(lastStep)} className="rounded-md border border-rule px-2 py-1 text-sm" aria-label="Last step">Last</button>
        </div>
        <p aria-live="polite" className="num mt-1 text-sm">
          {current
            ? current.positions
              ? `Step ${step} of ${lastStep}: studs ${current.positions.join(', ')} tensioned together in pass ${current.pass}.`
              : `Step ${step} of ${lastStep}: stud ${current.position} tightened in pass ${current.pass}; it now carries ${formatForce(current.loadsN[current.position - 1] ?? 0, units)}.`
            : null}
        </p>
        <PlotFigure {...timeSpec} className="mt-2" />
      </section>

      <section aria-labelledby="interaction-heading" className="space-y-4">
        <h2 id="interaction-heading" className="text-lg font-semibold">Elastic interaction</h2>
        <div className="grid gap-4 lg:grid-cols-2">
          <PlotFigure {...driftSpec} className="rounded-card border border-rule bg-panel p-4" />
          <PlotFigure {...passSpec} className="rounded-card border border-rule bg-panel p-4" />
        </div>
        {reachSpec ? (
          <PlotFigure {...reachSpec} className="rounded-card border border-rule bg-panel p-4" />
        ) : (
          <p className="rounded-card border border-rule bg-panel p-4 text-sm text-muted">Reach needs at least two steps: this run has too few to estimate it.</p>
        )}
      </section>
    </>
  );
}
