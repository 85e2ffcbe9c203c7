/**
 * The classroom's keyboard map and step sequencing, as pure functions (the page only wires them
 * to keydown). Keys follow what presentation tools and media players commonly use (common practice).
 */

export type ClassroomAction = 'next' | 'forward' | 'back' | 'end' | 'start' | 'nextScene' | 'previousScene' | 'fullscreen' | 'help' | 'close';

export interface KeyBinding {
  keys: string[];
  action: ClassroomAction;
  /** What the key does, for the "?" panel. */
  does: string;
}

export const KEY_BINDINGS: readonly KeyBinding[] = [
  { keys: ['Space'], action: 'next', does: 'Next step' },
  { keys: ['→', '←'], action: 'forward', does: 'Step forward / back' },
  { keys: ['End', 'E'], action: 'end', does: 'Run to the end and show the figures' },
  { keys: ['Home'], action: 'start', does: 'Back to the start' },
  { keys: ['N', 'Page Down'], action: 'nextScene', does: 'Next scene' },
  { keys: ['P', 'Page Up'], action: 'previousScene', does: 'Previous scene' },
  { keys: ['F'], action: 'fullscreen', does: 'Full screen on / off' },
  { keys: ['?'], action: 'help', does: 'Show or hide these keys' },
  { keys: ['Esc'], action: 'close', does: 'Close this panel' },
];

/** The action of a keydown (KeyboardEvent.key), or null. Modifier chords are left to the browser. */
export function actionForKey(key: string, modifiers: { ctrl?: boolean; meta?: boolean; alt?: boolean } = {}): ClassroomAction | null {
  if (modifiers.ctrl || modifiers.meta || modifiers.alt) return null;
  switch (key) {
    case ' ':
    case 'Spacebar':
      return 'next';
    case 'ArrowRight':
      return 'forward';
    case 'ArrowLeft':
      return 'back';
    case 'End':
    case 'e':
    case 'E':
      return 'end';
    case 'Home':
      return 'start';
    case 'n':
    case 'N':
    case 'PageDown':
      return 'nextScene';
    case 'p':
    case 'P':
    case 'PageUp':
      return 'previousScene';
    case 'f':
    case 'F':
      return 'fullscreen';
    case '?':
      return 'help';
    case 'Escape':
      return 'close';
    default:
      return null;
  }
}

/**
 * Where a scene is: `step` 0 = every stud snug, 1..totalSteps = after that step (on every side,
 * a side with fewer steps stays at its end), totalSteps + 1 = the end figures.
 */
export interface StagePosition {
  sceneIndex: number;
  step: number;
}

/** The scene's last position (the end figures). */
export const endOf = (totalSteps: number): number => totalSteps + 1;

/**
 * The next position after an action. `totalSteps(i)` is the longest side of scene i. Moving to
 * another scene starts it at step 0; the scene index never leaves 0..sceneCount−1.
 */
export function applyAction(position: StagePosition, action: ClassroomAction, sceneCount: number, totalSteps: (sceneIndex: number) => number): StagePosition {
  const total = totalSteps(position.sceneIndex);
  const clampStep = (step: number) => Math.min(endOf(total), Math.max(0, step));
  switch (action) {
    case 'next':
    case 'forward':
      return { ...position, step: clampStep(position.step + 1) };
    case 'back':
      return { ...position, step: clampStep(position.step - 1) };
    case 'end':
      return { ...position, step: endOf(total) };
    case 'start':
      return { ...position, step: 0 };
    case 'nextScene':
      return position.sceneIndex + 1 < sceneCount ? { sceneIndex: position.sceneIndex + 1, step: 0 } : position;
    case 'previousScene':
      return position.sceneIndex > 0 ? { sceneIndex: position.sceneIndex - 1, step: 0 } : position;
    default:
      return position;
  }
}

/** The step a side shows at a scene step: a side with fewer steps stays at its last one. */
export function sideStep(sceneStep: number, sideSteps: number): number {
  return Math.min(Math.max(0, sceneStep), sideSteps);
}
