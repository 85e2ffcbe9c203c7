import type { JobDto } from '@/lib/data/jobs/admin';
import { formatDateTime } from '@/lib/format/format-date';
import { RetryJobButton } from './retry-job-button';

const STATUS_LABEL: Record<JobDto['status'], string> = { queued: 'Waiting', running: 'Running', done: 'Done', failed: 'Failed' };
const STATUS_CLASS: Record<JobDto['status'], string> = { queued: '', running: 'text-accent', done: 'text-muted', failed: 'text-danger' };

/** The admin's list of background jobs with a retry button on failed ones. */
export function JobsTable({ jobs }: { jobs: JobDto[] }) {
  if (!jobs.length) return <p className="text-sm text-muted">No background jobs yet.</p>;
  return (
    <div className="relative overflow-x-auto rounded-card border border-rule bg-panel">
      <table className="w-full min-w-[48rem] text-sm">
        <caption className="sr-only">Background jobs</caption>
        <thead className="text-left text-muted">
          <tr><th className="px-3 py-2">Job</th><th>Status</th><th>Attempts</th><th>Next run</th><th>Last error</th><th className="pr-3">Action</th></tr>
        </thead>
        <tbody>
          {jobs.map((job) => (
            <tr key={job.id} className="border-t border-rule align-top" data-testid={`job-${job.id}`}>
              <td className="px-3 py-1.5"><span className="font-medium">{job.kindLabel}</span> <span className="num text-muted">#{job.id}</span></td>
              <td className={`py-1.5 ${STATUS_CLASS[job.status]}`}>{STATUS_LABEL[job.status]}</td>
              <td className="num py-1.5">{job.attempts} of {job.maxAttempts}</td>
              <td className="num py-1.5">{job.nextRunAt ? formatDateTime(job.nextRunAt) : job.finishedAt ? `finished ${formatDateTime(job.finishedAt)}` : '—'}</td>
              <td className="max-w-[24rem] py-1.5 break-words">{job.lastError ?? '—'}</td>
              <td className="py-1.5 pr-3">{job.status === 'failed' ? <RetryJobButton jobId={job.id} /> : null}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
