import { formatPercent } from '../calc/units';
import type { CriterionResult } from '../assessment/judge-run';

/** The e-mails Evenload sends, as plain text with a matching simple HTML part. */
export interface MailContent {
  subject: string;
  text: string;
  html: string;
}

const escapeHtml = (s: string) => s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

function htmlFrom(paragraphs: string[], link?: { href: string; label: string }): string {
  const body = paragraphs.map((p) => `<p>${escapeHtml(p).replace(/\n/g, '<br>')}</p>`).join('\n');
  const button = link ? `<p><a href="${escapeHtml(link.href)}">${escapeHtml(link.label)}</a></p>` : '';
  return `<!doctype html><html><body style="font-family: system-ui, sans-serif; color: #1f2a37">${body}${button}</body></html>`;
}

const when = (date: Date) => `${date.toISOString().slice(0, 16).replace('T', ' ')} UTC`;

export function invitationMail(args: { cohortName: string; instructorName: string; link: string; expiresAt: Date }): MailContent {
  const paragraphs = [
    `${args.instructorName} has invited you to the course "${args.cohortName}" on Evenload, the lab where your bolting runs and their evenness are recorded.`,
    `Set your password with this link (it works once, until ${when(args.expiresAt)}):\n${args.link}`,
    'If you did not expect this invitation, you can ignore this e-mail; no account is usable until a password is set.',
  ];
  return { subject: `Your invitation to ${args.cohortName} on Evenload`, text: paragraphs.join('\n\n'), html: htmlFrom(paragraphs, { href: args.link, label: 'Set your password' }) };
}

export function addedToCohortMail(args: { cohortName: string; instructorName: string; signInLink: string }): MailContent {
  const paragraphs = [
    `${args.instructorName} has added you to the course "${args.cohortName}" on Evenload.`,
    `Sign in with your existing account to see it:\n${args.signInLink}`,
  ];
  return { subject: `You were added to ${args.cohortName} on Evenload`, text: paragraphs.join('\n\n'), html: htmlFrom(paragraphs, { href: args.signInLink, label: 'Sign in' }) };
}

export function passwordResetMail(args: { link: string; expiresAt: Date }): MailContent {
  const paragraphs = [
    'Someone asked to reset the password of your Evenload account.',
    `Choose a new password with this link (it works once, until ${when(args.expiresAt)}):\n${args.link}`,
    'If it was not you, ignore this e-mail: your password stays as it is.',
  ];
  return { subject: 'Reset your Evenload password', text: paragraphs.join('\n\n'), html: htmlFrom(paragraphs, { href: args.link, label: 'Choose a new password' }) };
}

export function resultsMail(args: {
  traineeName: string;
  cohortName: string;
  recordedAt: Date;
  jointName: string;
  methodName: string;
  results: CriterionResult[];
  allMet: boolean;
  comment: string | null;
  signedByName: string;
  reportLink: string;
}): MailContent {
  const band = args.results.find((r) => r.key === 'band');
  const cv = args.results.find((r) => r.key === 'cv');
  const share = band?.detail?.shareInBandPercent;
  const figures = [
    cv?.measured != null ? `CV of the final loads: ${formatPercent(cv.measured, { sig: 3 })}` : null,
    typeof share === 'number' ? `Studs within the band: ${formatPercent(share, { sig: 3 })} (${band?.detail?.inBand} of ${band?.detail?.studs})` : null,
    band?.measured != null ? `Largest deviation from target: ${formatPercent(band.measured, { sig: 3 })}` : null,
  ].filter((line): line is string => line !== null);
  const criteria = args.results.map((r) => `${r.met ? 'Met' : 'Not met'}: ${r.label}. ${r.sentence}`);
  const paragraphs = [
    `Hello ${args.traineeName},`,
    `here is the result of your run of ${when(args.recordedAt)} in "${args.cohortName}" (${args.jointName}, ${args.methodName}): ${args.allMet ? 'every criterion was met.' : 'not every criterion was met yet.'}`,
    figures.join('\n'),
    criteria.join('\n'),
    args.comment ? `Comment from ${args.signedByName}: ${args.comment}` : `Signed off by ${args.signedByName}.`,
    `The full run report: ${args.reportLink}`,
    'These figures are from a training joint. The approved procedure, local codes and qualified engineering judgement govern every real joint.',
  ];
  return { subject: `Your run result in ${args.cohortName}: ${args.allMet ? 'all criteria met' : 'criteria not all met'}`, text: paragraphs.join('\n\n'), html: htmlFrom(paragraphs, { href: args.reportLink, label: 'Open the run report' }) };
}

export function refresherMail(args: { traineeName: string; courseName: string; scope: string; validUntil: string; verifyLink: string; progressLink: string }): MailContent {
  const paragraphs = [
    `Hello ${args.traineeName},`,
    `your record of training for "${args.courseName}" (${args.scope}) is valid until ${args.validUntil}. To keep it in force, book a refresher course before then.`,
    `Your records and their dates: ${args.progressLink}`,
    `Anyone can check this record at ${args.verifyLink}`,
  ];
  return { subject: `Your record of training for ${args.courseName} is valid until ${args.validUntil}`, text: paragraphs.join('\n\n'), html: htmlFrom(paragraphs, { href: args.progressLink, label: 'Open your records' }) };
}
