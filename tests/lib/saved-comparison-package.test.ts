import { describe, expect, it } from 'vitest';
import { compareGroups } from '@/lib/analysis/compare-groups';
import { citationLine } from '@/lib/saved-comparisons/citation';
import { dataPackageDescriptor } from '@/lib/saved-comparisons/data-package';
import { DATA_TABLES, tableCsv } from '@/lib/saved-comparisons/data-tables';
import { headlineOf } from '@/lib/saved-comparisons/headline';
import { pythonScript } from '@/lib/saved-comparisons/python-script';

const facts = { slug: 'abcdefghijkl', title: 'Cross against circular', author: 'A. Researcher', createdAt: '2026-12-03T12:00:00.000Z', link: 'http://127.0.0.1:3000/compare/saved/abcdefghijkl', citation: 'c', query: { by: 'method' }, runCount: 4, softwareVersion: 'evenload 0.1.0', dataSha256: 'f'.repeat(64) };

describe('the data package descriptor', () => {
  it('names each table’s columns in the order its CSV header has them, with a unit on every load', () => {
    const descriptor = dataPackageDescriptor(facts, {});
    for (const table of DATA_TABLES) {
      const resource = descriptor.resources.find((r) => r.name === table.name);
      if (!resource || !('schema' in resource)) throw new Error(`no tabular resource for ${table.name}`);
      const header = tableCsv(table, []).trimEnd().split(',');
      expect(resource.schema.fields.map((f) => f.name)).toEqual(header);
      for (const field of resource.schema.fields.filter((f) => f.name.endsWith('_n'))) expect('unit' in field ? field.unit : undefined).toBe('N');
    }
    // Data Package v1: a package name is lower case with . _ - only.
    expect(descriptor.name).toMatch(/^[a-z0-9._-]+$/);
  });
});

describe('the headline of a frozen comparison', () => {
  // Two groups of three runs with hand-made final loads: run CV = sample SD / mean (computed).
  const run = (loads: number[]) => ({ targetLoadN: 100, finalLoadsN: loads, driftPercent: [] });
  const result = compareGroups(
    [
      { key: '1', label: 'Cross', runs: [run([99, 100, 101]), run([98, 100, 102]), run([97, 100, 103])] },
      { key: '2', label: 'Circular', runs: [run([90, 100, 110]), run([94, 100, 106]), run([92, 100, 108])] },
    ],
    { subject: 'these methods', blocks: false },
  );
  const headline = headlineOf(result);

  it('takes the mean ln run CV per group and the Welch and ANOVA figures as shown', () => {
    // Run CVs of Cross: 0.01, 0.02, 0.03 (SD 1, 2, 3 over mean 100), so the mean ln CV is ln of their geometric mean.
    expect(headline.groups[0]!.meanLnCv).toBeCloseTo((Math.log(0.01) + Math.log(0.02) + Math.log(0.03)) / 3, 12);
    expect(headline.welchLnCv!.statistic).toBe(result.tests.find((t) => t.id === 'welch-ln-cv')!.statistic);
    expect(headline.anovaLnCv!.pValue).toBe(result.tests.find((t) => t.id === 'anova-ln-cv')!.pValue);
    expect(headline.cvRatio!.label).toBe('Run CV, Circular ÷ Cross');
  });

  it('writes a script that carries the frozen figures and reads the package’s own files', () => {
    const script = pythonScript({ title: 'A "quoted" title', groupKeys: ['1', '2'], headline, dataSha256: facts.dataSha256 });
    expect(script).toContain(JSON.stringify(JSON.stringify(['1', '2'])));
    for (const table of DATA_TABLES) expect(script).toContain(table.path);
    expect(script).not.toContain('A "quoted" title');
  });

  it('cites author, date, title, link and data hash', () => {
    expect(citationLine(facts)).toBe(`A. Researcher (2026-12-03). Cross against circular. Evenload saved comparison. ${facts.link} (data sha256 ${'f'.repeat(64)}).`);
  });
});
