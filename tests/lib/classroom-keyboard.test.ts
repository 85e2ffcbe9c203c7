import { describe, expect, it } from 'vitest';
import { actionForKey, applyAction, endOf, KEY_BINDINGS, sideStep } from '@/lib/classroom/keyboard';

// The key names are the DOM KeyboardEvent.key values (W3C UI Events KeyboardEvent key values).
describe('classroom keyboard map', () => {
  it('maps Space, the arrows, End/E, Home, N/P, PageDown/PageUp, F and ? to their actions', () => {
    expect(actionForKey(' ')).toBe('next');
    expect(actionForKey('ArrowRight')).toBe('forward');
    expect(actionForKey('ArrowLeft')).toBe('back');
    expect(actionForKey('End')).toBe('end');
    expect(actionForKey('e')).toBe('end');
    expect(actionForKey('Home')).toBe('start');
    expect(actionForKey('n')).toBe('nextScene');
    expect(actionForKey('PageDown')).toBe('nextScene');
    expect(actionForKey('P')).toBe('previousScene');
    expect(actionForKey('PageUp')).toBe('previousScene');
    expect(actionForKey('f')).toBe('fullscreen');
    expect(actionForKey('?')).toBe('help');
    expect(actionForKey('x')).toBeNull();
  });

  it('leaves browser chords (Ctrl+F, Cmd+P) to the browser', () => {
    expect(actionForKey('f', { ctrl: true })).toBeNull();
    expect(actionForKey('p', { meta: true })).toBeNull();
  });

  it('documents every action it maps in the "?" panel', () => {
    const documented = new Set(KEY_BINDINGS.map((b) => b.action));
    for (const key of [' ', 'ArrowRight', 'End', 'Home', 'n', 'p', 'f', '?', 'Escape']) expect(documented.has(actionForKey(key)!)).toBe(true);
  });
});

describe('classroom step sequencing', () => {
  const steps = (i: number) => [8, 32][i] ?? 0;
  it('steps forward and back within 0..end, End jumps to the figures and Home back to the start', () => {
    let p = { sceneIndex: 0, step: 0 };
    p = applyAction(p, 'next', 2, steps);
    p = applyAction(p, 'next', 2, steps);
    p = applyAction(p, 'next', 2, steps);
    expect(p.step).toBe(3);
    p = applyAction(p, 'back', 2, steps);
    expect(p.step).toBe(2);
    p = applyAction(p, 'end', 2, steps);
    expect(p.step).toBe(endOf(8));
    expect(applyAction(p, 'next', 2, steps).step).toBe(9);
    expect(applyAction(p, 'start', 2, steps).step).toBe(0);
    expect(applyAction({ sceneIndex: 0, step: 0 }, 'back', 2, steps).step).toBe(0);
  });

  it('moves between scenes starting each at step 0 and never past the first or last scene', () => {
    const p = applyAction({ sceneIndex: 0, step: 5 }, 'nextScene', 2, steps);
    expect(p).toEqual({ sceneIndex: 1, step: 0 });
    expect(applyAction(p, 'nextScene', 2, steps)).toEqual(p);
    expect(applyAction({ sceneIndex: 0, step: 3 }, 'previousScene', 2, steps)).toEqual({ sceneIndex: 0, step: 3 });
  });

  it('holds a shorter side at its last step while the longer one goes on', () => {
    expect(sideStep(5, 8)).toBe(5);
    expect(sideStep(20, 8)).toBe(8);
    expect(sideStep(-1, 8)).toBe(0);
  });
});
