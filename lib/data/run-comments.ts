import 'server-only';
import { z } from 'zod';
import { RunComment } from '@/models';
import { assertRole, type SessionUser } from '../auth/session';
import { loadRun } from './run-report';

export const commentSchema = z.object({
  body: z.string().trim().min(1, 'Write a comment first.').max(4000, 'Keep a comment under 4,000 characters.'),
});

/** An instructor (or admin) comments on a run they may see; the trainee sees it on the report. */
export async function addRunComment(user: SessionUser | null, runId: number, body: string): Promise<void> {
  assertRole(user, ['instructor', 'admin']);
  await loadRun(user, runId); // not_found when not theirs
  await RunComment.create({ runId, authorId: user.id, body });
}
