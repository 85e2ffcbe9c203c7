import 'server-only';
import { createHash } from 'node:crypto';
import { QueryTypes } from 'sequelize';
import { z } from 'zod';
import { compareGroups, DEFAULT_PLANNED, type ComparisonResult, type GroupInput } from '../analysis/compare-groups';
import { COMPARISON_TESTS } from '../analysis/compare-types';
import { finalHoldRelaxationPercent } from '../analysis/relaxation';
import { nutFactor } from '../stats/nut-factor';
import { decodeFloat64Blob } from '../record/float64-blob';
import { studDiameterM } from '../joints/joint-properties';
import type { SessionUser } from '../auth/session';
import { isoDateSchema } from '../validation/iso-date';
import { AppError } from '../http/errors';
import { etagMatches } from '../http/etag';
import { softwareVersion } from '../saved-comparisons/software-version';
import { sequelize } from '@/models';
import { readRowArrays } from './read-row-arrays';
import { operatorKey, operatorLabel, refuseOperatorIdsForResearcher, runScopeSql } from './scope';

const isoDate = isoDateSchema();
const id = z.coerce.number().int().positive().max(2 ** 31);
const idList = z
  .string()
  .regex(/^\d+(,\d+)*$/, 'must be a comma-separated list of numbers')
  .transform((text) => [...new Set(text.split(',').map(Number))])
  .refine((ids) => ids.length <= 8, 'can name at most 8 groups');

export const COMPARE_BY = ['method', 'lubricant', 'cohort', 'trainee', 'runs', 'hardwareUse', 'lubricantLot'] as const;
export type CompareBy = (typeof COMPARE_BY)[number];

/** Where runs come from: measured (uploaded, entered by hand, streamed live) or simulated, never pooled unasked. */
export const COMPARE_SOURCES = ['measured', 'simulated', 'both'] as const;
/** Which runs count: complete ones, set-aside ones (to look at what was set aside), or both. */
export const COMPARE_STATUSES = ['complete', 'set_aside', 'both'] as const;

/** The comparison's choice, as it lives in the URL. */
export const compareQuerySchema = z
  .object({
    by: z.enum(COMPARE_BY).default('method'),
    ids: idList.optional(),
    source: z.enum(COMPARE_SOURCES).default('measured'),
    status: z.enum(COMPARE_STATUSES).default('complete'),
    methodId: id.optional(),
    lubricantId: id.optional(),
    cohortId: id.optional(),
    operatorId: id.optional(),
    jointId: id.optional(),
    studCount: z.coerce.number().int().min(3).max(200).optional(),
    from: isoDate.optional(),
    to: isoDate.optional(),
    passCount: z.coerce.number().int().min(1).max(50).optional(),
    planned: z.enum(COMPARISON_TESTS).default(DEFAULT_PLANNED),
  })
  .strict()
  .refine((q) => !q.from || !q.to || q.from <= q.to, { message: 'must not be before "from"', path: ['to'] })
  .refine((q) => q.by !== 'runs' || (q.ids?.length ?? 0) >= 2, { message: 'name at least two runs to compare', path: ['ids'] });

export type CompareQuery = z.infer<typeof compareQuerySchema>;

export interface NutFactorByLubricant {
  key: string;
  label: string;
  colourIndex: number;
  k: number;
  low: number;
  high: number;
  n: number;
}

export interface CompareResponse extends ComparisonResult {
  by: CompareBy;
  source: (typeof COMPARE_SOURCES)[number];
  totalRuns: number;
  /** Simulated runs that matched the other filters but were left out (measured only). */
  simulatedLeftOut: number;
  nutFactors: NutFactorByLubricant[];
}

const GROUP_COLUMN: Record<CompareBy, string> = { method: 'r.method_id', lubricant: 'r.lubricant_id', cohort: 'r.cohort_id', trainee: 'r.operator_id', runs: 'r.id', hardwareUse: 'r.hardware_use_number', lubricantLot: 'r.lubricant_lot_id' };
const SUBJECT: Record<CompareBy, string> = { method: 'these methods', lubricant: 'these lubricants', cohort: 'these cohorts', trainee: 'these operators', runs: 'these runs', hardwareUse: 'these uses of the hardware', lubricantLot: 'these lubricant lots' };
const FILTER_COLUMN = { methodId: 'r.method_id', lubricantId: 'r.lubricant_id', cohortId: 'r.cohort_id', operatorId: 'r.operator_id', jointId: 'r.joint_id', studCount: 'r.stud_count', passCount: 'r.pass_count' } as const;
const MEASURED_SQL = "r.source IN ('upload', 'manual', 'live')";
const SOURCE_SQL = { measured: MEASURED_SQL, simulated: "r.source = 'simulated'", both: '1 = 1' } as const;
const STATUS_SQL = { complete: "r.status = 'complete'", set_aside: "r.status = 'set_aside'", both: "r.status IN ('complete', 'set_aside')" } as const;

/**
 * One run of a comparison: its run-level columns and its stud-level figures as float64 bytes
 * (`lib/record/float64-blob.ts`), with the JSON text only for a run that has no bytes yet.
 */
interface RunRowSql {
  id: number;
  group_id: number;
  operator_id: number;
  target_load_n: number;
  final_mean_n: number | null;
  final_sd_n: number | null;
  final_loads_f64: Uint8Array | null;
  final_loads_json: string | null;
  drift_f64?: Uint8Array | null;
  /** Stored gasket figures (lib/record/run-gasket-figures.ts); null without a gasket contact area. */
  final_gasket_stress_mpa: number | null;
  gasket_min_seating_mpa: number | null;
  drift_json?: string | null;
}

/** A run row as the comparison's read returns it (readRowArrays), in the SELECT's column order (`RUN_COLUMNS`). */
type RunRowArray = [
  id: number, groupId: number, operatorId: number, targetLoadN: number, finalMeanN: number | null, finalSdN: number | null,
  gasketStressMpa: number | null, gasketMinSeatingMpa: number | null, finalLoadsF64: Uint8Array | null, finalLoadsJson: string | null,
  driftF64: Uint8Array | null, driftJson: string | null, updatedAt: string, studCount: number,
];

/** The columns of RunRowArray; the group column is `${column} AS group_id`. */
const runColumnsSql = (groupColumn: string) =>
  `r.id, ${groupColumn} AS group_id, r.operator_id, r.target_load_n, r.final_mean_n, r.final_sd_n, r.final_gasket_stress_mpa, r.gasket_min_seating_mpa,
   r.final_loads_f64, IF(r.final_loads_f64 IS NULL, r.final_loads_json, NULL) AS final_loads_json, r.drift_f64, IF(r.drift_f64 IS NULL, r.drift_json, NULL) AS drift_json,
   CAST(r.updated_at AS CHAR) AS updated_at, r.stud_count`;

const runRowOf = (a: RunRowArray): RunRowSql => ({
  id: a[0], group_id: a[1], operator_id: a[2], target_load_n: a[3], final_mean_n: a[4], final_sd_n: a[5],
  final_gasket_stress_mpa: a[6], gasket_min_seating_mpa: a[7], final_loads_f64: a[8], final_loads_json: a[9], drift_f64: a[10], drift_json: a[11],
});

/** The final loads of a run as the query gives them. */
const finalLoadsOf = (r: RunRowSql): number[] => (r.final_loads_f64 ? (decodeFloat64Blob(r.final_loads_f64) as number[]) : (JSON.parse(r.final_loads_json ?? '[]') as number[]));
/** The drift of a run (null where a stud was never tightened); empty when not read. */
const driftOf = (r: RunRowSql): (number | null)[] => (r.drift_f64 ? decodeFloat64Blob(r.drift_f64) : r.drift_json ? (JSON.parse(r.drift_json) as (number | null)[]) : []);

/**
 * What a cached comparison is checked against: the chosen runs' count, last change and id sum, the
 * simulated runs left out, when a group name last changed and the hold readings. Each part either
 * comes from one aggregate over the filter (`fingerprintByAggregate`) or, for a comparison computed
 * now, from the very rows it reads (`fingerprintOfRead`); `tests/integration/compare-fingerprint.test.ts`
 * checks that both give the same text.
 */
interface FingerprintParts {
  n: number;
  /** The last change as MariaDB writes a DATETIME ('YYYY-MM-DD hh:mm:ss', so text order is time order); no Date objects for 10,000 rows. */
  changed: string | null;
  ids: number;
  leftOut: number;
  names: string | null;
  holds: string | null;
}

const fingerprintText = (p: FingerprintParts) => `${p.n}:${p.changed ?? '-'}:${p.ids}:${p.leftOut}:${p.names ?? '-'}:${p.holds ?? '-'}`;

/** The group names' last change and the hold readings, as text, the same in both ways of taking a fingerprint. */
const NAMES_AND_HOLDS_SQL = `CAST(GREATEST(COALESCE((SELECT MAX(updated_at) FROM methods), 0), COALESCE((SELECT MAX(updated_at) FROM lubricants), 0),
                COALESCE((SELECT MAX(updated_at) FROM cohorts), 0), COALESCE((SELECT MAX(updated_at) FROM users), 0)) AS CHAR) AS names,
       (SELECT CONCAT(COUNT(*), '/', COALESCE(SUM(load_n), 0)) FROM run_holds) AS holds`;

export async function compareRuns(user: SessionUser, query: CompareQuery): Promise<CompareResponse> {
  return JSON.parse(await compareRunsJson(user, query)) as CompareResponse;
}

/** Cached comparisons older than this are removed when a new one is stored. */
const CACHE_DAYS = 2;

/** Part of the ETag, so a new build never answers 304 for an answer an older one computed. */
const SOFTWARE = softwareVersion();

/**
 * The comparison as JSON text, from the shared cache when the runs it depends on are unchanged
 * (their fingerprint: `FingerprintParts`). A cache hit costs a primary-key read and one aggregate; a
 * comparison never asked for costs one read of its runs, which gives the fingerprint as well.
 */
export async function compareRunsJson(user: SessionUser, query: CompareQuery): Promise<string> {
  return (await compareRunsCached(user, query, null)).body as string;
}

/**
 * The comparison with its ETag (the cache key, the fingerprint of its runs and the software, so it
 * changes whenever the answer could): when `ifNoneMatch` names it, `body` is null (answer 304) and
 * neither the cache row nor the runs are read.
 */
export async function compareRunsCached(user: SessionUser, query: CompareQuery, ifNoneMatch: string | null): Promise<{ etag: string; body: string | null }> {
  refuseOperatorIdsForResearcher(user, 'ids', query.by === 'trainee' && Boolean(query.ids?.length));
  const { where, params } = await filterSql(user, query);
  const match = SOURCE_SQL[query.source];
  const viewer = user.role === 'admin' || user.role === 'researcher' ? user.role : `${user.role}:${user.id}`;
  const key = createHash('sha256').update(JSON.stringify({ viewer, query: Object.entries(query).sort(([a], [b]) => a.localeCompare(b)) })).digest('hex');
  const etagOf = (fingerprint: string) => `"${createHash('sha256').update(`${key}|${fingerprint}|${SOFTWARE}`).digest('base64url').slice(0, 32)}"`;
  const computeAndStore = async () => {
    const { response, fingerprint } = await computeComparison(user, query, where, match, params);
    const body = JSON.stringify(response);
    await sequelize.query('REPLACE INTO comparison_cache (cache_key, fingerprint, body, created_at) VALUES (?, ?, ?, NOW())', { replacements: [key, fingerprint, body] });
    // Housekeeping, not part of the answer: old entries go while the answer is sent.
    sequelize.query('DELETE FROM comparison_cache WHERE created_at < NOW() - INTERVAL ? DAY', { replacements: [CACHE_DAYS] }).catch((error: unknown) => console.warn('evenload: removing old cached comparisons failed', error));
    return { etag: etagOf(fingerprint), body };
  };
  if (ifNoneMatch) {
    // A revalidation: the fingerprint alone decides, and a 304 needs no body.
    const fingerprint = fingerprintText(await fingerprintByAggregate(where, match, params));
    const etag = etagOf(fingerprint);
    if (etagMatches(ifNoneMatch, etag)) return { etag, body: null };
    const [cached] = await sequelize.query<{ body: string }>('SELECT body FROM comparison_cache WHERE cache_key = ? AND fingerprint = ?', { type: QueryTypes.SELECT, replacements: [key, fingerprint] });
    return cached ? { etag, body: cached.body } : computeAndStore();
  }
  const [cached] = await sequelize.query<{ fingerprint: string; body: string }>('SELECT fingerprint, body FROM comparison_cache WHERE cache_key = ?', { type: QueryTypes.SELECT, replacements: [key] });
  // A comparison nobody has asked for (or whose answer has expired) cannot be a hit: its runs are read
  // at once, and its fingerprint is taken from that same read.
  if (!cached) return computeAndStore();
  const fingerprint = fingerprintText(await fingerprintByAggregate(where, match, params));
  return cached.fingerprint === fingerprint ? { etag: etagOf(fingerprint), body: cached.body } : computeAndStore();
}

/**
 * The fingerprint from one aggregate over the filter (without the source condition), so a cache hit
 * costs about one bare aggregate plus a primary-key read.
 */
async function fingerprintByAggregate(where: string[], match: string, params: unknown[]): Promise<FingerprintParts> {
  const [fp] = await sequelize.query<{ n: number | string | null; changed: string | null; ids: number | string | null; left_out: number | string | null; names: string | null; holds: string | null }>(
    `SELECT SUM(${match}) AS n, CAST(MAX(IF(${match}, r.updated_at, NULL)) AS CHAR) AS changed, SUM(IF(${match}, r.id, 0)) AS ids,
       SUM(r.source = 'simulated' AND NOT (${match})) AS left_out, ${NAMES_AND_HOLDS_SQL}
     FROM runs r WHERE ${where.join(' AND ')}`,
    { type: QueryTypes.SELECT, replacements: params },
  );
  return { n: Number(fp?.n ?? 0), changed: fp?.changed ?? null, ids: Number(fp?.ids ?? 0), leftOut: Number(fp?.left_out ?? 0), names: fp?.names ?? null, holds: fp?.holds ?? null };
}

/** Every filter except the source, as SQL on the alias `r`, scoped to this person. */
async function filterSql(user: SessionUser, query: CompareQuery): Promise<{ where: string[]; params: unknown[] }> {
  const scope = await runScopeSql(user);
  // Runs with final figures (a final mean is stored exactly when there are final loads of two or more studs);
  // the column is in the covering `runs_list` index, so the cache check reads no wide row.
  const where = [STATUS_SQL[query.status], 'r.final_mean_n IS NOT NULL', scope.sql];
  const params: unknown[] = [...scope.params];
  for (const [name, column] of Object.entries(FILTER_COLUMN) as [keyof typeof FILTER_COLUMN, string][]) {
    const value = query[name];
    if (value !== undefined) (where.push(`${column} = ?`), params.push(value));
  }
  if (query.from) (where.push('r.recorded_at >= ?'), params.push(`${query.from} 00:00:00`));
  if (query.to) (where.push('r.recorded_at < DATE_ADD(?, INTERVAL 1 DAY)'), params.push(`${query.to} 00:00:00`));
  const column = GROUP_COLUMN[query.by];
  if (query.ids?.length) (where.push(`${column} IN (?)`), params.push(query.ids));
  else if (query.by === 'cohort' || query.by === 'hardwareUse' || query.by === 'lubricantLot') where.push(`${column} IS NOT NULL`);
  return { where, params };
}

/**
 * Reads only what the statistics need: per run its group, operator, attempt number (the operator's
 * n-th complete run, counted over their complete runs), target, final loads and drift (drift is used
 * only when the selection has one stud count: it is not averaged across stud counts). The fingerprint
 * comes from the same read: the names and holds first (so it can only be older than the rows, which
 * makes a later check miss, never hit on newer data), then the chosen runs themselves.
 */
async function computeComparison(user: SessionUser, query: CompareQuery, where: string[], match: string, params: unknown[]): Promise<{ response: CompareResponse; fingerprint: string }> {
  const column = GROUP_COLUMN[query.by];
  const chosen = [...where, match].join(' AND ');
  const [side] = await sequelize.query<{ left_out: number | string | null; names: string | null; holds: string | null }>(
    query.source === 'measured'
      ? `SELECT (SELECT COUNT(*) FROM runs r WHERE ${where.join(' AND ')} AND r.source = 'simulated') AS left_out, ${NAMES_AND_HOLDS_SQL}`
      : `SELECT 0 AS left_out, ${NAMES_AND_HOLDS_SQL}`,
    { type: QueryTypes.SELECT, replacements: query.source === 'measured' ? params : [] },
  );
  // Two queries side by side: the chosen runs (run-level columns and the stud-level bytes, no JSON to
  // parse), and the attempt numbers: every complete run of the operators concerned in the order
  // (operator, recorded_at, id), read from the index `runs_operator_attempts` alone and counted here
  // (what ROW_NUMBER() over each operator's complete runs gives, without the window's sort).
  // Both through the driver as arrays (readRowArrays): Sequelize's walk over 10,000 rows cost more than the read.
  const [rowArrays, sequence] = await Promise.all([
    readRowArrays<RunRowArray>(`SELECT ${runColumnsSql(column)} FROM runs r WHERE ${chosen} ORDER BY r.id`, params),
    readRowArrays<[operatorId: number, id: number]>(
      `SELECT a.operator_id, a.id FROM runs a
       WHERE a.status = 'complete' AND a.operator_id IN (SELECT DISTINCT r.operator_id FROM runs r WHERE ${chosen})
       ORDER BY a.operator_id, a.recorded_at, a.id`,
      params,
    ),
  ]);
  const fingerprint = fingerprintText({ ...fingerprintOfRead(rowArrays), leftOut: Number(side?.left_out ?? 0), names: side?.names ?? null, holds: side?.holds ?? null });
  const studCounts = new Set(rowArrays.map((a) => a[13]));
  const oneStudCount = studCounts.size === 1;
  const rows = rowArrays.map(runRowOf);
  const attemptOf = attemptNumbers(sequence);
  const byGroup = new Map<number, RunRowSql[]>();
  for (const row of rows) {
    const list = byGroup.get(row.group_id);
    if (list) list.push(row);
    else byGroup.set(row.group_id, [row]);
  }
  const relaxation = await relaxationByRun(rows);
  // Keep the named groups in the order given; otherwise the 8 largest groups, ordered by label.
  let groupIds = query.ids?.filter((g) => byGroup.has(g)) ?? [...byGroup.keys()].sort((a, b) => (byGroup.get(b)?.length ?? 0) - (byGroup.get(a)?.length ?? 0)).slice(0, 8);
  const labels = await groupLabels(user, query.by, groupIds);
  if (!query.ids) groupIds = groupIds.sort((a, b) => (labels.get(a) ?? '').localeCompare(labels.get(b) ?? ''));

  const inputs: GroupInput[] = groupIds.map((g) => ({
    key: query.by === 'trainee' ? operatorKey(user, g) : String(g),
    label: labels.get(g) ?? `#${g}`,
    runs: (byGroup.get(g) ?? []).map((r) => ({
      targetLoadN: r.target_load_n,
      finalLoadsN: finalLoadsOf(r),
      driftPercent: oneStudCount ? driftOf(r) : [],
      operator: r.operator_id,
      // Set-aside runs have no place in the operator's sequence of complete runs.
      attempt: attemptOf.get(r.id) ?? null,
      stored: r.final_mean_n !== null && r.final_sd_n !== null ? { meanN: Number(r.final_mean_n), sdN: Number(r.final_sd_n) } : null,
      relaxationPercent: relaxation.get(Number(r.id)) ?? null,
      gasket: r.final_gasket_stress_mpa === null ? null : { stressMpa: Number(r.final_gasket_stress_mpa), minSeatingMpa: r.gasket_min_seating_mpa === null ? null : Number(r.gasket_min_seating_mpa) },
    })),
  }));
  const result = compareGroups(inputs, { subject: SUBJECT[query.by], planned: query.planned, blocks: query.by !== 'trainee' });
  const nutFactors = query.by === 'lubricant' ? await nutFactorsFor([...where, match], params, groupIds, labels) : [];
  const missing = query.ids?.filter((g) => !byGroup.has(g)) ?? [];
  if (missing.length) result.warnings.push(`No runs you may see match ${missing.length === 1 ? 'one of the chosen groups' : `${missing.length} of the chosen groups`} with these filters.`);
  if (query.source === 'both') result.warnings.push('Measured and simulated runs are pooled in these groups, as asked.');
  const response = { ...result, by: query.by, source: query.source, totalRuns: inputs.reduce((n, g) => n + g.runs.length, 0), simulatedLeftOut: Number(side?.left_out ?? 0), nutFactors };
  return { response, fingerprint };
}

/** The chosen runs' part of the fingerprint, from the rows read: what `fingerprintByAggregate` sums. */
function fingerprintOfRead(rows: readonly RunRowArray[]): Pick<FingerprintParts, 'n' | 'changed' | 'ids'> {
  let changed: string | null = null;
  let ids = 0;
  for (const row of rows) {
    ids += Number(row[0]);
    if (changed === null || row[12] > changed) changed = row[12];
  }
  return { n: rows.length, changed, ids };
}

/**
 * Per run, the relaxation during the hold after its last pass: the last hold reading's loads
 * against the final loads (`finalHoldRelaxationPercent`). Runs whose holds all follow an earlier
 * pass (a retightening came after) or that have none are left out.
 */
async function relaxationByRun(rows: readonly RunRowSql[]): Promise<Map<number, number>> {
  const out = new Map<number, number>();
  if (rows.length === 0) return out;
  // Most runs have no hold: find the few that do first, so the last-pass scan below reads their steps only.
  // The runs with holds come from the primary key's first column alone (a loose index scan, one entry per
  // held run) and are matched here, instead of sending the ids of every chosen run to the database.
  const chosen = new Set(rows.map((r) => Number(r.id)));
  const ids = (await readRowArrays<[runId: number]>('SELECT DISTINCT run_id FROM run_holds')).map(([runId]) => Number(runId)).filter((runId) => chosen.has(runId));
  if (ids.length === 0) return out;
  const holds = await sequelize.query<{ run_id: number; after_pass: number; elapsed_s: number; position: number; load_n: number }>(
    `SELECT h.run_id, h.after_pass, h.elapsed_s, h.position, h.load_n FROM run_holds h
     JOIN (SELECT s.run_id, MAX(s.pass_number) AS last_pass FROM tightening_steps s WHERE s.run_id IN (?) GROUP BY s.run_id) p ON p.run_id = h.run_id AND p.last_pass = h.after_pass
     WHERE h.elapsed_s = (SELECT MAX(x.elapsed_s) FROM run_holds x WHERE x.run_id = h.run_id AND x.after_pass = h.after_pass)`,
    { type: QueryTypes.SELECT, replacements: [ids] },
  );
  const loadsByRun = new Map<number, Map<number, number>>();
  for (const h of holds) {
    const loads = loadsByRun.get(Number(h.run_id)) ?? new Map<number, number>();
    loads.set(Number(h.position), Number(h.load_n));
    loadsByRun.set(Number(h.run_id), loads);
  }
  for (const row of rows) {
    const held = loadsByRun.get(Number(row.id));
    if (!held) continue;
    const finals = finalLoadsOf(row);
    const value = finalHoldRelaxationPercent(finals, finals.map((_, i) => held.get(i + 1) ?? Number.NaN));
    if (value !== null) out.set(Number(row.id), value);
  }
  return out;
}

/** Each run's attempt number (1-based) from the complete runs in (operator, recorded_at, id) order. */
function attemptNumbers(sequence: readonly (readonly [operatorId: number, id: number])[]): Map<number, number> {
  const attempts = new Map<number, number>();
  let operator: number | null = null;
  let n = 0;
  for (const [operatorId, id] of sequence) {
    n = operatorId === operator ? n + 1 : 1;
    operator = operatorId;
    attempts.set(id, n);
  }
  return attempts;
}

async function groupLabels(user: SessionUser, by: CompareBy, ids: number[]): Promise<Map<number, string>> {
  const labels = new Map<number, string>();
  if (!ids.length) return labels;
  if (by === 'runs' || by === 'hardwareUse') {
    // A use number n: the n-th run recorded on its hardware set.
    for (const id of ids) labels.set(id, by === 'runs' ? `Run ${id}` : `Use ${id} of the set`);
    return labels;
  }
  if (by === 'lubricantLot') {
    const lots = await sequelize.query<{ id: number; name: string }>("SELECT o.id, CONCAT(l.name, ', lot ', o.lot_code) AS name FROM lubricant_lots o JOIN lubricants l ON l.id = o.lubricant_id WHERE o.id IN (?)", { type: QueryTypes.SELECT, replacements: [ids] });
    for (const row of lots) labels.set(row.id, row.name);
    return labels;
  }
  const table = { method: 'methods', lubricant: 'lubricants', cohort: 'cohorts', trainee: 'users' }[by];
  const rows = await sequelize.query<{ id: number; name: string }>(`SELECT id, name FROM ${table} WHERE id IN (?)`, { type: QueryTypes.SELECT, replacements: [ids] });
  for (const row of rows) labels.set(row.id, by === 'trainee' ? operatorLabel(user, row) : row.name);
  return labels;
}

/**
 * Nut factor per lubricant from first-pass steps with a recorded torque: in the first pass each
 * stud is pulled up from snug, so its load right after its own step is the load that torque
 * produced (K = T/(D·F), short form, common practice).
 */
async function nutFactorsFor(where: string[], params: unknown[], lubricantIds: number[], labels: Map<number, string>): Promise<NutFactorByLubricant[]> {
  const rows = await sequelize.query<{ lubricant_id: number; torque: number; load_n: number; thread_system: 'inch' | 'metric'; thread_diameter: number }>(
    `SELECT r.lubricant_id, s.applied_torque_nm AS torque, g.load_n, j.thread_system, j.thread_diameter
     FROM runs r JOIN joints j ON j.id = r.joint_id
     JOIN tightening_steps s ON s.run_id = r.id AND s.pass_number = 1 AND s.applied_torque_nm > 0
     JOIN readings g ON g.step_id = s.id AND g.position = s.position
     WHERE ${where.join(' AND ')} AND g.load_n > 0`,
    { type: QueryTypes.SELECT, replacements: params },
  );
  const result: NutFactorByLubricant[] = [];
  lubricantIds.forEach((id, index) => {
    const mine = rows.filter((r) => r.lubricant_id === id);
    if (mine.length < 3) return;
    const fit = nutFactor(
      {
        torque: mine.map((r) => r.torque),
        diameter: mine.map((r) => studDiameterM({ threadSystem: r.thread_system, threadDiameter: r.thread_diameter })),
        force: mine.map((r) => r.load_n),
      },
      { units: 'SI', confidence: 0.95 },
    );
    result.push({ key: String(id), label: labels.get(id) ?? `#${id}`, colourIndex: index % 8, k: fit.fitted, low: fit.confidenceInterval.lower, high: fit.confidenceInterval.upper, n: fit.n });
  });
  return result;
}

/**
 * The runs a comparison selects (every filter, the source condition and this person's scope), each
 * with its group as the comparison keys it; saved comparisons keep these ids with the results.
 */
export async function comparisonRunKeys(user: SessionUser, query: CompareQuery): Promise<{ runId: number; groupKey: string }[]> {
  const { where, params } = await filterSql(user, query);
  const rows = await sequelize.query<{ id: number; group_id: number }>(
    `SELECT r.id, ${GROUP_COLUMN[query.by]} AS group_id FROM runs r WHERE ${[...where, SOURCE_SQL[query.source]].join(' AND ')} ORDER BY r.id`,
    { type: QueryTypes.SELECT, replacements: params },
  );
  return rows.map((r) => ({ runId: r.id, groupKey: query.by === 'trainee' ? operatorKey(user, r.group_id) : String(r.group_id) }));
}
