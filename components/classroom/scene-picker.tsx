'use client';

import { CautionBlock } from '@/components/caution-block';
import { moveScene, SCENE_KEYS, SCENES, toggleScene, type Library, type SceneKey } from '@/lib/classroom/scenes';
import type { ClassroomRunOption } from '@/lib/data/classroom';
import type { RealRunInput } from './scene-model';

/** Before the lesson: the scenes and their order, the joint for the simulated scenes and the real run. */
export function ScenePicker(props: {
  order: SceneKey[];
  onOrder: (order: SceneKey[]) => void;
  library: Library;
  jointId: number | null;
  onJoint: (id: number) => void;
  realRuns: ClassroomRunOption[];
  realRun: RealRunInput | null;
  onRealRun: (id: number) => void;
  onStart: (index?: number) => void;
}) {
  const { order, onOrder, library, jointId, onJoint, realRuns, realRun, onRealRun, onStart } = props;
  const unused = SCENE_KEYS.filter((k) => !order.includes(k));
  return (
    <div className="mx-auto max-w-6xl space-y-6 px-4 py-8 sm:px-8">
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
                <div className="flex flex-wrap gap-2 text-lg">
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
            <span className="font-semibold">Measured run for “{SCENES.real.title}”</span>
            <select className="mt-1 block w-full rounded-md border border-rule bg-panel px-3 py-2 text-lg" value={realRun?.id ?? ''} onChange={(e) => onRealRun(Number(e.target.value))}>
              {realRuns.length === 0 ? <option value="">No measured runs in your cohorts yet</option> : null}
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

