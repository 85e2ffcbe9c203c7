import 'server-only';
import { Op, fn, col } from 'sequelize';
import { Cohort, CohortMember, Method, Run, User } from '@/models';
import type { Role } from '@/models/user';
import type { SessionUser } from '../auth/session';
import { currentCohortOf } from '../cohorts/current-cohort';
import { listRuns, type RunRow } from './runs';
import { runScope, taughtCohortIds } from './scope';

export interface CohortSummary {
  id: number;
  name: string;
  site: string;
  startsOn: string;
  endsOn: string;
  members: number;
  runs: number;
}

export type HomeSummary =
  | { role: 'instructor'; currentCohort: CohortSummary | null; cohorts: CohortSummary[]; runsThisWeek: number; latestRuns: RunRow[] }
  | { role: 'researcher'; totalRuns: number; runsThisWeek: number; setAside: number; byMethod: { name: string; runs: number; meanCv: number | null }[]; latestRuns: RunRow[] }
  | { role: 'trainee'; attempts: number; latest: RunRow | null; recent: RunRow[]; bestCv: number | null }
  | { role: 'admin'; accountsByRole: Record<Role, number>; totalRuns: number; latestAccounts: { id: number; name: string; email: string; role: Role; createdAt: string }[] };

const WEEK_MS = 7 * 86_400_000;

async function cohortSummaries(ids: number[]): Promise<CohortSummary[]> {
  if (!ids.length) return [];
  const [cohorts, members, runs] = await Promise.all([
    Cohort.findAll({ where: { id: ids }, order: [['startsOn', 'DESC']] }),
    CohortMember.findAll({ where: { cohortId: ids }, attributes: ['cohortId', [fn('COUNT', col('user_id')), 'n']], group: ['cohortId'], raw: true }),
    Run.findAll({ where: { cohortId: ids }, attributes: ['cohortId', [fn('COUNT', col('id')), 'n']], group: ['cohortId'], raw: true }),
  ]);
  const count = (rows: unknown[], id: number) => Number((rows as { cohortId: number; n: number }[]).find((r) => r.cohortId === id)?.n ?? 0);
  return cohorts.map((c) => ({ id: c.id, name: c.name, site: c.site, startsOn: c.startsOn, endsOn: c.endsOn, members: count(members, c.id), runs: count(runs, c.id) }));
}

export async function homeSummary(user: SessionUser, now = new Date()): Promise<HomeSummary> {
  const weekAgo = new Date(now.getTime() - WEEK_MS);
  const latest = (pageSize: number) => listRuns(user, { sort: 'recordedAt', dir: 'desc', page: 1, pageSize });
  switch (user.role) {
    case 'instructor': {
      const ids = await taughtCohortIds(user);
      const cohorts = await cohortSummaries(ids);
      const today = now.toISOString().slice(0, 10);
      const currentCohort = currentCohortOf(cohorts, today);
      const scope = await runScope(user);
      const runsThisWeek = await Run.count({ where: { [Op.and]: [scope, { recordedAt: { [Op.gte]: weekAgo } }] } });
      return { role: 'instructor', currentCohort, cohorts, runsThisWeek, latestRuns: (await latest(6)).rows };
    }
    case 'researcher': {
      const [totalRuns, runsThisWeek, setAside, grouped, methods] = await Promise.all([
        Run.count(),
        Run.count({ where: { recordedAt: { [Op.gte]: weekAgo } } }),
        Run.count({ where: { status: 'set_aside' } }),
        Run.findAll({
          where: { status: 'complete' },
          attributes: ['methodId', [fn('COUNT', col('id')), 'runs'], [fn('AVG', col('final_cv')), 'meanCv']],
          group: ['methodId'],
          raw: true,
        }),
        Method.findAll({ attributes: ['id', 'name'], raw: true }),
      ]);
      const byMethod = (grouped as unknown as { methodId: number; runs: number; meanCv: number | null }[]).map((row) => ({
        name: methods.find((m) => m.id === row.methodId)?.name ?? `Method ${row.methodId}`,
        runs: Number(row.runs),
        meanCv: row.meanCv === null ? null : Number(row.meanCv),
      }));
      return { role: 'researcher', totalRuns, runsThisWeek, setAside, byMethod, latestRuns: (await latest(6)).rows };
    }
    case 'trainee': {
      const page = await latest(8);
      const best = (await Run.min('finalCv', { where: { operatorId: user.id, status: 'complete' } })) as number | null;
      return { role: 'trainee', attempts: page.total, latest: page.rows[0] ?? null, recent: page.rows, bestCv: best ?? null };
    }
    case 'admin': {
      const [counts, totalRuns, latestAccounts] = await Promise.all([
        User.findAll({ attributes: ['role', [fn('COUNT', col('id')), 'n']], group: ['role'], raw: true }),
        Run.count(),
        User.findAll({ order: [['createdAt', 'DESC'], ['id', 'DESC']], limit: 8 }),
      ]);
      const accountsByRole: Record<Role, number> = { admin: 0, instructor: 0, researcher: 0, trainee: 0 };
      for (const row of counts as unknown as { role: Role; n: number }[]) accountsByRole[row.role] = Number(row.n);
      return {
        role: 'admin',
        accountsByRole,
        totalRuns,
        latestAccounts: latestAccounts.map((u) => ({ id: u.id, name: u.name, email: u.email, role: u.role, createdAt: u.createdAt.toISOString() })),
      };
    }
  }
}
