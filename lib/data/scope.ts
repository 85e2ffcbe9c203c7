import 'server-only';
import { Op, type WhereOptions } from 'sequelize';
import { Cohort } from '@/models';
import type { SessionUser } from '../session';
import { pseudonymFor } from '../pseudonym';

/** The cohorts an instructor teaches. */
export async function taughtCohortIds(user: SessionUser): Promise<number[]> {
  const rows = await Cohort.findAll({ where: { instructorId: user.id }, attributes: ['id'], raw: true });
  return rows.map((row) => row.id);
}

/**
 * Which runs a person may see: admins and researchers all; instructors the runs of their cohorts
 * and their own; trainees only their own.
 */
export async function runScope(user: SessionUser): Promise<WhereOptions> {
  switch (user.role) {
    case 'admin':
    case 'researcher':
      return {};
    case 'instructor': {
      const cohortIds = await taughtCohortIds(user);
      return { [Op.or]: [{ operatorId: user.id }, ...(cohortIds.length ? [{ cohortId: cohortIds }] : [])] };
    }
    case 'trainee':
      return { operatorId: user.id };
  }
}

/** How an operator is named to this viewer: researchers see a stable pseudonym. */
export function operatorLabel(viewer: SessionUser, operator: { id: number; name: string }): string {
  return viewer.role === 'researcher' && operator.id !== viewer.id ? pseudonymFor(operator.id) : operator.name;
}

/** The same rule as runScope, as an SQL condition on the alias `r` (for raw queries). */
export async function runScopeSql(user: SessionUser): Promise<{ sql: string; params: unknown[] }> {
  if (user.role === 'trainee') return { sql: 'r.operator_id = ?', params: [user.id] };
  if (user.role === 'instructor') {
    const cohorts = await taughtCohortIds(user);
    return cohorts.length ? { sql: '(r.operator_id = ? OR r.cohort_id IN (?))', params: [user.id, cohorts] } : { sql: 'r.operator_id = ?', params: [user.id] };
  }
  return { sql: '1 = 1', params: [] };
}
