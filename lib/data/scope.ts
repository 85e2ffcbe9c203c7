import 'server-only';
import { Op, type WhereOptions } from 'sequelize';
import { Cohort } from '@/models';
import { AppError } from '../http/errors';
import type { SessionUser } from '../auth/session';
import { pseudonymFor } from './pseudonym';

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

/**
 * How an operator is keyed in what this viewer receives (run JSON, comparison groups): researchers
 * get the pseudonym's code, never the user id; everyone else the id as text.
 */
export function operatorKey(viewer: SessionUser, operatorId: number): string {
  return viewer.role === 'researcher' && operatorId !== viewer.id ? pseudonymFor(operatorId).replace(/^Operator /, 'op-') : String(operatorId);
}

/** Researchers do not choose people by user id (they would learn which id is behind a pseudonym). */
export function refuseOperatorIdsForResearcher(viewer: SessionUser, field: string, given: boolean): void {
  if (viewer.role === 'researcher' && given) {
    const message = 'Researchers see operators only as pseudonyms, so runs cannot be chosen by a person’s id.';
    throw new AppError('invalid_input', message, { field, fieldErrors: { [field]: [message] } });
  }
}

/** Free text (run notes, comments) may name people, so researchers do not receive it. */
export const seesFreeText = (viewer: SessionUser) => viewer.role !== 'researcher';

/** The same rule as runScope, as an SQL condition on the alias `r` (for raw queries). */
export async function runScopeSql(user: SessionUser): Promise<{ sql: string; params: unknown[] }> {
  if (user.role === 'trainee') return { sql: 'r.operator_id = ?', params: [user.id] };
  if (user.role === 'instructor') {
    const cohorts = await taughtCohortIds(user);
    return cohorts.length ? { sql: '(r.operator_id = ? OR r.cohort_id IN (?))', params: [user.id, cohorts] } : { sql: 'r.operator_id = ?', params: [user.id] };
  }
  return { sql: '1 = 1', params: [] };
}
