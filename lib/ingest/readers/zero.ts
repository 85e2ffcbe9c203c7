/**
 * Zero offsets and noise of stud gauges (our own rule, stated so the preview can say it in words):
 *
 * - The first snapshot of a wide or long file is the at-rest reading before the first pull. When
 *   every stud reads within ±5 % of the target there (the file starts at rest and the offsets are
 *   small against the target), each stud's reading there is its zero offset and is removed from all
 *   its readings (tare), unless the mapping switches tare off. Every offset is reported in words
 *   ("CH3 read −0.72 kN at rest; loads corrected by +0.72 kN").
 * - A load below zero by no more than the noise band (1 % of the target) is taken as 0 and
 *   reported; a load further below zero is refused, naming line and column.
 *
 * The 5 % and 1 % are our choices (common practice: a gauge's zero drifts by well under a few per
 * cent of the working load; a bigger reading at rest means the stud is already loaded).
 */
import { cellError } from './cells';

/** Largest at-rest reading, as a fraction of the target, that still counts as a zero offset. */
export const REST_FRACTION = 0.05;
/** Readings below zero by at most this fraction of the target are noise around zero. */
export const NOISE_FRACTION = 0.01;

/** A load in kN with its sign for the report: `−0.72 kN`, `+0.72 kN`. */
export function signedKn(n: number): string {
  const kn = n / 1000;
  const text = Math.abs(kn).toFixed(2);
  return `${kn < 0 ? '−' : '+'}${text} kN`;
}

/** Removes zero offsets and judges negative loads; see the module note. */
export interface ZeroCorrector {
  /**
   * Writes the corrected loads of one snapshot (N) into `out`. The first call sets the offsets.
   * `lineOf(k)` is the file line of stud k's reading (0 = carried from before, not checked again);
   * `columnOf(k)` the column name for messages.
   * @throws AppError('invalid_input') for a load clearly below zero, naming line and column.
   */
  correct(raw: ArrayLike<number>, out: Float64Array, lineOf: (k: number) => number, columnOf: (k: number) => string): void;
  /** Judges one load that is not tared (step tables): 0 for noise below zero, else the load. */
  nearZero(n: number, line: number, column: string): number;
  /** Sentences for the preview and the parse report. */
  report(): string[];
}

/**
 * Creates the corrector for one file.
 * @param labelOf the name of stud k's channel in the report (`CH3`, `stud 3`).
 */
export function createZeroCorrector(studCount: number, targetLoadN: number, tare: 'auto' | 'off', labelOf: (k: number) => string): ZeroCorrector {
  const band = NOISE_FRACTION * targetLoadN;
  const offsets = new Float64Array(studCount);
  let decided = false;
  let tared = false;
  let notAtRest: { k: number; n: number } | null = null;
  let noiseCount = 0;
  let lowest = 0;

  const nearZero = (n: number, line: number, column: string): number => {
    if (n >= 0) return n;
    if (n < -band) {
      throw cellError(line, column, `${signedKn(n)} is a negative load, beyond the noise band of ±${(band / 1000).toFixed(2)} kN (1 % of the target); stud loads must be 0 or more. Check the gauge's zero or the sign of the column.`);
    }
    noiseCount++;
    lowest = Math.min(lowest, n);
    return 0;
  };

  const decide = (raw: ArrayLike<number>) => {
    decided = true;
    for (let k = 0; k < studCount; k++) {
      if (Math.abs(raw[k]!) > REST_FRACTION * targetLoadN && (!notAtRest || Math.abs(raw[k]!) > Math.abs(notAtRest.n))) notAtRest = { k, n: raw[k]! };
    }
    tared = tare === 'auto' && notAtRest === null;
    if (tared) for (let k = 0; k < studCount; k++) offsets[k] = raw[k]!;
  };

  return {
    nearZero,
    correct(raw, out, lineOf, columnOf) {
      if (!decided) decide(raw);
      for (let k = 0; k < studCount; k++) {
        const n = raw[k]! - offsets[k]!;
        const line = lineOf(k);
        out[k] = line > 0 ? nearZero(n, line, columnOf(k)) : Math.max(n, 0);
      }
    },
    report() {
      const sentences: string[] = [];
      if (decided && tare === 'off') sentences.push('Zero offsets kept as read (tare switched off).');
      else if (notAtRest) {
        const { k, n } = notAtRest;
        sentences.push(`The file does not start at rest (${labelOf(k)} reads ${signedKn(n)} in the first row, more than 5 % of the target), so no zero offsets were removed.`);
      } else if (tared) {
        const moved: string[] = [];
        for (let k = 0; k < studCount; k++) {
          if (Math.abs(offsets[k]!) >= 5) moved.push(`${labelOf(k)} read ${signedKn(offsets[k]!)} at rest; loads corrected by ${signedKn(-offsets[k]!)}.`);
        }
        sentences.push(...(moved.length > 0 ? moved : ['Every stud read zero at rest; no correction needed.']));
      }
      if (noiseCount > 0) {
        sentences.push(`${noiseCount} reading${noiseCount === 1 ? '' : 's'} between ${signedKn(lowest)} and 0 (inside the noise band of ±${(band / 1000).toFixed(2)} kN, 1 % of the target) taken as 0.`);
      }
      return sentences;
    },
  };
}
