import { analyseRun } from '@/lib/analysis/analyse-run';
import type { RunAnalysis } from '@/lib/analysis/types';
import { placeAmongSimulated, runFigures, sceneFigures, sideFigures, type SceneFigures } from '@/lib/classroom/figures';
import { SCENES, sceneSetup, seedFamily, sideForRealRun, simulateSide, type Library, type SceneKey } from '@/lib/classroom/scenes';
import type { NormalisedRun } from '@/lib/record/run-types';
import type { GasketForStress } from '@/lib/joints/gasket-input';

/** What the stage draws for one scene: each side's shown run and the end figures. */
export interface BuiltScene {
  key: SceneKey;
  title: string;
  sides: { key: string; label: string; caption: string; analysis: RunAnalysis; real: boolean }[];
  totalSteps: number;
  figures: SceneFigures | null;
  /** Why the scene cannot run or be saved, in sentences. */
  problems: string[];
  saveable: boolean;
  jointId: number | null;
  targetLoadN: number;
  bandPercent: number;
  /** The joint's gasket (as recorded for a measured run), for the gasket stress after each pass; null without a contact area. */
  gasket: GasketForStress | null;
}

export interface RealRunInput {
  id: number;
  label: string;
  jointId: number;
  methodId: number;
  lubricantId: number;
  bandPercent: number;
  run: NormalisedRun;
  /** The run's joint gasket as recorded (the run report's). */
  gasket?: GasketForStress | null;
}

const SUBJECT: Record<SceneKey, string> = { passes: 'these methods', pattern: 'these orders', lube: 'these lubricants', tool: 'these tools', real: 'these runs' };

export function buildScene(key: SceneKey, library: Library, jointId: number | null, seed: number, real: RealRunInput | null): BuiltScene {
  const info = SCENES[key];
  const empty = (problems: string[]): BuiltScene => ({ key, title: info.title, sides: [], totalSteps: 0, figures: null, problems, saveable: false, jointId, targetLoadN: 0, bandPercent: 10, gasket: null });
  if (key === 'real') {
    if (!real) return empty(['No run to show: record a run in one of your cohorts (Record), or pick one in the scene list.']);
    const joint = library.joints.find((j) => j.id === real.jointId);
    const method = library.methods.find((m) => m.id === real.methodId);
    const lubricant = library.lubricants.find((l) => l.id === real.lubricantId);
    if (!joint || !method || !lubricant) return empty(['The run’s joint, method or lubricant is no longer in the library, so the model cannot be set up for it.']);
    const model = sideForRealRun(joint, method, lubricant);
    const shown = simulateSide(model, joint, seed);
    const modelRuns = seedFamily(seed).map((s) => simulateSide(model, joint, s));
    const realFigures = { key: 'real', label: 'The measured run', runs: 1, ...runFigures(real.run, real.bandPercent) };
    const modelFigures = sideFigures('model', 'The model', modelRuns, real.bandPercent);
    const realCv = realFigures.cv;
    return {
      key,
      title: info.title,
      sides: [
        { key: 'real', label: 'The measured run', caption: real.label, analysis: analyseRun(real.id, real.run, { bandPercent: real.bandPercent, passPercents: model.passPercents }), real: true },
        { key: 'model', label: 'The model', caption: model.caption, analysis: analyseRun(0, shown, { bandPercent: real.bandPercent, passPercents: model.passPercents }), real: false },
      ],
      totalSteps: Math.max(real.run.steps.length, shown.steps.length),
      figures: {
        sides: [realFigures, modelFigures],
        cvReading: placeAmongSimulated(realCv, modelRuns.map((r) => runFigures(r, real.bandPercent).cv)),
        scatterReading: null,
        basis: `the measured run against ${modelRuns.length} simulated runs of the same joint, method and lubricant`,
        title: `Final loads: the measured run beside the mean of ${modelRuns.length} simulated runs`,
      },
      problems: [],
      saveable: false,
      jointId: joint.id,
      targetLoadN: real.run.targetLoadN,
      bandPercent: real.bandPercent,
      gasket: real.gasket ?? null,
    };
  }
  if (jointId === null) return empty(['No joint in the library: add one under Joints first.']);
  const setup = sceneSetup(key, library, jointId);
  if (!setup) return empty(['That joint is not in the library: pick another one.']);
  const { joint } = setup;
  const groups = setup.sides.map((side) => ({ side, runs: seedFamily(seed).map((s) => simulateSide(side, joint, s)) }));
  const sides = groups.map(({ side, runs }) => ({
    key: side.key,
    label: side.label,
    caption: side.caption,
    analysis: analyseRun(0, runs[0]!, { bandPercent: joint.bandPercent, passPercents: side.passPercents }),
    real: false,
  }));
  return {
    key,
    title: info.title,
    sides,
    totalSteps: Math.max(...sides.map((s) => s.analysis.steps.length)),
    figures: sceneFigures(groups.map(({ side, runs }) => ({ key: side.key, label: side.label, runs })), joint.bandPercent, SUBJECT[key]),
    problems: setup.missing,
    saveable: setup.missing.length === 0,
    jointId: joint.id,
    targetLoadN: joint.targetLoadN,
    bandPercent: joint.bandPercent,
    gasket: joint.gasket ?? null,
  };
}
