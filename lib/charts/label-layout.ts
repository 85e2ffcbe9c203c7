/**
 * Label layout for the charts: estimated text widths, word wrapping of tick labels into columns,
 * short keys when names cannot fit, one-dimensional dodging of labels that would pile up, and a
 * row layout for labels that start at given positions. Pure functions on pixel numbers; the
 * browser check tests/e2e/chart-overlap.test.ts measures the real boxes.
 */

/** Advance of a character in em, a deliberately generous estimate for the UI's sans-serif faces. */
function charEm(ch: string): number {
  if (ch === ' ') return 0.3;
  if (/[iljI.,:;'!|()[\]]/.test(ch)) return 0.32;
  if (/[0-9]/.test(ch)) return 0.6;
  if (/[mwMW@%]/.test(ch)) return 0.92;
  if (/[A-Z±−]/.test(ch)) return 0.7;
  return 0.58;
}

/** Estimated width in px of one line of text at the given font size (no wrapping). */
export function textWidth(text: string, fontPx: number): number {
  let em = 0;
  for (const ch of text) em += charEm(ch);
  return em * fontPx;
}

/** Greedy word wrap to lines no wider than maxWidth; a single word wider than that keeps a line of its own. */
export function wrapWords(text: string, maxWidth: number, fontPx: number): string[] {
  const words = text.split(/\s+/).filter(Boolean);
  const lines: string[] = [];
  let line = '';
  for (const word of words) {
    const next = line ? `${line} ${word}` : word;
    if (!line || textWidth(next, fontPx) <= maxWidth) line = next;
    else {
      lines.push(line);
      line = word;
    }
  }
  if (line) lines.push(line);
  return lines;
}

/** Short keys for groups: A, B, … Z, then A2, B2, …. */
export function groupKey(index: number): string {
  const letter = String.fromCharCode(65 + (index % 26));
  return index < 26 ? letter : `${letter}${Math.floor(index / 26) + 1}`;
}

export interface ColumnLabels {
  /** 'wrapped': whole names on up to `maxLines` lines; 'keyed': a short key under each column. */
  mode: 'wrapped' | 'keyed';
  /** The tick text of each column ("\n" between lines). */
  ticks: string[];
  /** Lines of the tallest tick label. */
  lineCount: number;
}

/**
 * Tick labels for columns `columnWidth` px apart: each name wrapped onto at most `maxLines` lines
 * that fit the column (less a gap); when any name cannot, every column gets its key instead
 * (`keys`, by default A, B, C …) and the legend spells the names out.
 */
export function fitColumnLabels(
  labels: readonly string[],
  columnWidth: number,
  fontPx: number,
  options: { maxLines?: number; gap?: number; keys?: readonly string[] } = {},
): ColumnLabels {
  const maxLines = options.maxLines ?? 3;
  const room = columnWidth - (options.gap ?? 8);
  const wrapped = labels.map((label) => wrapWords(label, room, fontPx));
  const fits = wrapped.every((lines) => lines.length <= maxLines && lines.every((line) => textWidth(line, fontPx) <= room));
  if (fits) return { mode: 'wrapped', ticks: wrapped.map((lines) => lines.join('\n')), lineCount: Math.max(1, ...wrapped.map((l) => l.length)) };
  const keys = labels.map((_, i) => options.keys?.[i] ?? groupKey(i));
  return { mode: 'keyed', ticks: keys, lineCount: 1 };
}

/**
 * Moves labels along one axis so that neighbours are at least `gap` apart, each staying as close to
 * its wanted position as it can: overlapping labels are merged into clusters centred on the mean of
 * their wanted positions (repeated until no clusters overlap), then clusters are pushed inside
 * [low, high]. Returns the placed positions in the input order. When n labels need more than
 * high − low, they are spread evenly over the range (the caller should split them into columns).
 */
export function dodge(wanted: readonly number[], gap: number, low: number, high: number): number[] {
  const order = wanted.map((value, index) => ({ value, index })).sort((a, b) => a.value - b.value || a.index - b.index);
  const n = order.length;
  if (n === 0) return [];
  if ((n - 1) * gap > high - low) {
    const step = n === 1 ? 0 : (high - low) / (n - 1);
    const out = new Array<number>(n);
    order.forEach((item, k) => (out[item.index] = low + k * step));
    return out;
  }
  interface Cluster { start: number; items: number[]; sum: number }
  let clusters: Cluster[] = order.map((item, k) => ({ start: item.value, items: [k], sum: item.value }));
  const span = (c: Cluster) => (c.items.length - 1) * gap;
  const place = (c: Cluster) => {
    const mean = c.sum / c.items.length;
    c.start = Math.min(Math.max(mean - span(c) / 2, low), high - span(c));
  };
  for (let changed = true; changed; ) {
    changed = false;
    const next: Cluster[] = [];
    for (const cluster of clusters) {
      place(cluster);
      const prev = next[next.length - 1];
      if (prev && prev.start + span(prev) + gap > cluster.start + 1e-9) {
        prev.items.push(...cluster.items);
        prev.sum += cluster.sum;
        place(prev);
        changed = true;
      } else next.push(cluster);
    }
    clusters = next;
  }
  const out = new Array<number>(n);
  for (const cluster of clusters) cluster.items.forEach((k, i) => (out[order[k]!.index] = cluster.start + i * gap));
  return out;
}

export interface RowLabel {
  /** Where the label starts (its left edge), px. */
  start: number;
  /** Texts from the longest to the shortest acceptable. */
  variants: readonly string[];
}

export interface PlacedRowLabel {
  text: string;
  /** 0 = the row nearest the plot, 1 = the row above it. */
  row: number;
}

/**
 * Places labels that start at fixed x positions (such as pass names at pass boundaries) so none
 * overlaps the next or runs past `right`: the longest variant that fits in one row; failing that,
 * two rows (each label in the lower row when it fits there); failing that, the shortest variant
 * where it fits and no text (an empty string) for a label that fits nowhere. `freeFrom` gives, per
 * row, where the row becomes free (e.g. past an axis label drawn in the same band).
 */
export function layoutRowLabels(
  labels: readonly RowLabel[],
  fontPx: number,
  right: number,
  gap = 6,
  freeFrom: readonly [number, number] = [-Infinity, -Infinity],
): PlacedRowLabel[] {
  const levels = Math.max(1, ...labels.map((l) => l.variants.length));
  const variant = (l: RowLabel, v: number) => l.variants[Math.min(v, l.variants.length - 1)]!;
  const place = (v: number, rows: number, dropMisfits: boolean): PlacedRowLabel[] | null => {
    const ends = freeFrom.slice(0, rows).map((x) => x - gap);
    const placed: PlacedRowLabel[] = [];
    for (const label of labels) {
      const text = variant(label, v);
      const end = label.start + textWidth(text, fontPx);
      const row = end > right ? -1 : ends.findIndex((e) => e + gap <= label.start);
      if (row < 0) {
        if (!dropMisfits) return null;
        placed.push({ text: '', row: 0 });
        continue;
      }
      ends[row] = end;
      placed.push({ text, row });
    }
    return placed;
  };
  for (const rows of [1, 2]) for (let v = 0; v < levels; v += 1) {
    const placed = place(v, rows, false);
    if (placed) return placed;
  }
  return place(levels - 1, 2, true)!;
}
