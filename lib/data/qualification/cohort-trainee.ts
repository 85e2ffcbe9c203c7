import 'server-only';
import type { Transaction } from 'sequelize';
import { CohortMember, User } from '@/models';
import { AppError } from '../../http/errors';

/** The trainee, when they are a member of the cohort; else 404 (nothing about who exists). */
export async function cohortTrainee(cohortId: number, traineeId: number, transaction?: Transaction): Promise<User> {
  const member = Number.isInteger(traineeId) ? await CohortMember.findOne({ where: { cohortId, userId: traineeId }, transaction }) : null;
  const trainee = member ? await User.findByPk(traineeId, { transaction }) : null;
  if (!trainee) throw new AppError('not_found', 'That person is not a member of this cohort.');
  return trainee;
}
