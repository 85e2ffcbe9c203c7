import { describe, expect, it } from 'vitest';
import { compareGroups } from '@/lib/analysis/compare-groups';
import { citationLine } from '@/lib/saved-comparisons/citation';
import { dataPackageDescriptor } from '@/lib/saved-comparisons/data-package';
import { DATA_TABLES, dataTablesOf, tableCsv } from '@/lib/saved-comparisons/data-tables';
import { headlineOf } from '@/lib/saved-comparisons/headline';
import { pythonScript } from '@/lib/saved-comparisons/python-script';

const facts = { slug: 'abcdefghijkl', title: 'Cross against circular', author: 'A. Researcher', createdAt: '2026-12-03T12:00:00.000Z', link: 'http://127.0.0.1:3000/compare/saved/abcdefghijkl', citation: 'c', query: { by: 'method' }, runCount: 4, softwareVersion: 'evenload 0.1.0', dataSha256: 'f'.repeat(64), layout: 2 as const };

describe('the data package descriptor', () => {
  it('names each table’s columns in the order its CSV header has them, with a unit on every load', () => {
    const descriptor = dataPackageDescriptor(facts, {});
    for (const table of DATA_TABLES) {
      const resource = descriptor.resources.find((r) => r.name === table.name);
      if (!resource || !('schema' in resource)) throw new Error(`no tabular resource for ${table.name}`);
      const header = tableCsv(table, []).trimEnd().split(',');
      expect(resource.schema.fields.map((f) => f.name)).toEqual(header);
      for (const field of resource.schema.fields.filter((f) => f.name.endsWith('_n'))) expect('unit' in field ? field.unit : undefined).toBe('N');
      for (const field of resource.schema.fields.filter((f) => f.name.endsWith('_mpa'))) expect('unit' in field ? field.unit : undefined).toBe('MPa');
    }
    const runs = descriptor.resources.find((r) => r.name === 'runs');
    expect(runs && 'schema' in runs ? runs.schema.fields.map((f) => f.name).slice(-2) : []).toEqual(['final_gasket_stress_mpa', 'gasket_min_seating_mpa']);
    // Data Package v1: a package name is lower case with . _ - only.
    expect(descriptor.name).toMatch(/^[a-z0-9._-]+$/);
  });

  it('keeps the layout a comparison was frozen with: layout 1 has no gasket columns, so its data still hashes as frozen', () => {
    const runs = dataTablesOf(1)[0]!;
    expect(runs.fields.some((f) => f.name.includes('gasket'))).toBe(false);
    expect(dataTablesOf(1).map((t) => t.path)).toEqual(DATA_TABLES.map((t) => t.path));
    expect(dataPackageDescriptor({ ...facts, layout: 1 }, {}).evenload.packageLayout).toBe(1);
  });
});

describe('the headline of a frozen comparison', () => {
  // Two groups of three runs with hand-made final loads: run CV = sample SD / mean (computed).
  const run = (loads: number[], gasket: { stressMpa: number; minSeatingMpa: number | null } | null = null) => ({ targetLoadN: 100, finalLoadsN: loads, driftPercent: [], gasket });
  const result = compareGroups(
    [
      { key: '1', label: 'Cross', runs: [run([99, 100, 101], { stressMpa: 60, minSeatingMpa: 69 }), run([98, 100, 102], { stressMpa: 75, minSeatingMpa: 69 }), run([97, 100, 103], { stressMpa: 90, minSeatingMpa: null })] },
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

  it('takes each group’s gasket figures as the groups table shows them, null for a group without gasket data', () => {
    // Hand-worked: mean of 60, 75, 90 MPa = 75; of the two runs with a seating stress (69 MPa) one reaches it.
    expect(headline.groups[0]).toMatchObject({ meanGasketStressMpa: 75, seatedShare: 0.5 });
    expect(headline.groups[1]).toMatchObject({ meanGasketStressMpa: null, seatedShare: null });
  });

  it('writes a script that carries the frozen figures and reads the package’s own files', () => {
    const script = pythonScript({ title: 'A "quoted" title', groupKeys: ['1', '2'], headline, dataSha256: facts.dataSha256, layout: 2 });
    expect(script).toContain(JSON.stringify(JSON.stringify(['1', '2'])));
    for (const table of DATA_TABLES) expect(script).toContain(table.path);
    expect(script).not.toContain('A "quoted" title');
    expect(script).toContain('HAS_GASKET = True');
    expect(pythonScript({ title: 't', groupKeys: ['1'], headline, dataSha256: facts.dataSha256, layout: 1 })).toContain('HAS_GASKET = False');
  });

  it('cites author, date, title, link and data hash', () => {
    expect(citationLine(facts)).toBe(`A. Researcher (2026-12-03). Cross against circular. Evenload saved comparison. ${facts.link} (data sha256 ${'f'.repeat(64)}).`);
  });
});
