'use client';

import { useCallback, useEffect, useMemo, useRef, useState } from 'react';
import { usePathname, useRouter } from 'next/navigation';
import type { UnitSystem } from '@/lib/calc/units';
import { actionForKey, applyAction, type StagePosition } from '@/lib/classroom/keyboard';
import { sceneOrderParam, type Library, type SceneKey } from '@/lib/classroom/scenes';
import type { ClassroomCohort, ClassroomRunOption } from '@/lib/data/classroom';
import { KeysPanel } from './keys-panel';
import { buildScene, type BuiltScene, type RealRunInput } from './scene-model';
import { ScenePicker } from './scene-picker';
import { Stage } from './stage';

export type RealRunData = RealRunInput;

export interface ClassroomViewProps {
  library: Library;
  cohorts: ClassroomCohort[];
  realRuns: ClassroomRunOption[];
  realRun: RealRunData | null;
  initialOrder: SceneKey[];
  initialJointId: number | null;
  seed: number;
  units: UnitSystem;
}

/**
 * The classroom: scene picker (`scene-picker.tsx`), then a keyboard-driven stage for each chosen
 * scene (`stage.tsx`, with the figures at its end in `end-figures.tsx`) and the keys (`keys-panel.tsx`).
 */
export function ClassroomView({ library, cohorts, realRuns, realRun, initialOrder, initialJointId, seed, units }: ClassroomViewProps) {
  const router = useRouter();
  const pathname = usePathname();
  const [order, setOrder] = useState<SceneKey[]>(initialOrder);
  const [jointId, setJointId] = useState<number | null>(initialJointId);
  const [playing, setPlaying] = useState(false);
  const [position, setPosition] = useState<StagePosition>({ sceneIndex: 0, step: 0 });
  const [help, setHelp] = useState(false);
  const rootRef = useRef<HTMLDivElement>(null);
  const stageRef = useRef<HTMLDivElement>(null);

  const replaceUrl = useCallback(
    (next: { scenes?: SceneKey[]; joint?: number | null; run?: number }) => {
      const params = new URLSearchParams(window.location.search);
      if (next.scenes) params.set('scenes', sceneOrderParam(next.scenes));
      if (next.joint !== undefined && next.joint !== null) params.set('joint', String(next.joint));
      if (next.run !== undefined) params.set('run', String(next.run));
      router.replace(`${pathname}?${params.toString()}`, { scroll: false });
    },
    [router, pathname],
  );

  const scenes = useMemo<BuiltScene[]>(() => (playing ? order.map((key) => buildScene(key, library, jointId, seed, realRun)) : []), [playing, order, library, jointId, seed, realRun]);
  const scene = scenes[position.sceneIndex];

  const act = useCallback(
    (action: ReturnType<typeof actionForKey>) => {
      if (!action) return;
      if (action === 'help') return setHelp((h) => !h);
      if (action === 'close') return setHelp(false);
      if (action === 'fullscreen') {
        if (document.fullscreenElement) void document.exitFullscreen();
        else void rootRef.current?.requestFullscreen?.().catch(() => undefined);
        return;
      }
      setPosition((p) => applyAction(p, action, scenes.length, (i) => scenes[i]?.totalSteps ?? 0));
    },
    [scenes],
  );

  useEffect(() => {
    if (!playing) return;
    const onKey = (event: KeyboardEvent) => {
      const target = event.target as HTMLElement | null;
      const tag = target?.tagName;
      if (tag === 'INPUT' || tag === 'SELECT' || tag === 'TEXTAREA') return;
      if ((tag === 'BUTTON' || tag === 'A') && (event.key === ' ' || event.key === 'Enter')) return;
      const action = actionForKey(event.key, { ctrl: event.ctrlKey, meta: event.metaKey, alt: event.altKey });
      if (!action) return;
      event.preventDefault();
      act(action);
    };
    window.addEventListener('keydown', onKey);
    return () => window.removeEventListener('keydown', onKey);
  }, [playing, act]);

  const start = (index = 0) => {
    setPosition({ sceneIndex: index, step: 0 });
    setPlaying(true);
    setTimeout(() => stageRef.current?.focus(), 0);
  };

  return (
    <div ref={rootRef} className="fixed inset-0 z-40 overflow-auto bg-paper text-ink">
      {!playing ? (
        <ScenePicker
          order={order}
          onOrder={(next) => {
            setOrder(next);
            replaceUrl({ scenes: next });
          }}
          library={library}
          jointId={jointId}
          onJoint={(id) => {
            setJointId(id);
            replaceUrl({ joint: id });
          }}
          realRuns={realRuns}
          realRun={realRun}
          onRealRun={(id) => replaceUrl({ run: id })}
          onStart={start}
        />
      ) : scene ? (
        <div ref={stageRef} tabIndex={-1} className="outline-none" aria-label={`Scene ${position.sceneIndex + 1} of ${scenes.length}: ${scene.title}`}>
          <Stage scene={scene} step={position.step} sceneNumber={position.sceneIndex + 1} sceneCount={scenes.length} units={units} cohorts={cohorts} seed={seed}
            onBack={() => setPlaying(false)} onHelp={() => setHelp(true)} />
        </div>
      ) : null}
      {help ? <KeysPanel onClose={() => setHelp(false)} /> : null}
    </div>
  );
}
<<<<<<< HEAD
=======

function ScenePicker(props: {
  order: SceneKey[];
  onOrder: (order: SceneKey[]) => void;
  library: Library;
  jointId: number | null;
  onJoint: (id: number) => void;
  realRuns: ClassroomRunOption[];
  realRun: RealRunData | null;
  onRealRun: (id: number) => void;
  onStart: (index?: number) => void;
}) {
  const { order, onOrder, library, jointId, onJoint, realRuns, realRun, onRealRun, onStart } = props;
  const unused = SCENE_KEYS.filter((k) => !order.includes(k));
  return (
    <div className="mx-auto max-w-6xl space-y-6 px-8 py-8">
      <div className="flex flex-wrap items-end justify-between gap-4">
        <h1 className="text-room-lg font-semibold">Classroom</h1>
        <a href="/" className="text-xl text-muted underline">Leave the classroom</a>
      </div>
      <p className="text-2xl text-muted">Pick the scenes and their order, then start. Keys: Space for the next step, E or End for the figures, N and P for the scenes, F for full screen, ? for all keys.</p>
      <div className="grid gap-6 lg:grid-cols-[1fr_22rem]">
        <section aria-labelledby="scenes-heading" className="space-y-3">
          <h2 id="scenes-heading" className="text-3xl font-semibold">Scenes, in order</h2>
          <ol className="space-y-3">
            {order.map((key, index) => (
              <li key={key} className="flex flex-wrap items-center gap-3 rounded-card border border-rule bg-panel p-4">
                <span className="num text-3xl font-semibold text-muted">{index + 1}</span>
                <div className="min-w-0 flex-1">
                  <p className="text-3xl font-semibold">{SCENES[key].title}</p>
                  <p className="text-lg text-muted">{SCENES[key].lesson}</p>
                </div>
                <div className="flex gap-2 text-lg">
                  <button type="button" className="rounded-md border border-rule px-3 py-2 disabled:opacity-40" disabled={index === 0} onClick={() => onOrder(moveScene(order, index, -1))} aria-label={`Move ${SCENES[key].title} up`}>Up</button>
                  <button type="button" className="rounded-md border border-rule px-3 py-2 disabled:opacity-40" disabled={index === order.length - 1} onClick={() => onOrder(moveScene(order, index, 1))} aria-label={`Move ${SCENES[key].title} down`}>Down</button>
                  <button type="button" className="rounded-md border border-rule px-3 py-2 disabled:opacity-40" disabled={order.length === 1} onClick={() => onOrder(toggleScene(order, key))} aria-label={`Leave out ${SCENES[key].title}`}>Leave out</button>
                  <button type="button" className="rounded-md bg-accent px-3 py-2 font-semibold text-accent-ink" onClick={() => onStart(index)}>Start here</button>
                </div>
              </li>
            ))}
          </ol>
          {unused.length ? (
            <div className="flex flex-wrap items-center gap-2 text-lg">
              <span className="text-muted">Add a scene:</span>
              {unused.map((key) => (
                <button key={key} type="button" className="rounded-md border border-rule px-3 py-2" onClick={() => onOrder(toggleScene(order, key))}>+ {SCENES[key].title}</button>
              ))}
            </div>
          ) : null}
        </section>
        <aside className="space-y-4">
          <label className="block text-xl">
            <span className="font-semibold">Joint for the simulated scenes</span>
            <select className="mt-1 block w-full rounded-md border border-rule bg-panel px-3 py-2 text-xl" value={jointId ?? ''} onChange={(e) => onJoint(Number(e.target.value))}>
              {library.joints.map((j) => (
                <option key={j.id} value={j.id}>{j.name} ({j.studCount} studs)</option>
              ))}
            </select>
          </label>
          {library.joints.length === 0 ? <p className="text-lg text-danger">No joint in the library yet: add one under Joints, then come back.</p> : null}
          <label className="block text-xl">
            <span className="font-semibold">Real run for “{SCENES.real.title}”</span>
            <select className="mt-1 block w-full rounded-md border border-rule bg-panel px-3 py-2 text-lg" value={realRun?.id ?? ''} onChange={(e) => onRealRun(Number(e.target.value))}>
              {realRuns.length === 0 ? <option value="">No runs in your cohorts yet</option> : null}
              {realRuns.map((r) => (
                <option key={r.id} value={r.id}>{r.label}</option>
              ))}
            </select>
          </label>
          {realRuns.length === 0 ? <p className="text-lg text-muted">Record a trainee’s run in one of your cohorts to put it beside the model.</p> : null}
          <button type="button" className="w-full rounded-md bg-accent px-4 py-3 text-2xl font-semibold text-accent-ink" onClick={() => onStart(0)}>Start the lesson</button>
          <CautionBlock variant="classroom" />
        </aside>
      </div>
    </div>
  );
}

function Stage({ scene, step, sceneNumber, sceneCount, units, cohorts, seed, onBack, onHelp }: {
  scene: BuiltScene; step: number; sceneNumber: number; sceneCount: number; units: UnitSystem; cohorts: ClassroomCohort[]; seed: number; onBack: () => void; onHelp: () => void;
}) {
  const { width, height } = useViewport();
  // On a narrow screen the flange sits above the chart, so the chart keeps the whole width.
  const stacked = width < 768;
  const atEnd = step >= endOf(scene.totalSteps);
  const headerHeight = 104;
  const rowHeight = Math.max(240, Math.floor((height - headerHeight - 16) / Math.max(1, scene.sides.length)));
  return (
    <div className="flex min-h-screen flex-col px-6 py-3">
      <header className="flex flex-wrap items-center gap-x-8 gap-y-1" style={{ minHeight: headerHeight - 12 }}>
        <div className="min-w-0 flex-1">
          <h1 className="text-room font-semibold">{scene.title}</h1>
          <p className="num text-2xl text-muted" aria-live="polite">
            Scene {sceneNumber} of {sceneCount} · {atEnd ? 'the figures' : step === 0 ? 'all studs snug, nothing tightened yet' : `step ${step} of ${scene.totalSteps}`}
          </p>
        </div>
        {!atEnd && scene.sides.length ? <DeviationLegend bandPercent={scene.bandPercent} large className="w-[26rem]" /> : null}
        <div className="flex gap-2 text-lg">
          <button type="button" onClick={onHelp} className="rounded-md border border-rule px-3 py-1">Keys (?)</button>
          <button type="button" onClick={onBack} className="rounded-md border border-rule px-3 py-1">Scenes</button>
        </div>
      </header>
      {scene.problems.length && !scene.sides.length ? (
        <div className="mt-8 space-y-3 text-3xl">{scene.problems.map((p) => <p key={p}>{p}</p>)}</div>
      ) : atEnd ? (
        <EndFigures scene={scene} cohorts={cohorts} seed={seed} />
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
  const status = k === 0 ? 'All studs snug' : k >= steps && sceneStep > steps ? `Finished after ${steps} steps` : `Stud ${current?.position} tightened, pass ${current?.pass}`;
  return (
    <section aria-label={side.label} className="grid items-start gap-4" style={{ gridTemplateColumns: stacked ? 'minmax(0, 1fr)' : `${flangeSize + 8}px minmax(0, 1fr)`, minHeight: rowHeight - 8 }}>
      <div className="flex flex-col items-center">
        <FlangeView loadsN={loads} targetN={analysis.targetLoadN} bandPercent={analysis.bandPercent} units={units} size={flangeSize} showLegend={false}
          activePosition={current && k === sceneStep ? current.position : undefined} label={`${side.label}: flange ${k === 0 ? 'before the first step' : `after step ${k}`}`} />
        <p className="num text-xl font-medium" data-testid="side-status">{status}</p>
      </div>
      <PlotFigure {...spec} legend={undefined} table={undefined} large title={`${side.label} — ${side.caption}`}
        description="Each line is one stud’s load; the dot marks the stud tightened; dashed line = target, shaded = band." className="py-2" />
    </section>
  );
}

function EndFigures({ scene, cohorts, seed }: { scene: BuiltScene; cohorts: ClassroomCohort[]; seed: number }) {
  const figures = scene.figures;
  const [state, formAction, pending] = useActionState(saveSceneAction, INITIAL_SAVE_SCENE_STATE);
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
        <h2 id="figures-heading" className="text-2xl font-semibold">Final loads, mean {figures.basis}</h2>
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
      </section>
      <aside className="space-y-4">
        <CautionBlock variant="classroom" />
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
              {state.status === 'saved' ? (
                <p className="text-good">
                  {state.message} <a className="underline" href={state.compareHref}>Compare them</a>
                </p>
              ) : null}
            </div>
          </form>
        ) : null}
      </aside>
    </div>
  );
}

function KeysPanel({ onClose }: { onClose: () => void }) {
  return (
    <div role="dialog" aria-modal="true" aria-labelledby="keys-heading" className="fixed inset-0 z-50 flex items-center justify-center bg-ink/40 p-6">
      <div className="w-full max-w-3xl rounded-card border border-rule bg-panel p-6 text-ink shadow-lg">
        <h2 id="keys-heading" className="text-room font-semibold">Keys</h2>
        <table className="mt-4 w-full text-2xl">
          <tbody>
            {KEY_BINDINGS.map((b) => (
              <tr key={b.action} className="border-b border-rule">
                <th scope="row" className="py-2 pr-6 text-left font-semibold">{b.keys.map((k) => <kbd key={k} className="mr-2 rounded border border-rule bg-paper px-2">{k}</kbd>)}</th>
                <td className="py-2">{b.does}</td>
              </tr>
            ))}
          </tbody>
        </table>
        <button type="button" autoFocus onClick={onClose} className="mt-4 rounded-md bg-accent px-4 py-2 text-xl font-semibold text-accent-ink">Close</button>
      </div>
    </div>
  );
}
>>>>>>> ich
