import { describe, expect, it } from 'vitest';
import { appliedTensionerLoad, loadTransferFactor, tensionerPressureMpa } from '@/lib/calc/tensioner';

describe('load transfer factor (docs/REFERENCE.md §4)', () => {
  it('TENS1: 1.01 + D/L above the floor ([TENS1])', () => {
    // 1.01 + 25.4/100 = 1.264 (by hand)
    expect(loadTransferFactor('tens1', 25.4, 100)).toBeCloseTo(1.264, 12);
  });

  it('TENS1: never below 1.15 ([TENS1])', () => {
    // 1.01 + 25.4/400 = 1.0735 < 1.15 → 1.15
    expect(loadTransferFactor('tens1', 25.4, 400)).toBe(1.15);
    // At the crossover D/L = 0.14 both give 1.15.
    expect(loadTransferFactor('tens1', 14, 100)).toBeCloseTo(1.15, 12);
  });

  it('TENS2: floor of 1.1 ([TENS2])', () => {
    expect(loadTransferFactor('tens2', 25.4, 400)).toBe(1.1);
    // 1.01 + 12/100 = 1.13: above TENS2's floor, below TENS1's.
    expect(loadTransferFactor('tens2', 12, 100)).toBeCloseTo(1.13, 12);
    expect(loadTransferFactor('tens1', 12, 100)).toBe(1.15);
  });

  it('rejects a zero clamped length', () => {
    expect(() => loadTransferFactor('tens1', 25.4, 0)).toThrow('Clamped length must be a positive number.');
  });
});

describe('applied load and tool pressure', () => {
  it('applied = residual × LTF ([FE-LTF]) and p = F/A', () => {
    // 100 kN × 1.2 = 120 kN; 120,000 N / 1,000 mm² = 120 MPa = 1,200 bar (by hand).
    const applied = appliedTensionerLoad(100_000, 1.2);
    expect(applied).toBeCloseTo(120_000, 8);
    expect(tensionerPressureMpa(applied, 1000)).toBeCloseTo(120, 10);
  });

  it('rejects an LTF below 1 and a zero piston area', () => {
    expect(() => appliedTensionerLoad(1000, 0.9)).toThrow('Load transfer factor must be 1 or more.');
    expect(() => tensionerPressureMpa(1000, 0)).toThrow('Piston area must be a positive number.');
  });
});
