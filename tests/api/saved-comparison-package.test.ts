/**
 * Saved comparisons end to end: a researcher freezes a comparison, a colleague downloads its data
 * package over HTTP, the package is unpacked, its SHA-256 manifest and datapackage.json are checked,
 * and its Python script is run with Debian's /usr/bin/python3 (numpy, scipy, statsmodels; installed
 * by the test command). The figures scipy and statsmodels recompute from the package's CSV tables
 * must match the frozen figures to 1e-9 relative: the outside check of the app's numbers.
 */
import { execFileSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { existsSync, mkdtempSync, mkdirSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { QueryTypes } from 'sequelize';
import { unzipSync, strFromU8 } from 'fflate';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sequelize } from '@/lib/platform/db';
import { headlineOf, type Headline } from '@/lib/saved-comparisons/headline';
import type { CompareResponse } from '@/lib/data/compare';
import { startAppServer, type AppServer } from '../support/app-server';
import { anonymous, DEMO_ACCOUNTS, signInAs, type HttpSession } from '../support/http-session';
import { count, sessionUserFor } from '../integration/support';
import { freezeDemoComparison } from '../support/saved-comparison';

const PYTHON = '/usr/bin/python3';
let server: AppServer;
let researcher: HttpSession;
let slug: string;
let remove: () => Promise<void> = async () => {};
let frozen: { headline: Headline; dataSha256: string; results: CompareResponse };
let files: Record<string, Uint8Array>;
let root: string;
const workDir = mkdtempSync(path.join(tmpdir(), 'evenload-package-'));

beforeAll(async () => {
  ({ slug, remove } = await freezeDemoComparison('Methods on simulated runs (package test)'));
  const [row] = await sequelize.query<{ results_json: string; data_sha256: string }>('SELECT results_json, data_sha256 FROM saved_comparisons WHERE slug = ?', { type: QueryTypes.SELECT, replacements: [slug] });
  const results = JSON.parse(row!.results_json) as CompareResponse;
  frozen = { headline: headlineOf(results), dataSha256: row!.data_sha256, results };
  server = await startAppServer();
  researcher = await signInAs(server.baseUrl, DEMO_ACCOUNTS.researcher);
  const response = await researcher.get(`/api/compare/saved/${slug}/package`);
  expect(response.status).toBe(200);
  expect(response.headers.get('content-type')).toBe('application/zip');
  const zipped = unzipSync(new Uint8Array(await response.arrayBuffer()));
  root = `evenload-comparison-${slug}/`;
  files = Object.fromEntries(Object.entries(zipped).map(([name, bytes]) => [name.slice(root.length), bytes]));
  for (const [name, bytes] of Object.entries(files)) {
    mkdirSync(path.dirname(path.join(workDir, name)), { recursive: true });
    writeFileSync(path.join(workDir, name), bytes);
  }
});

afterAll(async () => {
  await remove();
  rmSync(workDir, { recursive: true, force: true });
  await server?.stop();
  await sequelize.close();
});

const sha256 = (bytes: Uint8Array) => createHash('sha256').update(bytes).digest('hex');

/** |a − b| ≤ 1e-9·|b| (relative), the agreement asked of the app's figures against scipy/statsmodels. */
function expectRelative(actual: number, expected: number, what: string) {
  expect(Number.isFinite(actual), what).toBe(true);
  expect(Math.abs(actual - expected), `${what}: ${actual} against ${expected}`).toBeLessThanOrEqual(1e-9 * Math.abs(expected));
}

describe('who may open a saved comparison', () => {
  it('shows the frozen page with its citation to the researcher, and 404 for an unknown link', async () => {
    const page = await researcher.get(`/compare/saved/${slug}`);
    expect(page.status).toBe(200);
    const html = await page.text();
    expect(html).toContain('Methods on simulated runs (package test)');
    expect(html).toContain(frozen.dataSha256);
    expect((await researcher.get('/compare/saved/zzzzzzzzzzzz')).status).toBe(404);
  });

  it('keeps the package from visitors, trainees, and instructors who may not see all of its runs', async () => {
    expect((await anonymous(server.baseUrl).get(`/api/compare/saved/${slug}/package`)).status).toBe(401);
    const trainee = await signInAs(server.baseUrl, DEMO_ACCOUNTS.trainee);
    expect((await trainee.get(`/api/compare/saved/${slug}/package`)).status).toBe(403);
    const instructor = await sessionUserFor(DEMO_ACCOUNTS.instructor);
    const runIds = frozen.results.totalRuns;
    const visible = await count(
      `SELECT COUNT(*) AS n FROM runs r JOIN (SELECT id FROM runs WHERE status = 'complete' AND source = 'simulated' AND final_loads_json IS NOT NULL) s ON s.id = r.id
       WHERE r.operator_id = ? OR r.cohort_id IN (SELECT id FROM cohorts WHERE instructor_id = ?)`,
      [instructor.id, instructor.id],
    );
    const session = await signInAs(server.baseUrl, DEMO_ACCOUNTS.instructor);
    expect((await session.get(`/api/compare/saved/${slug}/package`)).status).toBe(visible === runIds ? 200 : 404);
  });
});

describe('a saved comparison’s data package', () => {
  it('lists every file in its SHA-256 manifest with the right hash', () => {
    const manifest = strFromU8(files['MANIFEST-SHA256.txt']!).trim().split('\n').map((line) => line.split('  ') as [string, string]);
    const listed = manifest.map(([, name]) => name).sort();
    expect(listed).toEqual(Object.keys(files).filter((name) => name !== 'MANIFEST-SHA256.txt').sort());
    for (const [hash, name] of manifest) expect(hash, name).toBe(sha256(files[name]!));
    // Every part a reviewer needs (item 6 of the issue).
    for (const name of ['datapackage.json', 'data/runs.csv', 'data/steps.csv', 'data/readings.csv', 'data/final_loads.csv', 'reproduce.py', 'results.json']) expect(listed).toContain(name);
  });

  it('has a structurally valid datapackage.json (Data Package v1: required keys, names, paths, Table Schema fields)', () => {
    const descriptor = JSON.parse(strFromU8(files['datapackage.json']!)) as { name: string; profile: string; resources: { name: string; path: string; profile: string; hash: string; schema?: { fields: { name: string; type: string; description: string; unit?: string }[]; primaryKey: string[] } }[] };
    // Data Package spec v1: `resources` is required and non-empty; `name` lower case with . _ - only.
    expect(descriptor.name).toMatch(/^[a-z0-9._-]+$/);
    expect(descriptor.profile).toBe('tabular-data-package');
    expect(descriptor.resources.length).toBeGreaterThan(0);
    const types = new Set(['string', 'number', 'integer', 'boolean', 'object', 'array', 'date', 'time', 'datetime', 'year', 'yearmonth', 'duration', 'geopoint', 'geojson', 'any']);
    for (const resource of descriptor.resources) {
      expect(resource.name).toMatch(/^[a-z0-9._-]+$/);
      expect(files[resource.path], resource.path).toBeDefined();
      expect(resource.hash).toBe(`sha256:${sha256(files[resource.path]!)}`);
      if (resource.profile !== 'tabular-data-resource') continue;
      const header = strFromU8(files[resource.path]!).split('\r\n')[0]!.split(',');
      expect(resource.schema!.fields.map((f) => f.name)).toEqual(header);
      for (const field of resource.schema!.fields) {
        expect(types.has(field.type), `${resource.name}.${field.name} type`).toBe(true);
        expect(field.description.length).toBeGreaterThan(0);
      }
      for (const key of resource.schema!.primaryKey) expect(header).toContain(key);
    }
    const loads = descriptor.resources.find((r) => r.name === 'final_loads')!.schema!.fields.find((f) => f.name === 'final_load_n')!;
    expect(loads.unit).toBe('N');
    const runs = descriptor.resources.find((r) => r.name === 'runs')!.schema!.fields;
    for (const name of ['final_gasket_stress_mpa', 'gasket_min_seating_mpa']) expect(runs.find((f) => f.name === name)).toMatchObject({ type: 'number', unit: 'MPa' });
  });

  it('holds the frozen runs: one runs.csv row per run, as many as the frozen results counted', async () => {
    const lines = strFromU8(files['data/runs.csv']!).trim().split('\r\n');
    expect(lines.length - 1).toBe(frozen.results.totalRuns);
    const readings = strFromU8(files['data/readings.csv']!).trim().split('\r\n').length - 1;
    const ids = lines.slice(1).map((line) => Number(line.split(',')[0]));
    expect(readings).toBe(await count('SELECT COUNT(*) AS n FROM readings WHERE run_id IN (?)', [ids]));
  });

  it('reproduces the headline numbers with scipy and statsmodels to 1e-9 relative', () => {
    // No skip: without Debian's python3 this test fails (the test command installs it).
    expect(existsSync(PYTHON), `${PYTHON} is needed to reproduce the package`).toBe(true);
    const output = JSON.parse(execFileSync(PYTHON, [path.join(workDir, 'reproduce.py')], { encoding: 'utf8', timeout: 120_000 })) as { recomputed: Headline; dataSha256: string; frozenDataSha256: string };
    const python = output.recomputed;
    expect(output.dataSha256).toBe(frozen.dataSha256);
    expect(output.frozenDataSha256).toBe(frozen.dataSha256);
    expect(frozen.headline.groups.length).toBeGreaterThanOrEqual(2);
    expect(python.groups.map((g) => g.key)).toEqual(frozen.headline.groups.map((g) => g.key));
    python.groups.forEach((g, i) => expectRelative(frozen.headline.groups[i]!.meanLnCv, g.meanLnCv, `mean ln CV of ${g.label}`));
    // Welch's ANOVA: statsmodels anova_oneway(use_var="unequal"); one-way ANOVA: scipy.stats.f_oneway.
    expect(frozen.headline.welchLnCv && frozen.headline.anovaLnCv && frozen.headline.cvRatio).toBeTruthy();
    for (const name of ['welchLnCv', 'anovaLnCv'] as const) {
      expectRelative(frozen.headline[name]!.statistic, python[name]!.statistic, `${name} F`);
      expectRelative(frozen.headline[name]!.pValue, python[name]!.pValue, `${name} p`);
    }
    // CV ratio: exp of statsmodels CompareMeans.tconfint_diff(usevar="unequal") on ln CV.
    expect(frozen.headline.cvRatio!.label).toBe(python.cvRatio!.label);
    for (const part of ['ratio', 'lower', 'upper'] as const) expectRelative(frozen.headline.cvRatio![part], python.cvRatio![part], `CV ratio ${part}`);
  });

  it('recomputes each group’s mean gasket stress and share reaching seating from the runs table, as the frozen groups table shows them', () => {
    const output = JSON.parse(execFileSync(PYTHON, [path.join(workDir, 'reproduce.py')], { encoding: 'utf8', timeout: 120_000 })) as { recomputed: Headline };
    const python = output.recomputed.groups;
    expect(python.map((g) => g.key)).toEqual(frozen.headline.groups.map((g) => g.key));
    // The demo joints carry gasket data (lib/demo/demo-library.ts), so the check compares numbers, not only absences.
    expect(frozen.headline.groups.filter((g) => g.meanGasketStressMpa !== null).length).toBeGreaterThanOrEqual(2);
    frozen.headline.groups.forEach((app, i) => {
      const recomputed = python[i]!;
      for (const name of ['meanGasketStressMpa', 'seatedShare'] as const) {
        const value = app[name];
        // Python's mean (math.fsum) and share against the app's frozen figures, or both absent for a group without gasket data.
        if (value === null || value === 0) expect(recomputed[name], `${name} of ${app.label}`).toBe(value);
        else expectRelative(value, recomputed[name]!, `${name} of ${app.label}`);
      }
    });
  });
});
