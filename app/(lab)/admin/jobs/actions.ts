'use server';

import { revalidatePath } from 'next/cache';
import { okState } from '@/lib/http/form-state';
import { withActionRole } from '@/lib/http/server-action';
import { retryFailedJob } from '@/lib/data/jobs/admin';

/** Puts a failed job back in the queue (admin); bind the job's id. */
export const retryJobAction = withActionRole(['admin'], async (user, _form, jobId: number) => {
  await retryFailedJob(user, jobId);
  revalidatePath('/admin/jobs');
  return okState('Queued again: a worker takes it within a minute.');
});
