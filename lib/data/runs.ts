import 'server-only';
import { Op, QueryTypes } from 'sequelize';
import { z } from 'zod';
import { Cohort, Joint, Lubricant, Method, Run, User, sequelize } from '@/models';
import { RUN_SOURCES, RUN_STATUSES } from '@/models/run';
import type { SessionUser } from '../auth/session';
import { isoDateSchema } from '../validation/iso-date';
import { operatorLabel, refuseOperatorIdsForResearcher, runScope, runScopeSql } from './scope';
import { RUN_LIST_VERSION_SQL, rememberRunList, rememberedRunList } from './run-list-memo';

const id = z.coerce.number().int().positive().max(2 ** 31);
const isoDate = isoDateSchema();

/** The runs table's query: filters, sorting and paging, validated at the boundary. */
export const runListQuerySchema = z
  .object({
    methodId: id.optional(),
    lubricantId: id.optional(),
    cohortId: id.optional(),
    operatorId: id.optional(),
    jointId: id.optional(),
    source: z.enum(RUN_SOURCES).optional(),
    status: z.enum(RUN_STATUSES).optional(),
    from: isoDate.optional(),
    to: isoDate.optional(),
    sort: z.enum(['recordedAt', 'finalCv', 'finalMeanN', 'passCount']).default('recordedAt'),
    dir: z.enum(['asc', 'desc']).default('desc'),
    page: z.coerce.number().int().min(1).max(100_000).default(1),
    pageSize: z.coerce.number().int().min(1).max(200).default(25),
  })
  .strict()
  .refine((q) => !q.from || !q.to || q.from <= q.to, { message: 'must not be before "from"', path: ['to'] });

export type RunListQuery = z.infer<typeof runListQuerySchema>;

export interface RunRow {
  id: number;
  recordedAt: string;
  jointName: string;
  studCount: number;
  methodName: string;
  lubricantName: string;
  operatorName: string;
  cohortName: string | null;
  source: string;
  status: string;
  passCount: number;
  targetLoadN: number;
  finalMeanN: number | null;
  finalCv: number | null;
}

export interface RunPage {
  rows: RunRow[];
  total: number;
  page: number;
  pageSize: number;
}

/** The runs query's filters, scoped to this person, as SQL on the alias `r` (shared by the table and the selection export). */
export async function runListFilterSql(
  user: SessionUser,
  query: Omit<RunListQuery, 'sort' | 'dir' | 'page' | 'pageSize'>,
): Promise<{ sql: string; params: unknown[] }> {
  refuseOperatorIdsForResearcher(user, 'operatorId', query.operatorId !== undefined);
  const scope = await runScopeSql(user);
  const conditions = [scope.sql];
  const params: unknown[] = [...scope.params];
  const columns = { methodId: 'r.method_id', lubricantId: 'r.lubricant_id', cohortId: 'r.cohort_id', operatorId: 'r.operator_id', jointId: 'r.joint_id', source: 'r.source', status: 'r.status' } as const;
  for (const [key, column] of Object.entries(columns) as [keyof typeof columns, string][]) {
    const value = query[key];
    if (value !== undefined) (conditions.push(`${column} = ?`), params.push(value));
  }
  if (query.from) (conditions.push('r.recorded_at >= ?'), params.push(new Date(`${query.from}T00:00:00Z`)));
  if (query.to) (conditions.push('r.recorded_at < ?'), params.push(new Date(new Date(`${query.to}T00:00:00Z`).getTime() + 86_400_000)));
  return { sql: conditions.join(' AND '), params };
}

/**
 * Run rows with their names, for raw queries. The page is cut from `runs` alone first (so MariaDB
 * walks the covering `runs_list` index, which holds every column listed, and stops at the limit), and
 * only those rows are joined to their names. With `total`, each row also carries the count of every
 * row the filter matches, as an uncorrelated subquery computed once, so the runs list costs one round
 * trip and one pooled connection: `'maintained'` sums the counters of `run_counts` (a handful of rows;
 * only for a filter on scope, cohort, operator, status and source, see `answeredByRunCounts`),
 * `'count'` counts the runs. `withVersion` adds the runs list's version stamp (`run-list-memo.ts`),
 * read in the same statement so it names exactly the data of these rows.
 */
export async function selectRunRows(filter: { sql: string; params: unknown[] }, orderBy: string, limit: number, offset = 0, total: false | 'count' | 'maintained' = false, withVersion = false): Promise<RunRowSql[]> {
  const totalSql = total === 'maintained' ? `(SELECT COALESCE(SUM(r.n), 0) FROM run_counts r WHERE ${filter.sql})` : `(SELECT COUNT(*) FROM runs r WHERE ${filter.sql})`;
  return sequelize.query<RunRowSql>(
    `SELECT r.id, r.recorded_at, r.stud_count, r.source, r.status, r.pass_count, r.target_load_n, r.final_mean_n, r.final_cv,
       j.name AS joint_name, m.name AS method_name, l.name AS lubricant_name, o.id AS operator_id, o.name AS operator_name, c.name AS cohort_name
       ${total ? `, ${totalSql} AS total` : ''}${withVersion ? `, ${RUN_LIST_VERSION_SQL} AS list_version` : ''}
     FROM (SELECT r.id, r.recorded_at, r.stud_count, r.source, r.status, r.pass_count, r.target_load_n, r.final_mean_n, r.final_cv,
             r.joint_id, r.method_id, r.lubricant_id, r.operator_id, r.cohort_id
           FROM runs r WHERE ${filter.sql} ORDER BY ${orderBy} LIMIT ? OFFSET ?) r
     JOIN joints j ON j.id = r.joint_id JOIN methods m ON m.id = r.method_id JOIN lubricants l ON l.id = r.lubricant_id
     JOIN users o ON o.id = r.operator_id LEFT JOIN cohorts c ON c.id = r.cohort_id
     ORDER BY ${orderBy}`,
    { type: QueryTypes.SELECT, replacements: [...(total ? filter.params : []), ...filter.params, limit, offset] },
  );
}

export interface RunRowSql {
  id: number;
  recorded_at: Date;
  stud_count: number;
  source: string;
  status: string;
  pass_count: number;
  target_load_n: number;
  final_mean_n: number | null;
  final_cv: number | null;
  joint_name: string;
  method_name: string;
  lubricant_name: string;
  operator_id: number;
  operator_name: string;
  cohort_name: string | null;
  /** With `total`: every row the filter matches. */
  total?: number | bigint;
  /** With `withVersion`: the runs list's version stamp. */
  list_version?: string | null;
}

const SORT_COLUMNS: Record<RunListQuery['sort'], string> = { recordedAt: 'r.recorded_at', finalCv: 'r.final_cv', finalMeanN: 'r.final_mean_n', passCount: 'r.pass_count' };

/**
 * Whether the total can be read from `run_counts` (kept by triggers on `runs`, see migration
 * 20261204080000-run-counts): its key is operator, cohort, status and source, which is every column
 * the scope and these filters test; a filter on method, lubricant, joint or dates is counted.
 */
export const answeredByRunCounts = (query: Omit<RunListQuery, 'sort' | 'dir' | 'page' | 'pageSize'>): boolean =>
  query.methodId === undefined && query.lubricantId === undefined && query.jointId === undefined && query.from === undefined && query.to === undefined;

/**
 * One page of the runs list in one raw query: the page with its names and the total (every filter is
 * on the columns of `runs`), and the version stamp it was read at (null for a page without rows).
 * Sort column and direction come from a fixed list.
 */
async function pageOfRuns(user: SessionUser, query: RunListQuery, filter: { sql: string; params: unknown[] }): Promise<{ page: RunPage; version: string | null }> {
  const direction = query.dir === 'asc' ? 'ASC' : 'DESC';
  const offset = (query.page - 1) * query.pageSize;
  const rows = await selectRunRows(filter, `${SORT_COLUMNS[query.sort]} ${direction}, r.id DESC`, query.pageSize, offset, answeredByRunCounts(query) ? 'maintained' : 'count', true);
  // A page past the end has no row to carry the count: then it is asked for on its own.
  const total = rows[0] ? Number(rows[0].total) : offset === 0 ? 0 : await countRuns(filter);
  return {
    version: rows[0]?.list_version == null ? null : String(rows[0].list_version),
    page: {
      total,
      page: query.page,
      pageSize: query.pageSize,
      rows: rows.map((r) => ({
        id: r.id,
        recordedAt: new Date(r.recorded_at).toISOString(),
        jointName: r.joint_name,
        studCount: r.stud_count,
        methodName: r.method_name,
        lubricantName: r.lubricant_name,
        operatorName: operatorLabel(user, { id: r.operator_id, name: r.operator_name }),
        cohortName: r.cohort_name,
        source: r.source,
        status: r.status,
        passCount: r.pass_count,
        targetLoadN: r.target_load_n,
        finalMeanN: r.final_mean_n,
        finalCv: r.final_cv,
      })),
    },
  };
}

/** One page of the runs list (for pages and other data functions). */
export async function listRuns(user: SessionUser, query: RunListQuery): Promise<RunPage> {
  return (await pageOfRuns(user, query, await runListFilterSql(user, query))).page;
}

/**
 * One page of the runs list as the JSON of `GET /api/runs`: the remembered answer while the runs
 * list's version stamp in MariaDB is unchanged (checked on every call), else computed and kept
 * (`run-list-memo.ts`). The key holds the person, their role, their scope's SQL and parameters and
 * the whole query.
 */
export async function listRunsJson(user: SessionUser, query: RunListQuery): Promise<string> {
  const filter = await runListFilterSql(user, query);
  const key = JSON.stringify([user.id, user.role, filter.sql, filter.params, query]);
  const remembered = await rememberedRunList(key);
  if (remembered !== null) return remembered;
  const { page, version } = await pageOfRuns(user, query, filter);
  const json = JSON.stringify(page);
  if (version !== null) rememberRunList(key, version, json);
  return json;
}

async function countRuns(filter: { sql: string; params: unknown[] }): Promise<number> {
  const [counted] = await sequelize.query<{ n: number }>(`SELECT COUNT(*) AS n FROM runs r WHERE ${filter.sql}`, { type: QueryTypes.SELECT, replacements: filter.params });
  return Number(counted?.n ?? 0);
}

export interface FilterOption {
  id: number;
  name: string;
}

export interface RunFilterOptions {
  methods: FilterOption[];
  lubricants: FilterOption[];
  joints: FilterOption[];
  cohorts: FilterOption[];
  operators: FilterOption[];
}

/** The choices for the runs filters, scoped like the runs themselves. */
export async function runFilterOptions(user: SessionUser): Promise<RunFilterOptions> {
  const scope = await runScope(user);
  const [methods, lubricants, joints, operatorRows, cohortRows] = await Promise.all([
    Method.findAll({ attributes: ['id', 'name'], order: [['name', 'ASC']], raw: true }),
    Lubricant.findAll({ attributes: ['id', 'name'], order: [['name', 'ASC']], raw: true }),
    Joint.findAll({ attributes: ['id', 'name'], order: [['name', 'ASC']], raw: true }),
    Run.findAll({ where: scope, attributes: ['operatorId'], group: ['operatorId'], raw: true }),
    Run.findAll({ where: { [Op.and]: [scope, { cohortId: { [Op.ne]: null } }] }, attributes: ['cohortId'], group: ['cohortId'], raw: true }),
  ]);
  const operators = await User.findAll({ where: { id: operatorRows.map((r) => r.operatorId) }, attributes: ['id', 'name'] });
  const cohorts = await Cohort.findAll({ where: { id: cohortRows.map((r) => r.cohortId as number) }, attributes: ['id', 'name'], order: [['startsOn', 'ASC']] });
  return {
    methods,
    lubricants,
    joints,
    cohorts: cohorts.map((c) => ({ id: c.id, name: c.name })),
    // Researchers get no operator choice: its values would be user ids.
    operators: (user.role === 'researcher' ? [] : operators)
      .map((o) => ({ id: o.id, name: operatorLabel(user, o) }))
      .sort((a, b) => a.name.localeCompare(b.name)),
  };
}
