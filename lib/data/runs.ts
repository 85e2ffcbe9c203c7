import 'server-only';
import { Op, type Order, type WhereOptions } from 'sequelize';
import { z } from 'zod';
import { Cohort, Joint, Lubricant, Method, Run, User } from '@/models';
import { RUN_SOURCES, RUN_STATUSES } from '@/models/run';
import type { SessionUser } from '../session';
import { operatorLabel, runScope } from './scope';

const id = z.coerce.number().int().positive().max(2 ** 31);
const isoDate = z.string().regex(/^\d{4}-\d{2}-\d{2}$/, 'must be a date like 2026-03-31');

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

/** The runs query's filters, scoped to this person (shared by the table and the selection export). */
export async function runListWhere(user: SessionUser, query: Omit<RunListQuery, 'sort' | 'dir' | 'page' | 'pageSize'>): Promise<WhereOptions> {
  const filters: WhereOptions[] = [await runScope(user)];
  for (const key of ['methodId', 'lubricantId', 'cohortId', 'operatorId', 'jointId', 'source', 'status'] as const) {
    const value = query[key];
    if (value !== undefined) filters.push({ [key]: value });
  }
  if (query.from) filters.push({ recordedAt: { [Op.gte]: new Date(`${query.from}T00:00:00Z`) } });
  if (query.to) filters.push({ recordedAt: { [Op.lt]: new Date(new Date(`${query.to}T00:00:00Z`).getTime() + 86_400_000) } });
  return { [Op.and]: filters };
}

export async function listRuns(user: SessionUser, query: RunListQuery): Promise<RunPage> {
  const order: Order = [[query.sort, query.dir.toUpperCase()], ['id', 'DESC']];
  const { rows, count } = await Run.findAndCountAll({
    where: await runListWhere(user, query),
    include: [
      { model: Joint, as: 'joint', attributes: ['name'] },
      { model: Method, as: 'method', attributes: ['name'] },
      { model: Lubricant, as: 'lubricant', attributes: ['name'] },
      { model: User, as: 'operator', attributes: ['id', 'name'] },
      { model: Cohort, as: 'cohort', attributes: ['name'] },
    ],
    order,
    limit: query.pageSize,
    offset: (query.page - 1) * query.pageSize,
  });
  return {
    total: count,
    page: query.page,
    pageSize: query.pageSize,
    rows: rows.map((run) => {
      const r = run as Run & {
        joint: Joint;
        method: Method;
        lubricant: Lubricant;
        operator: User;
        cohort: Cohort | null;
      };
      return {
        id: r.id,
        recordedAt: r.recordedAt.toISOString(),
        jointName: r.joint.name,
        studCount: r.studCount,
        methodName: r.method.name,
        lubricantName: r.lubricant.name,
        operatorName: operatorLabel(user, r.operator),
        cohortName: r.cohort?.name ?? null,
        source: r.source,
        status: r.status,
        passCount: r.passCount,
        targetLoadN: r.targetLoadN,
        finalMeanN: r.finalMeanN,
        finalCv: r.finalCv,
      };
    }),
  };
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
    operators: operators
      .map((o) => ({ id: o.id, name: operatorLabel(user, o) }))
      .sort((a, b) => a.name.localeCompare(b.name)),
  };
}
