import { describe, expect, it } from 'vitest';
import { mean, oneWayAnova, StatsError } from '@/lib/stats';

describe('StatsError', () => {
  it('StatsError is an Error named StatsError and survives instanceof', () => {
    const e = new StatsError('mean requires at least one value');
    expect(e).toBeInstanceOf(Error);
    expect(e).toBeInstanceOf(StatsError);
    expect(e.name).toBe('StatsError');
  });
  it('layer functions throw StatsError with the fixed grammar "<fn> requires …"', () => {
    const caught: unknown[] = [];
    for (const f of [() => mean([]), () => oneWayAnova([[1]]), () => mean([0, 1, 2, Number.NaN])]) {
      try {
        f();
      } catch (e) {
        caught.push(e);
      }
    }
    expect(caught).toHaveLength(3);
    for (const e of caught) {
      expect(e).toBeInstanceOf(StatsError);
      expect((e as StatsError).message).toMatch(/^[a-z][A-Za-z]+ requires /);
    }
    expect((caught[1] as StatsError).message).toBe('oneWayAnova requires at least two groups');
    expect((caught[2] as StatsError).message).toBe('mean requires finite values (got NaN at index 3)');
  });
});
