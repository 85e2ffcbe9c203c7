import 'server-only';
import { Cohort } from '@/models';
import { AppError } from '../http/errors';
import { assertRole, type SessionUser } from '../auth/session';

export const COHORT_ROLES = ['instructor', 'admin'] as const;

/**
 * The cohort, when this person may manage it: admins every cohort, instructors the ones they
 * teach. Anyone else, or a cohort that is not theirs: 403 / 404 (we do not reveal which exists).
 */
export async function manageableCohort(user: SessionUser | null, cohortId: number): Promise<Cohort> {
  assertRole(user, COHORT_ROLES);
  const cohort = Number.isInteger(cohortId) && cohortId > 0 ? await Cohort.findByPk(cohortId) : null;
  if (!cohort || (user.role === 'instructor' && cohort.instructorId !== user.id)) {
    throw new AppError('not_found', 'That cohort does not exist, or it is not one you teach.');
  }
  return cohort;
}
