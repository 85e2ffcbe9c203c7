import type { Transaction } from 'sequelize';
import type { MailSender } from '../../mail/mailer';

/** What a job handler is given besides its payload. */
export interface JobContext {
  jobId: number;
  workerId: string;
  /** Marks the job done inside the handler's own transaction (so its writes and `done` commit together). */
  markDone: (transaction: Transaction) => Promise<void>;
  sendMail: MailSender;
}
