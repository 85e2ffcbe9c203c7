import { describe, expect, it } from 'vitest';
import { circularOrder, crossPatternOrder, validatePassOrder } from '@/lib/sim/patterns';
import { SimInputError } from '@/lib/sim/errors';

// Expected orders are the legacy cross-pattern tables of docs/REFERENCE.md §6. Those for 4, 8 and 16
// bolts are marked there "from memory, unverified"; the 12-bolt order matches a public example ✓ [ROVER].
const parse = (s: string): number[] => s.split('-').map(Number);

describe('crossPatternOrder', () => {
  it('matches the 4-bolt legacy table 1-3-2-4 (docs/REFERENCE.md §6, from memory, unverified)', () => {
    expect(crossPatternOrder(4)).toEqual(parse('1-3-2-4'));
  });

  it('matches the 8-bolt legacy table 1-5-3-7-2-6-4-8 (docs/REFERENCE.md §6, from memory, unverified)', () => {
    expect(crossPatternOrder(8)).toEqual(parse('1-5-3-7-2-6-4-8'));
  });

  it('matches the 12-bolt order 1-7-4-10-2-8-5-11-3-9-6-12 (docs/REFERENCE.md §6 ✓ [ROVER])', () => {
    expect(crossPatternOrder(12)).toEqual(parse('1-7-4-10-2-8-5-11-3-9-6-12'));
  });

  it('matches the 16-bolt legacy table (docs/REFERENCE.md §6, from memory, unverified)', () => {
    expect(crossPatternOrder(16)).toEqual(parse('1-9-5-13-3-11-7-15-2-10-6-14-4-12-8-16'));
  });

  it('is built of groups of four studs 90° apart for every multiple of 4 up to 64 (docs/REFERENCE.md §6 structure)', () => {
    for (let n = 4; n <= 64; n += 4) {
      const order = crossPatternOrder(n);
      expect(validatePassOrder(order, n).valid).toBe(true);
      for (let g = 0; g < n; g += 4) {
        const [a, b, c, d] = order.slice(g, g + 4) as [number, number, number, number];
        expect([b - a, c - a, d - a]).toEqual([n / 2, n / 4, (3 * n) / 4]);
      }
    }
  });

  it('rejects stud counts that are not a positive multiple of 4', () => {
    for (const bad of [0, 2, 6, 10, -4, 8.5]) {
      expect(() => crossPatternOrder(bad)).toThrow(SimInputError);
    }
  });
});

describe('circularOrder', () => {
  it('is 1..N clockwise (docs/REFERENCE.md §6 numbering ✓ [KNM])', () => {
    expect(circularOrder(8)).toEqual([1, 2, 3, 4, 5, 6, 7, 8]);
    expect(() => circularOrder(0)).toThrow('circularOrder requires a positive integer studCount');
  });
});

describe('validatePassOrder', () => {
  it('accepts an order that covers every stud once', () => {
    expect(validatePassOrder([1, 5, 3, 7, 2, 6, 4, 8], 8)).toEqual({
      valid: true,
      missing: [],
      duplicated: [],
      outOfRange: [],
      message: null,
    });
  });

  it('names a missing and a duplicated position', () => {
    const check = validatePassOrder([1, 5, 3, 7, 2, 6, 4, 4], 8);
    expect(check.valid).toBe(false);
    expect(check.missing).toEqual([8]);
    expect(check.duplicated).toEqual([4]);
    expect(check.message).toBe('pass order misses position 8; repeats position 4');
  });

  it('names several missing positions and entries outside 1..N', () => {
    const check = validatePassOrder([1, 2, 9, 0, 2.5], 4);
    expect(check.missing).toEqual([3, 4]);
    expect(check.outOfRange).toEqual([9, 0, 2.5]);
    expect(check.message).toBe('pass order misses positions 3, 4; has entries outside 1..4: 9, 0, 2.5');
  });

  it('reports an empty pass as missing every position', () => {
    expect(validatePassOrder([], 3).missing).toEqual([1, 2, 3]);
  });
});
