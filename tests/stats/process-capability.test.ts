import { describe, expect, it } from 'vitest';
import { processCapability } from '@/lib/stats';
import { relativeError } from './support/lre';

describe('processCapability', () => {
  it('processCapability Cp = 1 for s = 10 and a ±30 band of width 60 (hand: 60/(6·10))', () => {
    const r = processCapability([90, 100, 110], { target: 100, bandPercent: 30 });
    expect(relativeError(r.cp!, 1)).toBeLessThan(1e-15);
    expect(relativeError(r.cpk!, 1)).toBeLessThan(1e-15); // centred: Cpk = Cp
  });
  it('processCapability Cpk falls below Cp when the mean is off target (hand: mean 105, Cpk = 25/30)', () => {
    const r = processCapability([95, 105, 115], { target: 100, bandPercent: 30 });
    expect(relativeError(r.cpk!, 25 / 30)).toBeLessThan(1e-15);
  });
  it('processCapability gives null indices for constant loads (s = 0) and throws on bad options', () => {
    expect(processCapability([100, 100], { target: 100, bandPercent: 10 })).toMatchObject({ cp: null, cpk: null, sd: 0 });
    expect(() => processCapability([1, 2], { target: -1, bandPercent: 10 })).toThrow('processCapability requires a positive target (got -1)');
  });
});
