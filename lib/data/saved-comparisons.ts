import 'server-only';
import { randomBytes } from 'node:crypto';
import { QueryTypes } from 'sequelize';
import { zipSync, strToU8 } from 'fflate';
import { z } from 'zod';
import { citationLine } from '../saved-comparisons/citation';
import { dataPackageDescriptor, DATA_PACKAGE_PATH, MANIFEST_PATH, RESULTS_PATH } from '../saved-comparisons/data-package';
import { headlineOf, type Headline } from '../saved-comparisons/headline';
import { pythonScript, PYTHON_SCRIPT_PATH } from '../saved-comparisons/python-script';
import { softwareVersion } from '../saved-comparisons/software-version';
import { AppError } from '../http/errors';
import { appBaseUrl } from '../platform/env';
import type { SessionUser } from '../auth/session';
import { SavedComparison, sequelize, User } from '@/models';
import { pseudonymiseJson, type Replacement } from '../saved-comparisons/pseudonymise';
import { pseudonymFor } from './pseudonym';
import { comparisonRunKeys, compareQuerySchema, compareRunsJson, type CompareQuery, type CompareResponse } from './compare';
import { dataTables, runsFingerprint, sha256Hex, type DataTables, type FrozenRun } from './saved-comparison-tables';
import { CURRENT_PACKAGE_LAYOUT, type PackageLayout } from '../saved-comparisons/data-tables';
import { runScopeSql } from './scope';

/** A frozen comparison carries every reading of its runs in its package; above this many runs, narrow the filters. */
export const MAX_FROZEN_RUNS = 2000;

export const freezeInputSchema = z.object({
  title: z.string().trim().min(1, 'Give the comparison a title.').max(200, 'Keep the title under 200 characters.'),
  query: z.string().max(2000).transform((text, ctx) => {
    const parsed = compareQuerySchema.safeParse(Object.fromEntries(new URLSearchParams(text)));
    if (!parsed.success) {
      ctx.addIssue({ code: 'custom', message: 'This comparison’s choice is not valid; open it again from Compare.' });
      return z.NEVER;
    }
    return parsed.data;
  }),
});

/** The comparison's choice as the address of the live Compare page. */
export function compareSearch(query: CompareQuery): string {
  const params = new URLSearchParams();
  for (const [name, value] of Object.entries(query)) if (value !== undefined) params.set(name, Array.isArray(value) ? value.join(',') : String(value));
  return params.toString();
}

/**
 * Freezes a comparison: the results as this person sees them now, the ids of the runs they came
 * from with their groups, the software version and the sha256 of the data tables. One INSERT.
 */
export async function freezeComparison(user: SessionUser, input: { title: string; query: CompareQuery }): Promise<{ slug: string }> {
  const results = JSON.parse(await compareRunsJson(user, input.query)) as CompareResponse;
  const shown = new Set(results.groups.map((g) => g.key));
  const runs: FrozenRun[] = (await comparisonRunKeys(user, input.query)).filter((r) => shown.has(r.groupKey)).map((r) => ({ id: r.runId, group: r.groupKey }));
  if (runs.length === 0) throw new AppError('invalid_input', 'There are no runs in this comparison to freeze.');
  if (runs.length > MAX_FROZEN_RUNS) throw new AppError('invalid_input', `A saved comparison holds at most ${MAX_FROZEN_RUNS} runs; this one has ${runs.length}. Narrow the filters first.`);
  if (runs.length !== results.totalRuns) throw new AppError('conflict', 'Runs changed while the comparison was being frozen. Try again.');
  const slug = randomBytes(9).toString('base64url').replace(/[-_]/g, 'x').slice(0, 12).toLowerCase();
  // The fingerprint first: a run changing after it makes the page check the long way, never the reverse.
  const fingerprint = await runsFingerprint(runs.map((r) => r.id));
  const { dataSha256 } = await dataTables(slug, runs, labelsOf(results));
  await SavedComparison.create({
    slug,
    title: input.title,
    createdById: user.id,
    queryJson: JSON.stringify(input.query),
    runIdsJson: JSON.stringify(runs.map((r) => [r.id, r.group])),
    resultsJson: JSON.stringify(results),
    softwareVersion: softwareVersion(),
    dataSha256,
    runsFingerprint: fingerprint,
    packageLayout: CURRENT_PACKAGE_LAYOUT,
    createdAt: new Date(),
  });
  return { slug };
}

const labelsOf = (results: CompareResponse) => new Map(results.groups.map((g) => [g.key, g.label]));

export interface SavedComparisonView {
  slug: string;
  title: string;
  author: string;
  createdAt: string;
  link: string;
  citation: string;
  query: CompareQuery;
  liveSearch: string;
  runCount: number;
  softwareVersion: string;
  dataSha256: string;
  /** True when the runs' data tables no longer hash to the frozen sha256 (a run, step or reading changed since). */
  dataChanged: boolean;
  results: CompareResponse;
  headline: Headline;
}

/** The view with what its package needs: the runs and the data tables as they are now. */
type SavedComparisonFull = SavedComparisonView & { runs: FrozenRun[]; tables: DataTables | null; layout: PackageLayout };

const layoutOf = (row: SavedComparison): PackageLayout => (row.packageLayout === 1 ? 1 : 2);

const NOT_FOUND = 'This saved comparison does not exist, or it holds runs you may not see.';
const frozenRuns = (row: SavedComparison): FrozenRun[] => (JSON.parse(row.runIdsJson) as [number, string][]).map(([id, group]) => ({ id, group }));

/**
 * Whether the runs' data tables still hash to the frozen sha256. When the runs' fingerprint (ids and
 * last changes) is the one stored, nothing changed and no table is built; otherwise the tables are
 * rebuilt and hashed, and when they still match, the new fingerprint is stored for the next view.
 */
async function changedSinceFrozen(row: SavedComparison, original: FrozenRun[], labels: Map<string, string>): Promise<{ dataChanged: boolean; tables: DataTables | null }> {
  const fingerprint = await runsFingerprint(original.map((r) => r.id));
  if (row.runsFingerprint === fingerprint) return { dataChanged: false, tables: null };
  const tables = await dataTables(row.slug, original, labels, layoutOf(row));
  const dataChanged = tables.dataSha256 !== row.dataSha256;
  if (!dataChanged) await SavedComparison.update({ runsFingerprint: fingerprint }, { where: { id: row.id } });
  return { dataChanged, tables };
}

/** The view of a saved comparison row (results as frozen; the data tables recomputed to tell whether they changed). */
async function viewOf(row: SavedComparison, results: CompareResponse, query: CompareQuery, runs: FrozenRun[], original: FrozenRun[], originalLabels: Map<string, string>): Promise<SavedComparisonFull> {
  const facts = { title: row.title, author: row.createdBy?.name ?? 'Unknown', createdAt: row.createdAt.toISOString(), link: `${appBaseUrl()}/compare/saved/${row.slug}`, dataSha256: row.dataSha256 };
  const { dataChanged, tables } = await changedSinceFrozen(row, original, originalLabels);
  return {
    ...facts,
    slug: row.slug,
    citation: citationLine(facts),
    query,
    liveSearch: compareSearch(query),
    runCount: runs.length,
    softwareVersion: row.softwareVersion,
    dataChanged,
    results,
    headline: headlineOf(results),
    runs,
    // The tables (when they were rebuilt) serve the package only when the runs were not relabelled for a reviewer.
    tables: runs === original ? tables : null,
    layout: layoutOf(row),
  };
}

const parsedQuery = (row: SavedComparison) => compareQuerySchema.parse(Object.fromEntries(new URLSearchParams(compareSearch(JSON.parse(row.queryJson) as CompareQuery))));

/**
 * One saved comparison, for a signed-in instructor or researcher who may see every one of its runs
 * (the rule of Compare); anyone else gets "not found", so its existence is not revealed.
 */
export async function savedComparison(user: SessionUser, slug: string): Promise<SavedComparisonFull> {
  const row = /^[a-z0-9]{12}$/.test(slug) ? await SavedComparison.findOne({ where: { slug }, include: [{ model: User, as: 'createdBy', attributes: ['name'] }] }) : null;
  if (!row) throw new AppError('not_found', NOT_FOUND);
  const runs = frozenRuns(row);
  const scope = await runScopeSql(user);
  const [visible] = await sequelize.query<{ n: number }>(`SELECT COUNT(*) AS n FROM runs r WHERE r.id IN (?) AND ${scope.sql}`, { type: QueryTypes.SELECT, replacements: [runs.map((r) => r.id), ...scope.params] });
  if (Number(visible?.n ?? 0) !== runs.length) throw new AppError('not_found', NOT_FOUND);
  const results = JSON.parse(row.resultsJson) as CompareResponse;
  return viewOf(row, results, parsedQuery(row), runs, runs, labelsOf(results));
}

/**
 * A saved comparison as a review link shows it, trainees pseudonymised: every operator of its runs
 * is "Operator XXXXXX" keyed by the saved comparison (the pseudonym of its package's runs table),
 * in place of their name, email, the pseudonym a researcher saw or the user id that keyed their
 * group; filters that name a person by id are left out.
 */
export async function savedComparisonForReview(id: number): Promise<SavedComparisonFull> {
  const row = await SavedComparison.findByPk(id, { include: [{ model: User, as: 'createdBy', attributes: ['name'] }] });
  if (!row) throw new AppError('not_found', NOT_FOUND);
  const original = frozenRuns(row);
  const operators = await sequelize.query<{ id: number; name: string; email: string }>(
    'SELECT DISTINCT u.id, u.name, u.email FROM runs r JOIN users u ON u.id = r.operator_id WHERE r.id IN (?)',
    { type: QueryTypes.SELECT, replacements: [original.length ? original.map((r) => r.id) : [0]] },
  );
  const key = `saved-comparison:${row.slug}`;
  const pseudonymOf = new Map(operators.map((o) => [o.id, pseudonymFor(o.id, key)]));
  const replacements: Replacement[] = operators.flatMap((o) => {
    const to = pseudonymOf.get(o.id)!;
    const seenAs = pseudonymFor(o.id);
    return [{ from: o.name, to }, { from: o.email, to }, { from: seenAs, to }, { from: seenAs.replace(/^Operator /, 'op-'), to: to.replace(/^Operator /, 'op-') }];
  });
  const query = parsedQuery(row);
  const byTrainee = query.by === 'trainee';
  // Groups keyed by a user id (an instructor compared by trainee) get the pseudonym's code instead.
  const groupKey = (k: string) => (byTrainee && /^\d+$/.test(k) && pseudonymOf.has(Number(k)) ? pseudonymOf.get(Number(k))!.replace(/^Operator /, 'op-') : k);
  const results = JSON.parse(pseudonymiseJson(row.resultsJson, replacements)) as CompareResponse;
  for (const g of [...results.groups, ...results.chartGroups]) g.key = groupKey(g.key);
  const shownQuery: CompareQuery = { ...query, operatorId: undefined, ...(byTrainee ? { ids: undefined } : {}) };
  const runs = original.map((r) => ({ id: r.id, group: groupKey(r.group) }));
  return viewOf(row, results, shownQuery, byTrainee ? runs : original, original, labelsOf(JSON.parse(row.resultsJson) as CompareResponse));
}

/** This person's saved comparisons, newest first. */
export async function listSavedComparisons(user: SessionUser): Promise<{ slug: string; title: string; createdAt: string; runCount: number }[]> {
  const rows = await SavedComparison.findAll({ where: { createdById: user.id }, attributes: ['slug', 'title', 'createdAt', 'runIdsJson'], order: [['createdAt', 'DESC'], ['id', 'DESC']], limit: 50 });
  return rows.map((r) => ({ slug: r.slug, title: r.title, createdAt: r.createdAt.toISOString(), runCount: (JSON.parse(r.runIdsJson) as unknown[]).length }));
}

/**
 * The data package (zip): datapackage.json, the CSV tables of the runs as they are now (the
 * descriptor records whether their hash still matches the frozen one), the frozen results, the
 * Python script that recomputes the headline numbers, and a SHA-256 manifest of every other file.
 */
export async function savedComparisonPackage(user: SessionUser, slug: string): Promise<{ fileName: string; bytes: Uint8Array }> {
  return buildPackage(await savedComparison(user, slug));
}

/** The zip of one saved comparison as `savedComparison` or `savedComparisonForReview` gave it. */
export async function buildPackage(saved: SavedComparisonFull): Promise<{ fileName: string; bytes: Uint8Array }> {
  const tables = saved.tables ?? (await dataTables(saved.slug, saved.runs, labelsOf(saved.results), saved.layout));
  const files: Record<string, string> = { ...tables.files };
  files[RESULTS_PATH] = `${JSON.stringify({ headline: saved.headline, results: saved.results }, null, 2)}\n`;
  files[PYTHON_SCRIPT_PATH] = pythonScript({ title: saved.title, groupKeys: saved.results.groups.map((g) => g.key), headline: saved.headline, dataSha256: saved.dataSha256, layout: saved.layout });
  const fileSha256 = Object.fromEntries(Object.entries(files).map(([path, text]) => [path, sha256Hex(text)]));
  const descriptor = dataPackageDescriptor(
    { slug: saved.slug, title: saved.title, author: saved.author, createdAt: saved.createdAt, link: saved.link, citation: saved.citation, query: saved.query, runCount: saved.runCount, softwareVersion: saved.softwareVersion, dataSha256: saved.dataSha256, layout: saved.layout },
    fileSha256,
  );
  files[DATA_PACKAGE_PATH] = `${JSON.stringify({ ...descriptor, evenload: { ...descriptor.evenload, dataUnchangedSinceFrozen: !saved.dataChanged } }, null, 2)}\n`;
  fileSha256[DATA_PACKAGE_PATH] = sha256Hex(files[DATA_PACKAGE_PATH]);
  files[MANIFEST_PATH] = Object.keys(files).sort().map((path) => `${fileSha256[path]}  ${path}\n`).join('');
  const root = `evenload-comparison-${saved.slug}`;
  const bytes = zipSync(Object.fromEntries(Object.entries(files).map(([path, text]) => [`${root}/${path}`, [strToU8(text), { mtime: new Date(saved.createdAt) }]])), { level: 6 });
  return { fileName: `${root}.zip`, bytes };
}
