'use client';

import { useEffect, useMemo, useState } from 'react';
import { DeviationLegend } from '@/components/charts/deviation-legend';
import { FlangeView } from '@/components/charts/flange-view';
import { PlotFigure } from '@/components/charts/plot-figure';
import type { UnitSystem } from '@/lib/calc/units';
import { loadsThroughTimeChart } from '@/lib/charts';
import { endOf, sideStep } from '@/lib/classroom/keyboard';
import type { ClassroomCohort } from '@/lib/data/classroom';
import { EndFigures } from './end-figures';
import type { BuiltScene } from './scene-model';

function useViewport() {
  // The stage is drawn only after Start (never on the server), so the first render can read the
  // window: a phone then lays out stacked at once instead of drawing the chart in a too-narrow column.
  const [size, setSize] = useState(() => (typeof window === 'undefined' ? { width: 1280, height: 720 } : { width: window.innerWidth, height: window.innerHeight }));
  useEffect(() => {
    const update = () => setSize({ width: window.innerWidth, height: window.innerHeight });
    update();
    window.addEventListener('resize', update);
    return () => window.removeEventListener('resize', update);
  }, []);
  return size;
}

/** One scene on the stage: a row per side (flange and loads through time) step by step, then the figures. */
export function Stage({ scene, step, sceneNumber, sceneCount, units, cohorts, seed, onBack, onHelp }: {
  scene: BuiltScene; step: number; sceneNumber: number; sceneCount: number; units: UnitSystem; cohorts: ClassroomCohort[]; seed: number; onBack: () => void; onHelp: () => void;
}) {
  const { width, height } = useViewport();
  // On a narrow screen the flange sits above the chart, so the chart keeps the whole width.
  const stacked = width < 768;
  const atEnd = step >= endOf(scene.totalSteps);
  const headerHeight = 104;
  const rowHeight = Math.max(240, Math.floor((height - headerHeight - 16) / Math.max(1, scene.sides.length)));
  return (
    <div className="flex min-h-screen flex-col px-3 py-3 sm:px-6">
      <header className="flex flex-wrap items-center gap-x-8 gap-y-1" style={{ minHeight: headerHeight - 12 }}>
        <div className="min-w-0 flex-1">
          <h1 className="text-room font-semibold">{scene.title}</h1>
          <p className="num text-2xl text-muted" aria-live="polite">
            Scene {sceneNumber} of {sceneCount} · {atEnd ? 'the figures' : step === 0 ? 'all studs snug, nothing tightened yet' : `step ${step} of ${scene.totalSteps}`}
          </p>
        </div>
        {!atEnd && scene.sides.length ? <DeviationLegend bandPercent={scene.bandPercent} large className="w-[26rem] max-w-full" /> : null}
        <div className="flex gap-2 text-lg">
          <button type="button" onClick={onHelp} className="rounded-md border border-rule px-3 py-1">Keys (?)</button>
          <button type="button" onClick={onBack} className="rounded-md border border-rule px-3 py-1">Scenes</button>
        </div>
      </header>
      {scene.problems.length && !scene.sides.length ? (
        <div className="mt-8 space-y-3 text-3xl">{scene.problems.map((p) => <p key={p}>{p}</p>)}</div>
      ) : atEnd ? (
        <EndFigures scene={scene} cohorts={cohorts} seed={seed} units={units} />
      ) : (
        <div className="flex flex-col gap-2">
          {scene.sides.map((side) => (
            <SideRow key={side.key} side={side} sceneStep={step} totalSteps={scene.totalSteps} rowHeight={rowHeight} units={units} stacked={stacked} />
          ))}
        </div>
      )}
    </div>
  );
}

function SideRow({ side, sceneStep, totalSteps, rowHeight, units, stacked }: { side: BuiltScene['sides'][number]; sceneStep: number; totalSteps: number; rowHeight: number; units: UnitSystem; stacked: boolean }) {
  const { analysis } = side;
  const steps = analysis.steps.length;
  const k = sideStep(sceneStep, steps);
  const current = k > 0 ? analysis.steps[k - 1] : undefined;
  const loads = current?.loadsN ?? Array<number>(analysis.studCount).fill(0);
  const flangeSize = Math.max(180, Math.min(rowHeight - 44, 420));
  const plotHeight = Math.max(150, Math.round((rowHeight - 110) / 1.35));
  const spec = useMemo(() => {
    const base = loadsThroughTimeChart(analysis, { units, currentStep: k >= 1 && k < steps ? k : k === 0 ? 1 : undefined });
    const x = (base.options.x ?? {}) as Record<string, unknown>;
    return { ...base, options: { ...base.options, height: plotHeight, x: { ...x, domain: [0.5, totalSteps + 0.5] } } };
  }, [analysis, units, k, steps, plotHeight, totalSteps]);
  const status = k === 0 ? 'All studs snug' : k >= steps && sceneStep > steps ? `Finished after ${steps} steps` : `${current?.positions ? `Studs ${current.positions.join(', ')} tensioned together` : `Stud ${current?.position} tightened`}, pass ${current?.pass}`;
  return (
    <section aria-label={side.label} className="grid items-start gap-4" style={{ gridTemplateColumns: stacked ? 'minmax(0, 1fr)' : `${flangeSize + 8}px minmax(0, 1fr)`, minHeight: rowHeight - 8 }}>
      <div className="flex flex-col items-center">
        <FlangeView loadsN={loads} targetN={analysis.targetLoadN} bandPercent={analysis.bandPercent} units={units} size={flangeSize} showLegend={false}
          activePosition={current && k === sceneStep ? (current.positions ?? current.position) : undefined} label={`${side.label}: flange ${k === 0 ? 'before the first step' : `after step ${k}`}`} />
        <p className="num text-xl font-medium" data-testid="side-status">{status}</p>
      </div>
      <PlotFigure {...spec} legend={undefined} table={undefined} large title={`${side.label} — ${side.caption}`}
        description="Each line is one stud’s load; the dot marks the stud tightened; dashed line = target, shaded = band." className="py-2" />
    </section>
  );
}
