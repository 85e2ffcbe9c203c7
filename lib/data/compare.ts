import 'server-only';
import { createHash } from 'node:crypto';
import { QueryTypes } from 'sequelize';
import { z } from 'zod';
import { compareGroups, type ComparisonResult, type GroupInput } from '../analysis/compare-groups';
import { nutFactor } from '../stats/nut-factor';
import { studDiameterM } from '../joints/joint-properties';
import type { SessionUser } from '../auth/session';
import { isoDateSchema } from '../validation/iso-date';
import { sequelize } from '@/models';
import { operatorKey, operatorLabel, refuseOperatorIdsForResearcher, runScopeSql } from './scope';

const isoDate = isoDateSchema();
const idList = z
  .string()
  .regex(/^\d+(,\d+)*$/, 'must be a comma-separated list of numbers')
  .transform((text) => [...new Set(text.split(',').map(Number))])
  .refine((ids) => ids.length <= 8, 'can name at most 8 groups');

export const COMPARE_BY = ['method', 'lubricant', 'cohort', 'trainee', 'runs'] as const;
export type CompareBy = (typeof COMPARE_BY)[number];

/** The comparison's choice, as it lives in the URL. */
export const compareQuerySchema = z
  .object({
    by: z.enum(COMPARE_BY).default('method'),
    ids: idList.optional(),
    jointId: z.coerce.number().int().positive().max(2 ** 31).optional(),
    from: isoDate.optional(),
    to: isoDate.optional(),
    passCount: z.coerce.number().int().min(1).max(50).optional(),
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
  totalRuns: number;
  nutFactors: NutFactorByLubricant[];
  /** What was computed where, for the curious (and for the note). */
}

const GROUP_COLUMN: Record<CompareBy, string> = { method: 'r.method_id', lubricant: 'r.lubricant_id', cohort: 'r.cohort_id', trainee: 'r.operator_id', runs: 'r.id' };
const SUBJECT: Record<CompareBy, string> = { method: 'these methods', lubricant: 'these lubricants', cohort: 'these cohorts', trainee: 'these operators', runs: 'these runs' };

interface RunRowSql {
  id: number;
  group_id: number;
  target_load_n: number;
  final_loads_json: string | null;
  drift_json: string | null;
}


/**
 * A comparison of groups of complete runs (set-aside runs are left out). One query reads the stored
 * per-run profiles (final loads and drift, kept on `runs` when a run is saved); the statistics run
 * in Node on those. Nut factors (lubricant comparisons only) read first-pass steps with torque.
 */
export async function compareRuns(user: SessionUser, query: CompareQuery): Promise<CompareResponse> {
  return JSON.parse(await compareRunsJson(user, query)) as CompareResponse;
}

/** Cached comparisons older than this are removed when a new one is stored. */
const CACHE_DAYS = 2;

/**
 * The comparison as JSON text, from the shared cache when the runs it depends on are unchanged.
 * The fingerprint (count, last change and id sum of the matching runs, and the last change of the
 * group names) is one aggregate over the same filter, so a cache hit costs about one bare
 * aggregate plus a primary-key read.
 */
export async function compareRunsJson(user: SessionUser, query: CompareQuery): Promise<string> {
  refuseOperatorIdsForResearcher(user, 'ids', query.by === 'trainee' && Boolean(query.ids?.length));
  const { where, params } = await filterSql(user, query);
  const [fp] = await sequelize.query<{ n: number; changed: Date | null; ids: number | null; names: Date | null }>(
    `SELECT COUNT(*) AS n, MAX(r.updated_at) AS changed, SUM(r.id) AS ids,
       GREATEST(COALESCE((SELECT MAX(updated_at) FROM methods), 0), COALESCE((SELECT MAX(updated_at) FROM lubricants), 0),
                COALESCE((SELECT MAX(updated_at) FROM cohorts), 0), COALESCE((SELECT MAX(updated_at) FROM users), 0)) AS names
     FROM runs r WHERE ${where.join(' AND ')}`,
    { type: QueryTypes.SELECT, replacements: params },
  );
  const fingerprint = `${fp?.n}:${fp?.changed ? new Date(fp.changed).toISOString() : '-'}:${fp?.ids ?? 0}:${String(fp?.names ?? '-')}`;
  const viewer = user.role === 'admin' || user.role === 'researcher' ? user.role : `${user.role}:${user.id}`;
  const key = createHash('sha256').update(JSON.stringify({ viewer, query: Object.entries(query).sort(([a], [b]) => a.localeCompare(b)) })).digest('hex');
  const [cached] = await sequelize.query<{ body: string }>('SELECT body FROM comparison_cache WHERE cache_key = ? AND fingerprint = ?', {
    type: QueryTypes.SELECT,
    replacements: [key, fingerprint],
  });
  if (cached) return cached.body;
  const body = JSON.stringify(await computeComparison(user, query, where, params));
  await sequelize.query('REPLACE INTO comparison_cache (cache_key, fingerprint, body, created_at) VALUES (?, ?, ?, NOW())', { replacements: [key, fingerprint, body] });
  await sequelize.query('DELETE FROM comparison_cache WHERE created_at < NOW() - INTERVAL ? DAY', { replacements: [CACHE_DAYS] });
  return body;
}

async function filterSql(user: SessionUser, query: CompareQuery): Promise<{ where: string[]; params: unknown[] }> {
  const scope = await runScopeSql(user);
  const where = ["r.status = 'complete'", scope.sql];
  const params: unknown[] = [...scope.params];
  if (query.jointId) (where.push('r.joint_id = ?'), params.push(query.jointId));
  if (query.from) (where.push('r.recorded_at >= ?'), params.push(`${query.from} 00:00:00`));
  if (query.to) (where.push('r.recorded_at < DATE_ADD(?, INTERVAL 1 DAY)'), params.push(`${query.to} 00:00:00`));
  if (query.passCount) (where.push('r.pass_count = ?'), params.push(query.passCount));
  const column = GROUP_COLUMN[query.by];
  if (query.ids?.length) (where.push(`${column} IN (?)`), params.push(query.ids));
  else if (query.by === 'cohort') where.push('r.cohort_id IS NOT NULL');
  return { where, params };
}

async function computeComparison(user: SessionUser, query: CompareQuery, where: string[], params: unknown[]): Promise<CompareResponse> {
  const column = GROUP_COLUMN[query.by];
  const rows = await sequelize.query<RunRowSql>(
    `SELECT r.id, ${column} AS group_id, r.target_load_n, r.final_loads_json, r.drift_json FROM runs r WHERE ${where.join(' AND ')}`,
    { type: QueryTypes.SELECT, replacements: params },
  );

  const byGroup = new Map<number, RunRowSql[]>();
  for (const row of rows) {
    const list = byGroup.get(row.group_id) ?? [];
    list.push(row);
    byGroup.set(row.group_id, list);
  }
  // Keep the named groups in the order given; otherwise the 8 largest groups, ordered by label.
  let groupIds = query.ids?.filter((id) => byGroup.has(id)) ?? [...byGroup.keys()].sort((a, b) => (byGroup.get(b)?.length ?? 0) - (byGroup.get(a)?.length ?? 0)).slice(0, 8);
  const labels = await groupLabels(user, query.by, groupIds);
  if (!query.ids) groupIds = groupIds.sort((a, b) => (labels.get(a) ?? '').localeCompare(labels.get(b) ?? ''));

  const inputs: GroupInput[] = groupIds.map((id) => ({
    key: query.by === 'trainee' ? operatorKey(user, id) : String(id),
    label: labels.get(id) ?? `#${id}`,
    runs: (byGroup.get(id) ?? [])
      .filter((r) => r.final_loads_json)
      .map((r) => ({ targetLoadN: r.target_load_n, finalLoadsN: JSON.parse(r.final_loads_json as string) as number[], driftPercent: r.drift_json ? (JSON.parse(r.drift_json) as (number | null)[]) : [] })),
  }));
  const result = compareGroups(inputs, { subject: SUBJECT[query.by] });
  const nutFactors = query.by === 'lubricant' ? await nutFactorsFor(where, params, groupIds, labels) : [];
  const missing = query.ids?.filter((id) => !byGroup.has(id)) ?? [];
  if (missing.length) result.warnings.push(`No complete runs you may see match ${missing.length === 1 ? 'one of the chosen groups' : `${missing.length} of the chosen groups`} with these filters.`);
  return {
    ...result,
    by: query.by,
    totalRuns: inputs.reduce((n, g) => n + g.runs.length, 0),
    nutFactors,
  };
}

async function groupLabels(user: SessionUser, by: CompareBy, ids: number[]): Promise<Map<number, string>> {
  const labels = new Map<number, string>();
  if (!ids.length) return labels;
  const table = { method: 'methods', lubricant: 'lubricants', cohort: 'cohorts', trainee: 'users', runs: null }[by];
  if (!table) {
    for (const id of ids) labels.set(id, `Run ${id}`);
    return labels;
  }
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
