import 'server-only';
import nodemailer, { type Transporter } from 'nodemailer';
import { env } from '../platform/env';
import { AppError } from '../http/errors';

export interface OutgoingMail {
  to: string;
  cc?: string;
  subject: string;
  text: string;
  html: string;
  /** A fixed Message-ID (`<…@…>`), so a repeated message can be recognised as the same one by its receiver. */
  messageId?: string;
}

/** What sends mail: `sendMail` below, or a stand-in a worker is given (tests point one at their own SMTP server). */
export type MailSender = (mail: OutgoingMail) => Promise<void>;

const globalForMail = globalThis as unknown as { evenloadMailer?: Transporter };

function transporter(): Transporter {
  globalForMail.evenloadMailer ??= nodemailer.createTransport({
    host: env.SMTP_HOST,
    port: env.SMTP_PORT,
    secure: env.SMTP_PORT === 465,
    ...(env.SMTP_USER ? { auth: { user: env.SMTP_USER, pass: env.SMTP_PASS ?? '' } } : {}),
    connectionTimeout: 5000,
    greetingTimeout: 5000,
    socketTimeout: 10_000,
  });
  return globalForMail.evenloadMailer;
}

/** Sends one message through the configured SMTP server. @throws AppError `unavailable` when it cannot. */
export async function sendMail(mail: OutgoingMail): Promise<void> {
  try {
    await transporter().sendMail({ from: env.SMTP_FROM, ...mail });
  } catch (error) {
    console.error('[mail] sending failed', error);
    throw new AppError('unavailable', `The e-mail to ${mail.to} could not be sent: the mail server at ${env.SMTP_HOST}:${env.SMTP_PORT} did not accept it. Try again, or ask your admin to check the mail settings.`);
  }
}
