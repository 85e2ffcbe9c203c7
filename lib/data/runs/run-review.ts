import 'server-only';
import { Op, QueryTypes } from 'sequelize';
import { z } from 'zod';
import { AppError } from '@/lib/http/errors';
import { runScope } from '@/lib/data/scope';
import type { SessionUser } from '@/lib/auth/session';
import type { Role } from '@/models/user';
import { Run, sequelize } from '@/models';
import { writeAudit } from '../audit-log';

/** Who may decide on a run held for review: instructors and researchers (and admins). */
export const REVIEW_ROLES: readonly Role[] = ['instructor', 'researcher', 'admin'];

export const runReviewSchema = z.object({
  note: z
    .string({ error: 'Write a note: what you checked.' })
    .trim()
    .min(3, 'Write a note: what you checked.')
    .max(1000, 'Keep the note under 1,000 characters.'),
});

export type RunReviewInput = z.infer<typeof runReviewSchema>;

/**
 * Confirms a run held for review: the run counts (status complete) from now on, with who confirmed
 * it, when and the note kept on the run; the check's reasons stay on the run. Setting a held run
 * aside is `setRunAside` (lib/data/qualification/attempts.ts), the one way any run is set aside. The
 * row is locked first, so two decisions at once cannot both apply: the second answers 409.
 *
 * @throws AppError 'not_found' (no such run, or not this person's to see), 'conflict' (the run does
 *   not need review, or no longer), 'forbidden' (a role that may not decide).
 */
export async function reviewRun(user: SessionUser, runId: number, input: RunReviewInput): Promise<{ status: 'complete' }> {
  if (!REVIEW_ROLES.includes(user.role)) throw new AppError('forbidden', 'Only instructors and researchers may confirm a run held for review.');
  const visible = await Run.count({ where: { [Op.and]: [await runScope(user), { id: runId }] } });
  if (!visible) throw new AppError('not_found', 'This run does not exist, or it is not yours to see.');
  return sequelize.transaction(async (transaction) => {
    const [row] = await sequelize.query<{ status: string }>('SELECT status FROM runs WHERE id = ? FOR UPDATE', { type: QueryTypes.SELECT, transaction, replacements: [runId] });
    if (!row) throw new AppError('not_found', 'This run does not exist, or it is not yours to see.');
    if (row.status !== 'needs_review') throw new AppError('conflict', `This run does not need review (it is ${row.status.replace('_', ' ')}); reload the page.`);
    const now = new Date();
    await Run.update({ status: 'complete', reviewedById: user.id, reviewedAt: now, reviewNote: input.note }, { where: { id: runId }, transaction });
    await writeAudit(transaction, user, { objectType: 'run', objectId: runId, action: 'confirm_review', reason: input.note, before: { status: 'needs_review' }, after: { status: 'complete' } });
    return { status: 'complete' as const };
  });
}
