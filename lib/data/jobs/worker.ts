import 'server-only';
import { ZodError } from 'zod';
import { sequelize, type Job } from '@/models';
import { AppError } from '../../http/errors';
import { sendMail, type MailSender } from '../../mail/mailer';
import { DEFAULT_RETRY_POLICY, type RetryPolicy } from '../../jobs/backoff';
import { isJobKind, parseJobPayload, type JobKind } from '../../jobs/job-kinds';
import { pollDelayMs } from '../../jobs/poll-delay';
import { claimJobs, recoverExpiredJobs } from './claim';
import { enqueueJob } from './enqueue';
import { markJobDone, markJobFailed } from './finish';
import { JOB_HANDLERS, periodicJobs, type JobHandler } from './handlers';
import type { JobContext } from './job-context';

export interface WorkerOptions {
  workerId: string;
  /** How often an idle worker looks at the table (spread ±50 %). */
  pollMs: number;
  /** How long a claimed job is held; longer than any handler may take (the SMTP timeouts add up to 20 s). */
  lockMs: number;
  /** Jobs taken per claim. */
  batch: number;
  retry: RetryPolicy;
  sendMail: MailSender;
  log: (line: string) => void;
}

export const DEFAULT_WORKER_OPTIONS: Omit<WorkerOptions, 'workerId'> = {
  pollMs: 5000,
  lockMs: 5 * 60_000,
  batch: 5,
  retry: DEFAULT_RETRY_POLICY,
  sendMail,
  log: (line) => console.log(line),
};

/** The message kept on the job for the admin: an AppError's own words, a generic line otherwise (details to the log). */
function errorNote(error: unknown): string {
  if (error instanceof AppError) return error.message;
  if (error instanceof ZodError) return 'The job\'s data does not match its kind; it cannot run.';
  return 'An unexpected error stopped this attempt (details in the worker\'s log).';
}

/** Runs one claimed job: its handler, then done; or the failure with its back-off. */
async function runClaimedJob(job: Job, options: WorkerOptions): Promise<void> {
  let handled = false;
  const context: JobContext = {
    jobId: Number(job.id),
    workerId: options.workerId,
    sendMail: options.sendMail,
    markDone: async (transaction) => {
      handled = true;
      if (!(await markJobDone(Number(job.id), options.workerId, transaction))) options.log(`[worker ${options.workerId}] job ${job.id}: lock lost before it was marked done`);
    },
  };
  try {
    if (!isJobKind(job.kind)) throw new ZodError([{ code: 'custom', message: `unknown job kind ${job.kind}`, path: ['kind'], input: job.kind }]);
    const kind: JobKind = job.kind;
    const payload = parseJobPayload(kind, JSON.parse(job.payload));
    await (JOB_HANDLERS[kind] as JobHandler<typeof kind>)(payload as never, context);
    if (!handled) await sequelize.transaction((transaction) => context.markDone(transaction));
    options.log(`[worker ${options.workerId}] job ${job.id} (${job.kind}) done`);
  } catch (error) {
    const permanent = error instanceof ZodError || error instanceof SyntaxError;
    const outcome = await markJobFailed({ id: Number(job.id), attempts: job.attempts, maxAttempts: job.maxAttempts }, options.workerId, errorNote(error), { policy: options.retry, permanent });
    options.log(`[worker ${options.workerId}] job ${job.id} (${job.kind}) attempt ${job.attempts} failed, ${outcome}: ${error instanceof Error ? error.message : String(error)}`);
  }
}

/** One look at the table: periodic jobs ensured, expired locks recovered, due jobs claimed and run. Answers how many ran. */
export async function workOnce(options: WorkerOptions, now = new Date()): Promise<number> {
  for (const job of periodicJobs(now)) await enqueueJob(job.kind, job.payload as never, { dedupeKey: job.dedupeKey, maxAttempts: 3 });
  const recovered = await recoverExpiredJobs(options.retry);
  if (recovered) options.log(`[worker ${options.workerId}] put back ${recovered} job(s) whose lock had expired`);
  const jobs = await claimJobs(options.workerId, { limit: options.batch, lockMs: options.lockMs });
  for (const job of jobs) await runClaimedJob(job, options);
  return jobs.length;
}

export interface WorkLoop {
  /** Finishes the job in hand, then stops (no new claims). */
  stop: () => Promise<void>;
  done: Promise<void>;
}

/**
 * The work loop: `workOnce` again at once while there was work, else after a jittered sleep. It keeps
 * no state between turns (everything is in the job table), so any number of instances may run one.
 * A database that does not answer is logged and tried again on the next turn.
 */
export function startWorkLoop(options: WorkerOptions, random: () => number = Math.random): WorkLoop {
  let stopping = false;
  let wake: (() => void) | null = null;
  const sleep = (ms: number) => new Promise<void>((resolve) => {
    const timer = setTimeout(resolve, ms);
    wake = () => { clearTimeout(timer); resolve(); };
  });
  const done = (async () => {
    while (!stopping) {
      let ran = 0;
      try {
        ran = await workOnce(options);
      } catch (error) {
        options.log(`[worker ${options.workerId}] could not work the job table: ${error instanceof Error ? error.message : String(error)}`);
      }
      if (!stopping && ran === 0) await sleep(pollDelayMs(options.pollMs, random()));
    }
  })();
  return {
    done,
    stop: async () => {
      stopping = true;
      wake?.();
      await done;
    },
  };
}
