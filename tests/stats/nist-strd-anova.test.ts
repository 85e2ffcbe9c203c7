import { afterAll, describe, expect, it } from 'vitest';
import { oneWayAnova } from '@/lib/stats';
import { readAnova } from './support/nist-strd';
import { lre, printLreTable } from './support/lre';
import { referencePath } from './support/reference-path';

// Source of every expected value: NIST StRD Analysis of Variance, certified block on lines 41-47
// (AtmWtAg: lines 42-48) of each file in tests/fixtures/reference/nist-strd/anova.
// Required F bars (brief): >= 12 on SiRstv and SmLs01-03, >= 8 on AtmWtAg and SmLs04-06,
// >= 2.5 on SmLs07-09. The other quantities are held to the same bar as F.
const SETS: { name: string; bar: number }[] = [
  { name: 'SiRstv', bar: 12 },
  { name: 'SmLs01', bar: 12 },
  { name: 'SmLs02', bar: 12 },
  { name: 'SmLs03', bar: 12 },
  { name: 'AtmWtAg', bar: 8 },
  { name: 'SmLs04', bar: 8 },
  { name: 'SmLs05', bar: 8 },
  { name: 'SmLs06', bar: 8 },
  { name: 'SmLs07', bar: 2.5 },
  { name: 'SmLs08', bar: 2.5 },
  { name: 'SmLs09', bar: 2.5 },
];

const rows: { name: string; values: (number | null)[] }[] = [];
afterAll(() =>
  printLreTable('NIST StRD one-way ANOVA', ['SSB', 'SSW', 'MSB', 'MSW', 'F', 'R²', 'resid SD'], rows),
);

describe('oneWayAnova against NIST StRD', () => {
  for (const set of SETS) {
    it(`oneWayAnova matches NIST StRD ${set.name} certified df, SS, MS, F, R² and residual SD (LRE >= ${set.bar})`, () => {
      const c = readAnova(referencePath('nist-strd', 'anova', `${set.name}.dat`));
      const r = oneWayAnova(c.groups);
      expect(r.dfBetween).toBe(c.dfBetween);
      expect(r.dfWithin).toBe(c.dfWithin);
      const values = [
        lre(r.ssBetween, c.ssBetween),
        lre(r.ssWithin, c.ssWithin),
        lre(r.msBetween, c.msBetween),
        lre(r.msWithin, c.msWithin),
        lre(r.statistic, c.f),
        lre(r.rSquared, c.rSquared),
        lre(r.residualSd, c.residualSd),
      ];
      rows.push({ name: set.name, values });
      for (const v of values) expect(v).toBeGreaterThanOrEqual(set.bar);
      expect(r.pValue).toBeGreaterThanOrEqual(0);
      expect(r.pValue).toBeLessThanOrEqual(1);
    });
  }
});
