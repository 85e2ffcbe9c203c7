import { describe, expect, it } from 'vitest';
import { finalHoldRelaxationPercent } from '@/lib/analysis/relaxation';
import { relaxationTest } from '@/lib/analysis/compare-run-tests';
import { compareGroups } from '@/lib/analysis/compare-groups';

describe('relaxation as a compare outcome', () => {
  it('averages the % of final load lost by the hold (hand-worked: 5 % and 2.5 % → 3.75 %)', () => {
    expect(finalHoldRelaxationPercent([100_000, 80_000], [95_000, 78_000])).toBeCloseTo(3.75, 12);
    expect(finalHoldRelaxationPercent([0, 80_000], [0, 76_000])).toBeCloseTo(5, 12);
    expect(finalHoldRelaxationPercent([0], [0])).toBeNull();
  });

  it("tests two groups by Welch's ANOVA, which for two groups is Welch's t squared (hand-worked)", () => {
    // A = [2, 4] %, B = [6, 8] %: means 3 and 7, variances 2 and 2; SE = √(2/2 + 2/2) = √2, t = 4/√2 = 2.8284,
    // F = t² = 8 on (1, 2) df (Welch–Satterthwaite: (1 + 1)² / (1 + 1) = 2). With 2 df the t distribution has the
    // closed form CDF ½ + t / (2√(2 + t²)) (common practice), so p = 1 − 2.8284/√10 = 0.105573. The difference
    // 4 points has the interval 4 ± t(0.975, 2) × √2 = 4 ± 4.302653 × 1.414214 (t table value, common practice).
    const attempt = (_: string, run: () => void) => run();
    const [test] = relaxationTest([{ label: 'A', relaxationPercent: [2, 4] }, { label: 'B', relaxationPercent: [6, 8] }], attempt);
    expect(test!.id).toBe('welch-relaxation');
    expect(test!.statistic).toBeCloseTo(8, 9);
    expect(test!.pValue).toBeCloseTo(1 - 2.8284271247 / Math.sqrt(10), 6);
    expect(test!.effect).toMatchObject({ label: 'Relaxation, B − A', scale: 'points' });
    expect(test!.effect!.estimate).toBeCloseTo(4, 12);
    expect(test!.effect!.lower).toBeCloseTo(4 - 4.302653 * Math.SQRT2, 4);
    expect(test!.effect!.upper).toBeCloseTo(4 + 4.302653 * Math.SQRT2, 4);
    expect(relaxationTest([{ label: 'A', relaxationPercent: [2, 4] }, { label: 'B', relaxationPercent: [6] }], attempt)).toEqual([]);
  });

  it('puts the relaxation test first when it is the planned outcome, with each group its mean and runs held', () => {
    const run = (loads: number[], relaxationPercent: number | null) => ({ targetLoadN: 100, finalLoadsN: loads, driftPercent: [], relaxationPercent });
    const result = compareGroups(
      [
        { key: 'a', label: 'A', runs: [run([100, 98, 101], 2), run([99, 102, 97], 4), run([100, 95, 103], null)] },
        { key: 'b', label: 'B', runs: [run([100, 90, 108], 6), run([95, 104, 99], 8)] },
      ],
      { subject: 'these methods', planned: 'welch-relaxation', blocks: false },
    );
    expect(result.tests[0]).toMatchObject({ id: 'welch-relaxation', planned: true });
    expect(result.tests[0]!.statistic).toBeCloseTo(8, 9);
    expect(result.groups.map((g) => [g.meanRelaxationPercent, g.runsWithHold])).toEqual([[3, 2], [7, 2]]);
  });
});
