import type { Metadata } from 'next';
import { JobsTable } from '@/components/jobs/jobs-table';
import { listJobs } from '@/lib/data/jobs/admin';
import { requirePageUser } from '@/lib/auth/session';

export const metadata: Metadata = { title: 'Background jobs' };
export const dynamic = 'force-dynamic';

export default async function JobsPage() {
  const user = await requirePageUser(['admin']);
  const jobs = await listJobs(user);
  return (
    <div className="space-y-4">
      <div>
        <h1 className="text-2xl font-semibold">Background jobs</h1>
        <p className="text-sm text-muted">Work done away from the screens, such as refresher reminders before a record of training runs out. A job that fails is tried again later, waiting longer each time; one that has used its attempts stays failed until you retry it.</p>
      </div>
      <JobsTable jobs={jobs} />
    </div>
  );
}
