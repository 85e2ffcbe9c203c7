import 'server-only';
import { Op, type Transaction } from 'sequelize';
import { z } from 'zod';
import { Cohort, CohortMember, OneTimeToken, User, sequelize } from '@/models';
import type { TokenPurpose } from '@/models/one-time-token';
import { hashToken, looksLikeToken, newTokenValue, tokenExpiry, tokenState, TOKEN_STATE_MESSAGE, type TokenState } from '../accounts/one-time-token';
import { parseAddressList } from '../accounts/parse-address-list';
import { appBaseUrl } from '../platform/env';
import { AppError } from '../http/errors';
import { sendMail, type OutgoingMail } from '../mail/mailer';
import { addedToCohortMail, invitationMail, passwordResetMail } from '../mail/templates';
import { hashPassword } from '../auth/passwords';
import { isLocked, recordFailure } from './sign-in-throttle';
import { nameSchema } from '../validation/display-name';
import { assertRole, type SessionUser } from '../auth/session';
import { COHORT_ROLES, manageableCohort } from './cohort-access';
import { endAllSessions } from './session-store';
import { writeAudit } from './audit-log';

export const MAX_INVITES_AT_ONCE = 100;
export const PASSWORD_MIN_LENGTH = 10;

export interface InviteOutcome {
  /** New accounts created and sent an invitation link. */
  invited: string[];
  /** Existing accounts attached to the cohort (told by e-mail). */
  attached: string[];
  /** Already members: nothing to do. */
  alreadyMembers: string[];
  /** Addresses whose e-mail could not be sent (the rows are saved; send again later). */
  notSent: string[];
  /** Invitation links whose e-mail could not be sent, for the instructor to hand over another way. */
  handOver: Array<{ email: string; link: string }>;
}

/**
 * Invites trainees by e-mail address. All or nothing: when any entry is not an address, nothing
 * is saved and the message names every rejected entry, so the instructor corrects the list once.
 * An address that already has an account is attached to the cohort instead of duplicated; a new
 * address gets a trainee account without a password and a single-use link that expires in 72 h.
 */
export async function inviteToCohort(user: SessionUser | null, cohortId: number, rawList: unknown, now = new Date()): Promise<InviteOutcome> {
  const cohort = await manageableCohort(user, cohortId);
  const { valid, invalid } = parseAddressList(typeof rawList === 'string' ? rawList : '');
  if (invalid.length) {
    const list = invalid.map((entry) => `"${entry}"`).join(', ');
    const message = `${invalid.length === 1 ? 'This entry is' : 'These entries are'} not an e-mail address: ${list}. Nobody was invited; correct ${invalid.length === 1 ? 'it' : 'them'} and send again.`;
    throw new AppError('invalid_input', message, { fieldErrors: { addresses: [message] }, rejected: invalid });
  }
  if (!valid.length) throw new AppError('invalid_input', 'Enter at least one e-mail address.', { fieldErrors: { addresses: ['Enter at least one e-mail address.'] } });
  if (valid.length > MAX_INVITES_AT_ONCE) {
    const message = `That is ${valid.length} addresses; invite at most ${MAX_INVITES_AT_ONCE} at a time.`;
    throw new AppError('invalid_input', message, { fieldErrors: { addresses: [message] } });
  }
  const outcome: InviteOutcome = { invited: [], attached: [], alreadyMembers: [], notSent: [], handOver: [] };
  const links = new Map<string, string>();
  const mails: OutgoingMail[] = [];
  const base = appBaseUrl();
  await sequelize.transaction(async (transaction) => {
    // One instructor's invitations queue behind each other, so the hourly count holds on every instance.
    await User.findByPk(user!.id, { transaction, lock: transaction.LOCK.UPDATE, attributes: ['id'] });
    for (const email of valid) {
      let account = await User.findOne({ where: { email }, transaction, lock: transaction.LOCK.UPDATE });
      const isNew = !account;
      if (!account) {
        account = await User.create({ name: email.split('@')[0] ?? email, email, passwordHash: null, role: 'trainee' }, { transaction });
        await writeAudit(transaction, user, { objectType: 'account', objectId: account.id, action: 'invite_create', after: { email, role: 'trainee', cohortId: cohort.id, pending: true } });
      }
      const member = await CohortMember.findOne({ where: { cohortId: cohort.id, userId: account.id }, transaction });
      if (member && !isNew && account.passwordHash !== null) {
        outcome.alreadyMembers.push(email);
        continue;
      }
      if (!member) await CohortMember.create({ cohortId: cohort.id, userId: account.id }, { transaction });
      if (account.passwordHash === null) {
        // A new account, or an invited one that never set a password: a fresh link.
        await assertInvitationAllowed(user!.id, account.id, email, now, transaction);
        const value = newTokenValue();
        const expiresAt = tokenExpiry('invite', now);
        await OneTimeToken.create({ tokenSha256: hashToken(value), purpose: 'invite', userId: account.id, cohortId: cohort.id, createdById: user!.id, expiresAt }, { transaction });
        links.set(email, `${base}/welcome/${value}`);
        mails.push({ to: email, ...invitationMail({ cohortName: cohort.name, instructorName: user!.name, link: links.get(email)!, expiresAt }) });
        outcome.invited.push(email);
      } else {
        mails.push({ to: email, ...addedToCohortMail({ cohortName: cohort.name, instructorName: user!.name, signInLink: `${base}/sign-in` }) });
        outcome.attached.push(email);
      }
    }
  });
  for (const mail of mails) {
    try {
      await sendMail(mail);
    } catch {
      outcome.notSent.push(mail.to);
      const link = links.get(mail.to);
      if (link) outcome.handOver.push({ email: mail.to, link });
    }
  }
  return outcome;
}

/**
 * Sends a fresh invitation link to someone who has not set a password yet (the earlier links stop
 * mattering once one is used). `cohortId` names the cohort; without it, the latest cohort of theirs
 * this person manages (the People page). The same hourly and daily limits apply.
 */
export async function resendInvitation(user: SessionUser | null, userId: number, cohortId: number | null, now = new Date()): Promise<InviteOutcome> {
  assertRole(user, COHORT_ROLES);
  const account = Number.isInteger(userId) && userId > 0 ? await User.findByPk(userId) : null;
  const memberships = account ? await CohortMember.findAll({ where: { userId: account.id, ...(cohortId === null ? {} : { cohortId }) }, order: [['cohortId', 'DESC']] }) : [];
  let cohort: Cohort | null = null;
  for (const membership of memberships) {
    cohort = await manageableCohort(user, membership.cohortId).catch(() => null);
    if (cohort) break;
  }
  if (!account || !cohort) throw new AppError('not_found', 'That person is not in a cohort you manage.');
  if (account.passwordHash !== null) throw new AppError('conflict', `${account.email} has already set a password, so no new invitation was sent; "Forgot password" gives them a new one if needed.`);
  return inviteToCohort(user, cohort.id, account.email, now);
}

/** Invitation links one instructor may send per hour, and one address may receive per day (from any instructor). */
export const INVITATION_LIMITS = { perInstructorPerHour: 20, perAddressPerDay: 3 } as const;

const HOUR_MS = 3_600_000;

/**
 * Refuses the next invitation link when the instructor has sent `perInstructorPerHour` in the last
 * hour or the address has received `perAddressPerDay` in the last day. Counted on one_time_tokens in
 * MariaDB (inside the caller's transaction, which holds the instructor's and the account's rows), so
 * the limit holds across app instances. The caller's transaction rolls back: nobody in the list is invited.
 */
async function assertInvitationAllowed(instructorId: number, accountId: number, email: string, now: Date, transaction: Transaction): Promise<void> {
  const since = (ms: number) => ({ [Op.gt]: new Date(now.getTime() - ms) });
  const byInstructor = await OneTimeToken.count({ where: { purpose: 'invite', createdById: instructorId, createdAt: since(HOUR_MS) }, transaction });
  if (byInstructor >= INVITATION_LIMITS.perInstructorPerHour) {
    const message = `You have sent ${INVITATION_LIMITS.perInstructorPerHour} invitations in the last hour, the most allowed. Nobody in this list was invited; try again in an hour.`;
    throw new AppError('rate_limited', message, { fieldErrors: { addresses: [message] } });
  }
  const toAddress = await OneTimeToken.count({ where: { purpose: 'invite', userId: accountId, createdAt: since(24 * HOUR_MS) }, transaction });
  if (toAddress >= INVITATION_LIMITS.perAddressPerDay) {
    const message = `${email} has already been sent ${INVITATION_LIMITS.perAddressPerDay} invitations today, the most allowed. Nobody in this list was invited; remove ${email} or try again tomorrow.`;
    throw new AppError('rate_limited', message, { fieldErrors: { addresses: [message] } });
  }
}

export interface TokenDescription {
  state: TokenState;
  message: string | null;
  purpose: TokenPurpose | null;
  email: string | null;
  name: string | null;
  cohortName: string | null;
}

/** What a welcome or reset link stands for, for the page that shows its form. */
export async function describeToken(value: string, purpose: TokenPurpose, now = new Date()): Promise<TokenDescription> {
  // From the primary: the link is opened by someone else moments after it was written (a replica may lag).
  const row = looksLikeToken(value) ? await OneTimeToken.findOne({ where: { tokenSha256: hashToken(value), purpose }, useMaster: true }) : null;
  const state = tokenState(row, now);
  if (!row || state !== 'valid') return { state, message: state === 'valid' ? null : TOKEN_STATE_MESSAGE[state], purpose: row?.purpose ?? null, email: null, name: null, cohortName: null };
  const [account, cohort] = await Promise.all([User.findByPk(row.userId, { useMaster: true }), row.cohortId ? Cohort.findByPk(row.cohortId, { useMaster: true }) : null]);
  return { state, message: null, purpose: row.purpose, email: account?.email ?? null, name: account?.name ?? null, cohortName: cohort?.name ?? null };
}

export const setPasswordSchema = z
  .object({
    name: nameSchema({ what: 'your name', min: 2, max: 120, tooShort: 'Enter your name as it should appear on your results (at least 2 characters).' }).optional(),
    password: z.string().min(PASSWORD_MIN_LENGTH, { error: `Choose a password of at least ${PASSWORD_MIN_LENGTH} characters.` }).max(200, { error: 'Keep the password under 200 characters.' }),
    confirm: z.string(),
  })
  .refine((v) => v.password === v.confirm, { message: 'The two passwords differ; type the same password twice.', path: ['confirm'] });

/**
 * Sets the password through a one-time link and marks the link used, in one transaction with the
 * link's row locked, so a link works exactly once. Expired, used or unknown links change nothing.
 * Setting the password ends the account's open sessions.
 */
export async function setPasswordWithToken(value: string, purpose: TokenPurpose, input: unknown, now = new Date()): Promise<{ email: string }> {
  const parsed = setPasswordSchema.safeParse(input);
  if (!parsed.success) throw new AppError('invalid_input', 'The password was not set; correct the fields marked.', { fieldErrors: parsed.error.flatten().fieldErrors });
  if (purpose === 'invite' && !parsed.data.name) {
    throw new AppError('invalid_input', 'The password was not set; correct the fields marked.', { fieldErrors: { name: ['Enter your name as it should appear on your results.'] } });
  }
  if (!looksLikeToken(value)) throw new AppError('not_found', TOKEN_STATE_MESSAGE.unknown);
  const passwordHash = await hashPassword(parsed.data.password);
  return sequelize.transaction(async (transaction) => {
    const row = await OneTimeToken.findOne({ where: { tokenSha256: hashToken(value), purpose }, transaction, lock: transaction.LOCK.UPDATE });
    const state = tokenState(row, now);
    if (!row || state !== 'valid') throw new AppError(state === 'unknown' ? 'not_found' : 'conflict', TOKEN_STATE_MESSAGE[state === 'valid' ? 'unknown' : state]);
    const account = await User.findByPk(row.userId, { transaction, lock: transaction.LOCK.UPDATE });
    if (!account || !account.isActive) throw new AppError('forbidden', 'This account is deactivated; ask the centre’s admin.');
    const before = { name: account.name, pending: account.passwordHash === null };
    await account.update({ passwordHash, ...(purpose === 'invite' && parsed.data.name ? { name: parsed.data.name } : {}) }, { transaction });
    await row.update({ usedAt: now }, { transaction });
    // Never the hash or the link's token: only that a password is now set, and by which way.
    await writeAudit(transaction, { id: account.id, name: account.name }, {
      objectType: 'account',
      objectId: account.id,
      action: purpose === 'invite' ? 'accept_invitation' : 'password_reset',
      before,
      after: { name: account.name, pending: false, passwordSet: true, sessionsEnded: true },
    });
    // A new password ends every session opened with the old one.
    await endAllSessions(account.id, transaction, now);
    // Any other open link of the same purpose for this account stops working too.
    await OneTimeToken.update({ usedAt: now }, { where: { userId: account.id, purpose, usedAt: null }, transaction });
    return { email: account.email };
  });
}

/** The one answer to every reset request, so the form never reveals whether an account exists. */
export const RESET_REQUESTED_MESSAGE = 'If an account exists for that address, we have sent it a link to choose a new password. The link works once, for 2 hours.';

/** Sends a reset link when an active account with a password exists; silent otherwise. */
export async function requestPasswordReset(rawEmail: unknown, now = new Date()): Promise<void> {
  const parsed = z.string().trim().toLowerCase().email().max(254).safeParse(rawEmail);
  if (!parsed.success) throw new AppError('invalid_input', 'Enter the e-mail address of your account, like name@example.org.', { fieldErrors: { email: ['Enter the e-mail address of your account, like name@example.org.'] } });
  // At most 5 reset mails per address in 15 minutes (the sign-in limiter's counters), silently.
  const keys = [`reset:${parsed.data}`];
  if (await isLocked(keys, now)) return;
  await recordFailure(keys, now);
  const account = await User.findOne({ where: { email: parsed.data } });
  if (!account || !account.isActive) return;
  const value = newTokenValue();
  const expiresAt = tokenExpiry('reset', now);
  await OneTimeToken.create({ tokenSha256: hashToken(value), purpose: 'reset', userId: account.id, cohortId: null, createdById: null, expiresAt });
  try {
    await sendMail({ to: account.email, ...passwordResetMail({ link: `${appBaseUrl()}/reset/${value}`, expiresAt }) });
  } catch {
    // Not shown to the visitor (it would reveal the account); the server log has it.
  }
}
