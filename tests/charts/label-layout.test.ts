import { describe, expect, it } from 'vitest';
import { dodge, fitColumnLabels, groupKey, layoutRowLabels, textWidth, wrapWords } from '@/lib/charts/label-layout';

// Expected values are worked out by hand from the definitions in lib/charts/label-layout.ts.
describe('textWidth and wrapWords', () => {
  it('grows with the text and the font size, and wide letters take more room than narrow ones', () => {
    expect(textWidth('', 13)).toBe(0);
    expect(textWidth('abc', 26)).toBeCloseTo(2 * textWidth('abc', 13), 10);
    expect(textWidth('MMMM', 13)).toBeGreaterThan(textWidth('iiii', 13));
  });
  it('wraps at word boundaries so every line fits, keeping an over-long word whole on its own line', () => {
    const lines = wrapWords('Copper-graphite anti-seize compound on threads', 90, 13);
    expect(lines.join(' ')).toBe('Copper-graphite anti-seize compound on threads');
    for (const line of lines.filter((l) => l.includes(' '))) expect(textWidth(line, 13)).toBeLessThanOrEqual(90);
    expect(wrapWords('Supercalifragilistic', 20, 13)).toEqual(['Supercalifragilistic']);
    expect(wrapWords('  ', 50, 13)).toEqual([]);
  });
});

describe('fitColumnLabels', () => {
  it('keeps whole names on lines when they fit the columns', () => {
    const fitted = fitColumnLabels(['Dry', 'Moly paste'], 120, 13);
    expect(fitted).toEqual({ mode: 'wrapped', ticks: ['Dry', 'Moly paste'], lineCount: 1 });
    const two = fitColumnLabels(['Molybdenum disulphide paste', 'Dry'], 110, 13);
    expect(two.mode).toBe('wrapped');
    expect(two.lineCount).toBeGreaterThan(1);
    for (const tick of two.ticks) for (const line of tick.split('\n')) expect(textWidth(line, 13)).toBeLessThanOrEqual(102);
  });
  it('falls back to keys for every column when one name cannot fit', () => {
    const fitted = fitColumnLabels(['Dry', 'Food-grade white grease on threads and nut faces'], 40, 13);
    expect(fitted).toEqual({ mode: 'keyed', ticks: ['A', 'B'], lineCount: 1 });
    expect(fitColumnLabels(['Pass 1 (30 %)', 'Pass 2 (60 %)'], 20, 13, { keys: ['1', '2'] }).ticks).toEqual(['1', '2']);
  });
  it('names keys A … Z, then A2', () => {
    expect([0, 1, 25, 26, 27].map(groupKey)).toEqual(['A', 'B', 'Z', 'A2', 'B2']);
  });
});

describe('dodge', () => {
  it('leaves labels that are already apart where they are', () => {
    expect(dodge([10, 50, 30], 12, 0, 100)).toEqual([10, 50, 30]);
  });
  it('spreads a pile symmetrically about its mean, at exactly the gap, in the input order', () => {
    // Three labels wanted at 50: centred on 50 → 38, 50, 62.
    expect(dodge([50, 50, 50], 12, 0, 100)).toEqual([38, 50, 62]);
    const placed = dodge([52, 49, 50, 51], 10, 0, 200);
    const sorted = [...placed].sort((a, b) => a - b);
    for (let i = 1; i < sorted.length; i += 1) expect(sorted[i]! - sorted[i - 1]!).toBeCloseTo(10, 9);
    // Mean kept: (52 + 49 + 50 + 51) / 4 = 50.5; order kept: the label wanted lowest stays lowest.
    expect(placed.reduce((a, b) => a + b, 0) / 4).toBeCloseTo(50.5, 9);
    expect(placed[1]).toBe(Math.min(...placed));
  });
  it('pushes a cluster back inside the range, and merges a cluster that then touches its neighbour', () => {
    expect(dodge([98, 99], 10, 0, 100)).toEqual([90, 100]);
    const placed = dodge([80, 99, 99], 10, 0, 100);
    expect([...placed].sort((a, b) => a - b)).toEqual([80, 90, 100]);
  });
  it('spreads evenly over the range when the labels cannot fit it', () => {
    expect(dodge([5, 5, 5], 100, 0, 10)).toEqual([0, 5, 10]);
    expect(dodge([], 10, 0, 10)).toEqual([]);
  });
});

describe('layoutRowLabels', () => {
  const labels = [
    { start: 0, variants: ['Pass 1 (30 %)', 'Pass 1', 'P1'] },
    { start: 60, variants: ['Pass 2 (60 %)', 'Pass 2', 'P2'] },
  ];
  it('keeps the long names in one row when there is room', () => {
    const wide = [{ ...labels[0]!, start: 0 }, { ...labels[1]!, start: 200 }];
    expect(layoutRowLabels(wide, 13, 600)).toEqual([
      { text: 'Pass 1 (30 %)', row: 0 },
      { text: 'Pass 2 (60 %)', row: 0 },
    ]);
  });
  it('shortens before it stacks, and never lets two labels of a row overlap', () => {
    const placed = layoutRowLabels(labels, 13, 600);
    expect(placed.map((p) => p.text)).toEqual(['Pass 1', 'Pass 2']);
    expect(placed.every((p) => p.row === 0)).toBe(true);
    const tight = layoutRowLabels([{ start: 0, variants: ['Pass 1'] }, { start: 20, variants: ['Pass 2'] }], 13, 600);
    expect(tight.map((p) => p.row)).toEqual([0, 1]);
  });
  it('keeps a row clear of a blocked start and leaves out a label that fits nowhere', () => {
    // "P1" is 1.3 em = 16.9 px wide; "P2" at 20 needs 6 px of gap, so it belongs in the upper row,
    // which is free only from x = 100: it is left out. Without the block it goes up.
    const two = [{ start: 0, variants: ['P1'] }, { start: 20, variants: ['P2'] }];
    expect(layoutRowLabels(two, 13, 600, 6, [-Infinity, 100])).toEqual([{ text: 'P1', row: 0 }, { text: '', row: 0 }]);
    expect(layoutRowLabels(two, 13, 600)).toEqual([{ text: 'P1', row: 0 }, { text: 'P2', row: 1 }]);
    const crowded = layoutRowLabels(
      [0, 4, 8].map((start, i) => ({ start, variants: [`P${i + 1}`] })),
      13,
      600,
    );
    expect(crowded).toEqual([{ text: 'P1', row: 0 }, { text: 'P2', row: 1 }, { text: '', row: 0 }]);
    expect(layoutRowLabels([{ start: 590, variants: ['Pass 9'] }], 13, 600)).toEqual([{ text: '', row: 0 }]);
  });
});
