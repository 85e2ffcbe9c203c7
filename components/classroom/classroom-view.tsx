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

  // Marks the layer once React has hydrated it, so a browser test clicks Start only when the click can work.
  useEffect(() => {
    rootRef.current?.setAttribute('data-hydrated', 'true');
  }, []);

  const start = (index = 0) => {
    setPosition({ sceneIndex: index, step: 0 });
    setPlaying(true);
    setTimeout(() => stageRef.current?.focus(), 0);
  };

  return (
    <div ref={rootRef} data-testid="classroom-root" className="fixed inset-0 z-40 overflow-auto bg-paper text-ink">
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
