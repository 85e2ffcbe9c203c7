import { SimInputError } from './errors';

/**
 * Tightening orders for a flange with studs numbered 1..N clockwise from 1 (docs/REFERENCE.md §6,
 * numbering ✓ [KNM]).
 */

function requireStudCount(fn: string, studCount: number): void {
  if (!Number.isInteger(studCount) || studCount < 1) {
    throw new SimInputError(`${fn} requires a positive integer studCount`);
  }
}

/**
 * The circular order 1, 2, …, N: the order of a circular (clockwise) pass, as used for the
 * final 100 % check passes (docs/REFERENCE.md §4, ✓ [HENNIG], [HSW]).
 *
 * @throws {SimInputError} when studCount is not a positive integer.
 * @example circularOrder(4) // [1, 2, 3, 4]
 */
export function circularOrder(studCount: number): number[] {
  requireStudCount('circularOrder', studCount);
  return Array.from({ length: studCount }, (_, i) => i + 1);
}

/**
 * The usual "legacy" cross (star) order for N studs, N a multiple of 4.
 *
 * Structure (docs/REFERENCE.md §6, computed): the order is made of groups of four studs 90° apart,
 * `i, i + N/2, i + N/4, i + 3N/4`, for group starts i = 1..N/4. The group starts are ordered
 * greedily: after start 1, each next start is the remaining one farthest (on the 90° arc a group
 * covers, circularly) from the previous start, ties going to the lower number.
 *
 * That rule reproduces every table in docs/REFERENCE.md §6:
 * - 4 → 1-3-2-4, 8 → 1-5-3-7-2-6-4-8, 16 → 1-9-5-13-3-11-7-15-2-10-6-14-4-12-8-16 — those tables
 *   are **from memory, unverified** in the reference sheet;
 * - 12 → 1-7-4-10-2-8-5-11-3-9-6-12, which matches a public example ✓ [ROVER].
 * For N ≥ 20 the order is the rule's extrapolation (computed), not a checked table; confirm any
 * order against the procedure that governs the joint.
 *
 * @throws {SimInputError} when studCount is not a positive multiple of 4.
 * @example crossPatternOrder(8) // [1, 5, 3, 7, 2, 6, 4, 8]
 */
export function crossPatternOrder(studCount: number): number[] {
  if (!Number.isInteger(studCount) || studCount < 4 || studCount % 4 !== 0) {
    throw new SimInputError('crossPatternOrder requires a stud count that is a positive multiple of 4');
  }
  const quarter = studCount / 4;
  const starts = orderGroupStarts(quarter);
  const order: number[] = [];
  for (const i of starts) {
    order.push(i, i + 2 * quarter, i + quarter, i + 3 * quarter);
  }
  return order;
}

/** Orders the group starts 1..quarter: farthest from the previous start on a circular arc of `quarter` slots. */
function orderGroupStarts(quarter: number): number[] {
  const remaining = new Set(Array.from({ length: quarter }, (_, i) => i + 1));
  const starts: number[] = [1];
  remaining.delete(1);
  let previous = 1;
  while (remaining.size > 0) {
    let best = -1;
    let bestDistance = -1;
    for (const candidate of remaining) {
      const straight = Math.abs(candidate - previous);
      const distance = Math.min(straight, quarter - straight);
      if (distance > bestDistance) {
        best = candidate;
        bestDistance = distance;
      }
    }
    starts.push(best);
    remaining.delete(best);
    previous = best;
  }
  return starts;
}

/** The outcome of {@link validatePassOrder}. */
export interface PassOrderCheck {
  /** True when every position 1..studCount appears exactly once. */
  valid: boolean;
  /** Positions 1..studCount that do not appear, ascending. */
  missing: number[];
  /** Positions that appear more than once, ascending (each listed once). */
  duplicated: number[];
  /** Entries that are not an integer in 1..studCount, in the order given. */
  outOfRange: number[];
  /** A sentence naming the problems, or null when the order is valid. */
  message: string | null;
}

/**
 * Checks that a pass tightens every stud exactly once (common practice: each pass of a multi-pass
 * procedure covers all studs, docs/REFERENCE.md §4).
 *
 * @throws {SimInputError} when studCount is not a positive integer.
 * @example
 * validatePassOrder([1, 3, 3, 4], 4).message
 * // 'pass order misses position 2; repeats position 3'
 */
export function validatePassOrder(order: readonly number[], studCount: number): PassOrderCheck {
  requireStudCount('validatePassOrder', studCount);
  const counts = new Map<number, number>();
  const outOfRange: number[] = [];
  for (const position of order) {
    if (!Number.isInteger(position) || position < 1 || position > studCount) {
      outOfRange.push(position);
      continue;
    }
    counts.set(position, (counts.get(position) ?? 0) + 1);
  }
  const missing: number[] = [];
  const duplicated: number[] = [];
  for (let p = 1; p <= studCount; p += 1) {
    const n = counts.get(p) ?? 0;
    if (n === 0) missing.push(p);
    if (n > 1) duplicated.push(p);
  }
  const parts: string[] = [];
  const plural = (list: number[], word: string): string =>
    `${word}${list.length === 1 ? '' : 's'} ${list.join(', ')}`;
  if (missing.length > 0) parts.push(`misses ${plural(missing, 'position')}`);
  if (duplicated.length > 0) parts.push(`repeats ${plural(duplicated, 'position')}`);
  if (outOfRange.length > 0) {
    parts.push(`has ${outOfRange.length === 1 ? 'an entry' : 'entries'} outside 1..${studCount}: ${outOfRange.join(', ')}`);
  }
  const valid = parts.length === 0;
  return { valid, missing, duplicated, outOfRange, message: valid ? null : `pass order ${parts.join('; ')}` };
}
